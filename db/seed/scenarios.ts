import type { Db } from "../index";

/*
 * Two invented what-if scenarios on Bramblecote's conveyor lines, made by the demo manager for
 * the reference bench end frame (2 mm steel, figures entered by hand) in the gloss green powder.
 * Seeded after the lines, coatings and users; a line or coating that is missing is skipped.
 */
const part = {
  part_area_m2: 0.8,
  part_inside_area_m2: 0,
  part_mass_kg: 6.5,
  part_thickness_mm: 2,
  part_length_mm: 450,
  part_width_mm: 60,
  part_height_mm: 700,
};

const scenarios = [
  // Faster than the 3 m/min nominal: does the powder oven still cure a 2 mm section?
  { name: "Line 1 at 3.5 m/min", line: "Line 1 — E-coat and powder", overrides: { lineSpeedMPerMin: 3.5 } },
  // A 12 m oven extension so the cure no longer holds the line below its top speed.
  { name: "Line 2 with longer oven", line: "Line 2 — Powder only", overrides: { ovenLengthM: 66 } },
];

export async function seedScenarios(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<void> {
  const manager = await db.selectFrom("users").select("id").where("role", "=", "manager").orderBy("created_at").executeTakeFirst();
  const coating = await db.selectFrom("coatings").select("id").where("code", "=", "PP-410").executeTakeFirst();
  for (const s of scenarios) {
    const line = await db.selectFrom("lines").select("id").where("name", "=", s.line).executeTakeFirst();
    if (!line) continue;
    await db
      .insertInto("scenarios")
      .values({
        name: s.name,
        line_id: line.id,
        overrides_json: JSON.stringify(s.overrides),
        part_id: null,
        ...part,
        coating_id: coating?.id ?? null,
        created_by: manager?.id ?? null,
        created_at: nowS,
        updated_at: nowS,
        archived: 0,
      })
      .execute();
  }
}
