import { sql, type Kysely } from "kysely";

/*
 * How a part's mass was found: "volume" (metal volume × density: a closed mesh or a template),
 * "sheet" (half the surface × section thickness × density, for thin-walled parts with no volume)
 * or "entered" (typed or weighed). The edit form needs it to keep a weighed mass as it was.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .alterTable("parts")
    .addColumn("mass_origin", "text", (c) => c.notNull().defaultTo("entered").check(sql`mass_origin in ('volume','sheet','entered')`))
    .execute();
  await db.schema.createIndex("parts_mesh_id").on("parts").column("mesh_id").execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropIndex("parts_mesh_id").execute();
  await db.schema.alterTable("parts").dropColumn("mass_origin").execute();
}
