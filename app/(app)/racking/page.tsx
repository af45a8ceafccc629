import { requirePageUser } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { RackingPlanner } from "@/components/racking/racking-planner";

export const metadata = { title: "Racking" };

// Every role may plan: it reads and stores nothing (saved plans per part and line come later).
export default async function RackingPage() {
  const user = await requirePageUser();
  const plant = await plantSettings();
  return (
    <div className="space-y-4">
      <div>
        <h1>Racking</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          How many parts fit on one carrier or rack, in which orientation, with the clearance you need and within the load
          limit. Each part counts as its bounding box; the window is the usable space inside the carrier.
        </p>
      </div>
      <RackingPlanner unitSystem={user.unitSystem} shiftHours={plant.shiftHours} />
    </div>
  );
}
