// The plan's reason sentence in the user's units. The API words it in mm and kg; for metric users
// that sentence is shown as is, for US users the same facts are worded here in inches and pounds.

import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import type { RackPlanResult } from "@/app/api/rack/plan/route";
import type { RackPlanRequest } from "@/lib/validation/rack";

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function reasonText(plan: RackPlanResult, input: RackPlanRequest, system: UnitSystem): string {
  if (system === "metric") return plan.reason;
  const len = (mm: number) => formatQuantity("lengthMm", mm, system, 4);
  const kg = (v: number) => formatQuantity("massKg", v, system, 4);
  const { part, carrier, clearanceMm, orientations, orientation } = input;
  if (plan.spaceCount === 0) {
    const which = orientation ? "in the chosen orientation" : orientations === "upright" ? "in every upright orientation" : "in every orientation";
    return `The part (${len(part.lengthMm)} × ${len(part.widthMm)} × ${len(part.heightMm)}) is larger than the ${len(carrier.widthMm)} × ${len(carrier.heightMm)} × ${len(carrier.depthMm)} window ${which}.`;
  }
  if (plan.limitedBy === "load") {
    if (plan.count === 0) {
      return `The ${kg(carrier.maxLoadKg)} load limit is below one part's mass (${kg(part.massKg)}), so the carrier can take none of the ${plan.spaceCount} parts that fit.`;
    }
    return `The ${kg(carrier.maxLoadKg)} load limit allows ${plan.count} of the ${plan.spaceCount} parts that fit.`;
  }
  const [main, ...rest] = plan.blocks;
  const grid = `${main.grid[0]} along travel × ${plural(main.grid[1], "tier", "tiers")} × ${main.grid[2]} across`;
  const clearance = clearanceMm > 0 ? `${len(clearanceMm)} clearance` : "no clearance";
  const head = `Space limits the carrier to ${plural(plan.count, "part", "parts")}`;
  if (rest.length === 0) return `${head}: ${grid}, ${clearance}.`;
  const mainCount = main.grid[0] * main.grid[1] * main.grid[2];
  return `${head}: a main grid of ${grid} (${mainCount}) and ${plan.count - mainCount} more in ${plural(rest.length, "further block", "further blocks")} filling the space left, ${clearance}.`;
}
