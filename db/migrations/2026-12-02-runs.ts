import { sql, type Kysely } from "kysely";

/*
 * Runs: one part × quantity on a line, on a day (epoch seconds at 00:00 UTC) and shift, with its
 * racking choices, and its coats in order (run_coats.position). `sequence` is the order on the
 * line's day board. Coatings, lines and parts used by a run cannot be deleted under it.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("runs")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("part_id", "text", (c) => c.notNull().references("parts.id").onDelete("restrict"))
    .addColumn("quantity", "integer", (c) => c.notNull().check(sql`quantity >= 1`))
    .addColumn("line_id", "integer", (c) => c.notNull().references("lines.id").onDelete("restrict"))
    .addColumn("run_date", "integer", (c) => c.notNull())
    .addColumn("shift", "integer", (c) => c.notNull().check(sql`shift between 1 and 3`))
    .addColumn("sequence", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("line_speed_m_per_min", "real")
    .addColumn("clearance_mm", "real", (c) => c.notNull().check(sql`clearance_mm >= 0`))
    .addColumn("orientations", "text", (c) => c.notNull().check(sql`orientations in ('any','upright')`))
    .addColumn("orientation_json", "text")
    .addColumn("parts_per_carrier_override", "integer", (c) => c.check(sql`parts_per_carrier_override >= 1`))
    .addColumn("masking", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("status", "text", (c) =>
      c.notNull().defaultTo("draft").check(sql`status in ('draft','planned','in-progress','done','cancelled')`),
    )
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("runs_line_day").on("runs").columns(["line_id", "run_date", "shift", "sequence"]).execute();
  await db.schema.createIndex("runs_day").on("runs").column("run_date").execute();
  await db.schema.createIndex("runs_part").on("runs").column("part_id").execute();

  await db.schema
    .createTable("run_coats")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("run_id", "integer", (c) => c.notNull().references("runs.id").onDelete("cascade"))
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("coating_id", "integer", (c) => c.notNull().references("coatings.id").onDelete("restrict"))
    .addColumn("film_um", "real", (c) => c.notNull().check(sql`film_um > 0`))
    .addColumn("first_pass_efficiency", "real", (c) => c.check(sql`first_pass_efficiency > 0 and first_pass_efficiency <= 1`))
    .addColumn("reclaim_efficiency", "real", (c) => c.check(sql`reclaim_efficiency >= 0 and reclaim_efficiency <= 1`))
    .addUniqueConstraint("run_coats_position", ["run_id", "position"])
    .execute();
  await db.schema.createIndex("run_coats_coating").on("run_coats").column("coating_id").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("run_coats").execute();
  await db.schema.dropTable("runs").execute();
}
