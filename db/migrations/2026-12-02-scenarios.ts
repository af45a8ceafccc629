import { sql, type Kysely } from "kysely";

/*
 * Saved what-if scenarios for the throughput comparison: a line with some of its figures changed
 * (overrides_json, validated by lib/validation/scenarios.ts before it is written), and optionally
 * the part and powder it was made for — a part from the catalogue, or one entered by hand
 * (the part_* columns). A line used by a live scenario cannot be archived.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("scenarios")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("line_id", "integer", (c) => c.notNull().references("lines.id"))
    .addColumn("overrides_json", "text", (c) => c.notNull().defaultTo("{}").check(sql`json_valid(overrides_json)`))
    .addColumn("part_id", "text", (c) => c.references("parts.id").onDelete("set null"))
    .addColumn("part_area_m2", "real")
    .addColumn("part_inside_area_m2", "real")
    .addColumn("part_mass_kg", "real")
    .addColumn("part_thickness_mm", "real")
    .addColumn("part_length_mm", "real")
    .addColumn("part_width_mm", "real")
    .addColumn("part_height_mm", "real")
    .addColumn("coating_id", "integer", (c) => c.references("coatings.id"))
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .addColumn("archived", "integer", (c) => c.notNull().defaultTo(0).check(sql`archived in (0, 1)`))
    .execute();
  // Names are unique among live scenarios (case-insensitive); a deleted one frees its name.
  await sql`create unique index scenarios_live_name on scenarios (name collate nocase) where archived = 0`.execute(db);
  await db.schema.createIndex("scenarios_line_id").on("scenarios").column("line_id").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("scenarios").execute();
}
