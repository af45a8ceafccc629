import Link from "next/link";
import { notFound } from "next/navigation";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { templateCatalogue } from "@/lib/server/parts";
import { PartDetail } from "@/components/parts/part-detail";

export const metadata = { title: "Part" };

export default async function PartPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/parts">← Parts</Link>
      </nav>
      <PartDetail id={id} unitSystem={user.unitSystem} canEdit={hasRole(user, ["engineer"])} templates={templateCatalogue()} />
    </div>
  );
}
