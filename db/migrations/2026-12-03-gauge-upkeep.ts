import type { Kysely } from "kysely";

/*
 * Gauge upkeep: how often each gauge must be verified (the plant's own choice, 12 months unless
 * it sets another) and a retirement date, so a gauge that film checks name is archived rather than
 * deleted and those records keep their gauge.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .alterTable("gauges")
    .addColumn("verify_interval_months", "integer", (c) => c.notNull().defaultTo(12))
    .execute();
  await db.schema.alterTable("gauges").addColumn("retired_at", "integer").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable("gauges").dropColumn("retired_at").execute();
  await db.schema.alterTable("gauges").dropColumn("verify_interval_months").execute();
}
