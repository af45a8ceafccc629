import type { Db } from "../index";
import type { RackPlansTable } from "../schema";
// Pure racking code (no server code): the stored counts are planned, not typed.
import { orientationFromCode, type OrientationCode } from "../../lib/rack/orientation-code";
import { planRack } from "../../lib/rack/plan";

/*
 * Two saved racking plans for the demo. The bike-rack hoops on Line 2 keep the planner's best
 * with the clearance today's run uses (so that run reads "from saved racking plan" and its
 * numbers do not move); the trailer fenders in the batch oven are set by hand to hang on edge
 * from their mounting holes, fewer per rack than the planner's best. Parts and lines are looked
 * up by number and name; a plan whose part or line is missing is skipped.
 */
interface SeedPlan {
  part: string;
  line: string;
  clearanceMm: number;
  orientations: "any" | "upright";
  orientationOverride: OrientationCode | null;
  note: string;
  by: "engineer" | "supervisor";
}

const plans: SeedPlan[] = [
  {
    part: "BC-5020",
    line: "Line 2 — Powder only",
    clearanceMm: 60,
    orientations: "upright",
    orientationOverride: null,
    note: "Hoops hang from the top bend on one hook each; 60 mm keeps the guns' fan off the neighbour.",
    by: "engineer",
  },
  {
    part: "BC-2210",
    line: "Batch oven B — gas",
    clearanceMm: 50,
    orientations: "upright",
    orientationOverride: "width-height-length",
    note: "On edge from the two mounting holes so rinse water drains off the flange.",
    by: "supervisor",
  },
];

export async function seedRackPlans(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<number> {
  const [parts, lines, users] = await Promise.all([
    db.selectFrom("parts").select(["id", "number", "length_mm", "width_mm", "height_mm", "mass_kg"]).where("archived", "=", 0).execute(),
    db.selectFrom("lines").select(["id", "name", "window_width_mm", "window_height_mm", "window_depth_mm", "max_load_kg"]).where("archived_at", "is", null).execute(),
    db.selectFrom("users").select(["id", "role"]).where("role", "in", ["engineer", "supervisor"]).execute(),
  ]);
  let made = 0;
  for (const p of plans) {
    const part = parts.find((x) => x.number === p.part);
    const line = lines.find((x) => x.name === p.line);
    if (!part || !line) continue;
    const box = { lengthMm: part.length_mm, widthMm: part.width_mm, heightMm: part.height_mm };
    const plan = planRack({
      part: { ...box, massKg: part.mass_kg },
      carrier: { widthMm: line.window_width_mm, heightMm: line.window_height_mm, depthMm: line.window_depth_mm, maxLoadKg: line.max_load_kg },
      clearanceMm: p.clearanceMm,
      orientations: p.orientations,
      ...(p.orientationOverride ? { orientation: orientationFromCode(box, p.orientationOverride) } : {}),
    });
    if (plan.count === 0) continue;
    const userId = users.find((u) => u.role === p.by)?.id ?? null;
    const row: Omit<RackPlansTable, "id"> = {
      part_id: part.id,
      line_id: line.id,
      clearance_mm: p.clearanceMm,
      orientations: p.orientations,
      orientation_override: p.orientationOverride,
      note: p.note,
      parts_per_carrier: plan.count,
      space_count: plan.spaceCount,
      limited_by: plan.limitedBy,
      created_by: userId,
      updated_by: userId,
      created_at: nowS,
      updated_at: nowS,
    };
    await db.insertInto("rack_plans").values(row).execute();
    made += 1;
  }
  return made;
}
