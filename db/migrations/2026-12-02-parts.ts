import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("meshes")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("file_name", "text", (c) => c.notNull())
    .addColumn("stored_name", "text", (c) => c.notNull())
    .addColumn("unit", "text", (c) => c.notNull().check(sql`unit in ('mm','in')`))
    .addColumn("size_bytes", "integer", (c) => c.notNull())
    .addColumn("format", "text", (c) => c.notNull().check(sql`format in ('binary','ascii')`))
    .addColumn("triangle_count", "integer", (c) => c.notNull())
    .addColumn("area_m2", "real", (c) => c.notNull())
    .addColumn("volume_m3", "real", (c) => c.notNull())
    .addColumn("bbox_x_mm", "real", (c) => c.notNull())
    .addColumn("bbox_y_mm", "real", (c) => c.notNull())
    .addColumn("bbox_z_mm", "real", (c) => c.notNull())
    .addColumn("closed", "integer", (c) => c.notNull())
    .addColumn("created_by", "text", (c) => c.references("users.id").onDelete("set null"))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("parts")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("number", "text", (c) => c.notNull().unique())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("customer", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("material", "text", (c) => c.notNull().check(sql`material in ('steel','stainless','aluminium','other')`))
    .addColumn("density_kg_per_m3", "real", (c) => c.notNull())
    .addColumn("thickness_mm", "real", (c) => c.notNull())
    .addColumn("mass_kg", "real", (c) => c.notNull())
    .addColumn("area_m2", "real", (c) => c.notNull())
    .addColumn("inside_area_m2", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("masked_area_m2", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("area_origin", "text", (c) => c.notNull().check(sql`area_origin in ('mesh','template','formula','manual')`))
    .addColumn("template_id", "text")
    .addColumn("dimensions_json", "text")
    .addColumn("formula", "text")
    .addColumn("length_mm", "real", (c) => c.notNull())
    .addColumn("width_mm", "real", (c) => c.notNull())
    .addColumn("height_mm", "real", (c) => c.notNull())
    .addColumn("mesh_id", "text", (c) => c.references("meshes.id").onDelete("set null"))
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("archived", "integer", (c) => c.notNull().defaultTo(0))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await db.schema.dropTable("parts").execute();
  await db.schema.dropTable("meshes").execute();
}
