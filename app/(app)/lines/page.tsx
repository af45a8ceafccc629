import { requirePageUser, hasRole } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { LinesListView } from "@/components/lines/lines-list";

export const metadata = { title: "Lines" };

export default async function LinesPage() {
  const user = await requirePageUser();
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <div>
        <h1>Lines</h1>
        <p className="mt-1 text-sm text-ink-soft">Conveyor lines with their stages and ovens, and batch ovens. Open a line for its timeline and a cure check.</p>
      </div>
      <LinesListView unitSystem={user.unitSystem} currency={plant.currency} canEdit={hasRole(user, ["manager"])} />
    </div>
  );
}
