import { requirePageUser, hasRole } from "@/lib/server/guard";
import { plantSettings } from "@/lib/server/plant";
import { RackingPlanner } from "@/components/racking/racking-planner";
import { formatQuantity, unitLabel } from "@/lib/coating-math/display-units";

export const metadata = { title: "Racking" };

// Every role may plan and read saved plans; engineers and supervisors (and admin) save them, as
// the access table for /api/rack/plans says.
export default async function RackingPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await requirePageUser();
  const plant = await plantSettings();
  const line = (await searchParams).line;
  const initialLineId = typeof line === "string" && /^\d{1,12}$/.test(line) ? Number(line) : null;
  return (
    <div className="space-y-4">
      <div>
        <h1>Racking</h1>
        <p className="mt-1 max-w-3xl text-sm text-ink-soft">
          How many parts fit on one carrier or rack, in which orientation, with the clearance you need and within the load
          limit. Each part counts as its bounding box; the window is the usable space inside the carrier. Take a part from the
          catalogue and a window from a line to save the plan for them: runs of that part on that line then use it.
        </p>
      </div>
      <RackingPlanner
        unitSystem={user.unitSystem}
        shiftHours={plant.shiftHours}
        canSave={hasRole(user, ["engineer", "supervisor"])}
        initialLineId={initialLineId}
      />
      {/* Static, so rendered here on the server: no JavaScript for it in the page's first load. */}
      <aside className="rounded-lg border border-caution-edge bg-caution-light p-4 text-sm text-ink" role="note" aria-labelledby="rack-safety-h">
        <h2 id="rack-safety-h" className="text-base">Safety</h2>
        <p className="mt-1">
          The load limit is the carrier&apos;s and its hooks&apos; rated load: never hang more, and remember that hooks and racks
          gain weight as cured coating builds up on them. Parts leave a cure oven hot (around{" "}
          {formatQuantity("temperatureC", 200, user.unitSystem)}) and stay hot well after: unload with heat-resistant gloves and
          only after the cool-down your plant sets. Follow your plant&apos;s own procedures and local codes.
        </p>
        <p className="mt-1 text-xs text-ink-soft">
          Sizes are in {unitLabel("lengthMm", user.unitSystem)}, masses in {unitLabel("massKg", user.unitSystem)}.
        </p>
      </aside>
    </div>
  );
}
