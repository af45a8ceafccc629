import { sql, type Kysely } from "kysely";

/*
 * Film checks: dry-film-thickness readings of one coat of a run (areas → spots → readings for
 * SSPC-PA 2, a flat list for ISO 19840, stored as JSON in µm), the gauges used (ASTM D7091
 * type 1 / type 2, with the CSV column mapping remembered per gauge), the other tests of a run
 * (cure, adhesion, appearance, coverage) and a log of every change.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("gauges")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("name", "text", (c) => c.notNull().unique())
    .addColumn("gauge_type", "text", (c) => c.notNull().check(sql`gauge_type in ('type1','type2')`))
    .addColumn("serial", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("verified_at", "integer")
    .addColumn("mapping_json", "text")
    .addColumn("created_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("film_checks")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("run_id", "integer", (c) => c.notNull().references("runs.id").onDelete("cascade"))
    .addColumn("coat_position", "integer", (c) => c.notNull())
    .addColumn("rule", "text", (c) => c.notNull().check(sql`rule in ('sspc-pa2','iso19840')`))
    .addColumn("spec_min_um", "real")
    .addColumn("spec_max_um", "real")
    .addColumn("nominal_um", "real")
    .addColumn("gauge_id", "integer", (c) => c.references("gauges.id").onDelete("set null"))
    .addColumn("readings_json", "text", (c) => c.notNull())
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("film_checks_run").on("film_checks").columns(["run_id", "coat_position"]).execute();

  await db.schema
    .createTable("film_tests")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("run_id", "integer", (c) => c.notNull().references("runs.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('cure','adhesion','appearance','coverage')`))
    .addColumn("data_json", "text", (c) => c.notNull())
    .addColumn("recorded_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("recorded_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("film_tests_run").on("film_tests").column("run_id").execute();

  await db.schema
    .createTable("film_check_log")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("run_id", "integer", (c) => c.notNull())
    .addColumn("entity", "text", (c) => c.notNull())
    .addColumn("entity_id", "integer", (c) => c.notNull())
    .addColumn("action", "text", (c) => c.notNull())
    .addColumn("user_id", "text")
    .addColumn("at", "integer", (c) => c.notNull())
    .addColumn("old_json", "text")
    .addColumn("new_json", "text")
    .execute();
  await db.schema.createIndex("film_check_log_run").on("film_check_log").column("run_id").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("film_check_log").execute();
  await db.schema.dropTable("film_tests").execute();
  await db.schema.dropTable("film_checks").execute();
  await db.schema.dropTable("gauges").execute();
}
