import type { Kysely } from "kysely";

/*
 * A run's plan is frozen when the run starts (or is cancelled): plan_json keeps the figures the
 * floor worked to (carriers, line time, material, cost at that day's prices), so later edits of
 * the line, coatings, prices or the part no longer rewrite a run that was hung and coated.
 * Null: the run is planned when it is read (draft, planned, or never frozen).
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable("runs").addColumn("plan_json", "text").execute();
  await db.schema.alterTable("runs").addColumn("plan_frozen_at", "integer").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.alterTable("runs").dropColumn("plan_frozen_at").execute();
  await db.schema.alterTable("runs").dropColumn("plan_json").execute();
}
