import { sql, type Kysely } from "kysely";

/*
 * Oven profiles: data loggers with their remembered column mapping, measured metal-temperature
 * profiles (the mapped series kept as JSON), and the history of heat-transfer coefficients fitted
 * from them and stored on an oven.
 *
 * A profile points at its oven by line id and stage position, not by line_stages.id: saving a
 * line rewrites its stage rows, and a measurement must outlive that. The stage name is kept as it
 * was at import so a later change of the stage list is noticed. A batch oven has no stages: its
 * position is null. run_id is plain text with no foreign key (runs are another capability).
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("loggers")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("name", "text", (c) => c.notNull().unique())
    .addColumn("mapping_json", "text", (c) => c.notNull())
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("oven_profiles")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("line_id", "integer", (c) => c.notNull().references("lines.id"))
    .addColumn("stage_position", "integer")
    .addColumn("stage_name", "text", (c) => c.notNull())
    .addColumn("coating_id", "integer", (c) => c.notNull().references("coatings.id"))
    .addColumn("run_id", "text")
    .addColumn("logger_id", "integer", (c) => c.references("loggers.id").onDelete("set null"))
    .addColumn("file_name", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("measured_on", "text")
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("overbake_margin_k", "real", (c) => c.notNull().check(sql`overbake_margin_k >= 0`))
    .addColumn("sample_count", "integer", (c) => c.notNull())
    .addColumn("duration_s", "real", (c) => c.notNull())
    .addColumn("probe_count", "integer", (c) => c.notNull())
    .addColumn("mapping_json", "text", (c) => c.notNull())
    .addColumn("series_json", "text", (c) => c.notNull())
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("oven_profiles_line").on("oven_profiles").columns(["line_id", "stage_position"]).execute();

  await db.schema
    .createTable("heat_transfer_fits")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("line_id", "integer", (c) => c.notNull().references("lines.id"))
    .addColumn("stage_position", "integer")
    .addColumn("stage_name", "text", (c) => c.notNull())
    .addColumn("profile_id", "integer", (c) => c.references("oven_profiles.id").onDelete("set null"))
    .addColumn("profile_name", "text", (c) => c.notNull())
    .addColumn("probe_label", "text", (c) => c.notNull())
    .addColumn("thickness_mm", "real", (c) => c.notNull())
    .addColumn("h_before_w_per_m2k", "real")
    .addColumn("h_after_w_per_m2k", "real", (c) => c.notNull().check(sql`h_after_w_per_m2k > 0`))
    .addColumn("rms_k", "real", (c) => c.notNull())
    .addColumn("applied_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("applied_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("heat_transfer_fits_stage").on("heat_transfer_fits").columns(["line_id", "stage_position"]).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of ["heat_transfer_fits", "oven_profiles", "loggers"]) {
    await db.schema.dropTable(t).execute();
  }
}
