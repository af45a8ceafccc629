import { sql, type Kysely } from "kysely";

/*
 * Purchasing and the actual-use feedback loop: purchase requests to a supplier (one per supplier
 * e-mail) with their lines, and the material actually used per powder coat of a done run.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("purchase_requests")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("reference", "text", (c) => c.notNull().unique())
    .addColumn("supplier_name", "text", (c) => c.notNull())
    .addColumn("supplier_email", "text", (c) => c.notNull())
    .addColumn("status", "text", (c) => c.notNull().check(sql`status in ('sent','confirmed','received','cancelled')`))
    .addColumn("sent_at", "integer", (c) => c.notNull())
    .addColumn("confirmed_at", "integer")
    .addColumn("received_at", "integer")
    .addColumn("cancelled_at", "integer")
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema
    .createTable("purchase_request_lines")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("request_id", "integer", (c) => c.notNull().references("purchase_requests.id").onDelete("cascade"))
    .addColumn("coating_id", "integer", (c) => c.notNull().references("coatings.id").onDelete("restrict"))
    .addColumn("containers", "integer", (c) => c.notNull().check(sql`containers >= 1`))
    .addColumn("container_kg", "real", (c) => c.notNull().check(sql`container_kg > 0`))
    .addColumn("lead_time_days", "integer", (c) => c.notNull())
    .addColumn("received_kg", "real", (c) => c.notNull().defaultTo(0))
    .execute();
  await db.schema.createIndex("purchase_request_lines_request").on("purchase_request_lines").column("request_id").execute();
  await db.schema.createIndex("purchase_request_lines_coating").on("purchase_request_lines").column("coating_id").execute();

  await db.schema
    .createTable("material_usage")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("run_id", "integer", (c) => c.notNull().references("runs.id").onDelete("cascade"))
    .addColumn("coat_index", "integer", (c) => c.notNull())
    .addColumn("line_id", "integer", (c) => c.notNull())
    .addColumn("coating_id", "integer", (c) => c.notNull().references("coatings.id").onDelete("restrict"))
    .addColumn("parts_coated", "integer", (c) => c.notNull().check(sql`parts_coated >= 0`))
    .addColumn("kg_used", "real", (c) => c.notNull().check(sql`kg_used > 0`))
    .addColumn("area_m2", "real", (c) => c.notNull())
    .addColumn("film_um", "real", (c) => c.notNull())
    .addColumn("film_measured", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("utilisation", "real", (c) => c.notNull())
    .addColumn("excluded", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("recorded_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("recorded_at", "integer", (c) => c.notNull())
    .addUniqueConstraint("material_usage_run_coat", ["run_id", "coat_index"])
    .execute();
  await db.schema.createIndex("material_usage_line_coating").on("material_usage").columns(["line_id", "coating_id"]).execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("material_usage").execute();
  await db.schema.dropTable("purchase_request_lines").execute();
  await db.schema.dropTable("purchase_requests").execute();
}
