import Link from "next/link";
import { recordOrNotFound, requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { getRun } from "@/lib/server/runs";
import { RunSheet } from "@/components/runs/run-sheet";
import "@/components/ui/print-sheet.css";
import "@/components/runs/run-sheet.css";

export const metadata = { title: "Run sheet" };

export default async function RunSheetRoute({ params }: { params: Promise<{ id: string }> }) {
  const user = await requirePageUser();
  const { id } = await params;
  const run = await recordOrNotFound(id, (runId) => getRun(runId, user.unitSystem));
  const plant = await plantSettings();
  return (
    <div className="space-y-3">
      <nav aria-label="Breadcrumb" className="no-print text-sm">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/runs/${run.id}`}>← Run {run.id}</Link>
      </nav>
      {run.plan && run.part ? (
        <RunSheet run={run} plan={run.plan} unitSystem={user.unitSystem} plantName={plant.plantName} printedAt={new Date().toISOString().slice(0, 16).replace("T", " ") + " UTC"} />
      ) : (
        <p role="alert" className="card text-oxide">
          This run no longer plans ({run.planError?.message ?? "its part is missing"}), so it has no run sheet. Edit the run first.
        </p>
      )}
    </div>
  );
}
