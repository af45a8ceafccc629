import Link from "next/link";
import { recordOrNotFound, requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { getRackPlan } from "@/lib/server/rack-plans";
import { RackPlanSheet, utcText } from "@/components/racking/rack-plan-sheet";
import "@/components/ui/print-sheet.css";
import "@/components/racking/rack-plan-sheet.css";

export const metadata = { title: "Racking plan" };

// Every signed-in role reads it: operators print it for the line.
export default async function RackPlanPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  const plan = await recordOrNotFound(id, getRackPlan);
  const plant = await plantSettings();
  return (
    <div className="space-y-3">
      <nav aria-label="Breadcrumb" className="no-print text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href="/racking">
          ← Racking
        </Link>
      </nav>
      <RackPlanSheet plan={plan} unitSystem={user.unitSystem} plantName={plant.plantName} printedAt={utcText(Math.floor(Date.now() / 1000))} />
    </div>
  );
}
