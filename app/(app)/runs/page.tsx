import { hasRole, requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { partsForRunForm } from "@/lib/server/runs";
import { RunsPage } from "@/components/runs/runs-page";

export const metadata = { title: "Runs" };

export default async function RunsRoute() {
  const user = await requirePageUser();
  const canPlan = hasRole(user, ["supervisor"]);
  const [plant, parts] = await Promise.all([plantSettings(), canPlan ? partsForRunForm() : Promise.resolve([])]);
  return (
    <div className="space-y-4">
      <div>
        <h1>Runs</h1>
        <p className="mt-1 text-sm text-ink-soft">
          A run is one part × quantity with its coats in order, on a line, on a day and shift: carriers, line time, cure, material and
          cost are worked out from the part, the line and the coatings.
        </p>
      </div>
      <RunsPage parts={parts} unitSystem={user.unitSystem} currency={plant.currency} canPlan={canPlan} />
    </div>
  );
}
