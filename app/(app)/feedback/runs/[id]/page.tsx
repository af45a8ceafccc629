import Link from "next/link";
import { notFound } from "next/navigation";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { ActualUsePanel } from "@/components/feedback/actual-use-panel";

export const metadata = { title: "Actual use" };

export default async function ActualUseRoute({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  if (!/^\d{1,12}$/.test(id)) notFound();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/runs/${id}`}>← Run {id}</Link>
      </nav>
      <h1>Actual use: run {id}</h1>
      <ActualUsePanel runId={Number(id)} unitSystem={user.unitSystem} canRecord={hasRole(user, ["operator", "supervisor"])} />
    </div>
  );
}
