import { sql, type Kysely } from "kysely";

/*
 * Saved racking plans: one per part × line. The plan keeps the choices (clearance, orientation
 * mode, an orientation set by hand as plain words such as "length-height-width" — what lies along
 * travel, up, across — or null for the planner's best) and, so lists need not plan again, the
 * count, the space-only count and what limited it when it was last saved. Parts and lines are
 * archived rather than deleted; were one deleted, its plans would go with it.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("rack_plans")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("part_id", "text", (c) => c.notNull().references("parts.id").onDelete("cascade"))
    .addColumn("line_id", "integer", (c) => c.notNull().references("lines.id").onDelete("cascade"))
    .addColumn("clearance_mm", "real", (c) => c.notNull().check(sql`clearance_mm >= 0`))
    .addColumn("orientations", "text", (c) => c.notNull().check(sql`orientations in ('any','upright')`))
    .addColumn("orientation_override", "text", (c) =>
      c.check(
        sql`orientation_override in ('length-height-width','width-height-length','length-width-height','width-length-height','height-width-length','height-length-width')`,
      ),
    )
    .addColumn("note", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("parts_per_carrier", "integer", (c) => c.notNull().check(sql`parts_per_carrier >= 0`))
    .addColumn("space_count", "integer", (c) => c.notNull().check(sql`space_count >= 0`))
    .addColumn("limited_by", "text", (c) => c.notNull().check(sql`limited_by in ('space','load')`))
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("updated_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .addUniqueConstraint("rack_plans_part_line", ["part_id", "line_id"])
    .execute();
  await db.schema.createIndex("rack_plans_line").on("rack_plans").column("line_id").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("rack_plans").execute();
}
