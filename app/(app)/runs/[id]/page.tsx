import Link from "next/link";
import { notFound } from "next/navigation";
import { hasRole, requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { partsForRunForm } from "@/lib/server/runs";
import { RunDetailView } from "@/components/runs/run-detail";

export const metadata = { title: "Run" };

export default async function RunRoute({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  if (!/^\d{1,12}$/.test(id)) notFound();
  const canPlan = hasRole(user, ["supervisor"]);
  const [plant, parts] = await Promise.all([plantSettings(), canPlan ? partsForRunForm() : Promise.resolve([])]);
  return (
    <div className="space-y-4">
      <nav aria-label="Breadcrumb" className="text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/runs">← Runs</Link>
      </nav>
      <RunDetailView id={Number(id)} parts={parts} unitSystem={user.unitSystem} currency={plant.currency} canPlan={canPlan} />
    </div>
  );
}
