import { sql, type Kysely } from "kysely";

/*
 * Coatings library (with cure schedule points and stock lots) and finishing lines (conveyor
 * lines with their ordered stages, batch ovens). Metric values, unit in every column name;
 * dates of lots are epoch seconds at 00:00 UTC of the day.
 */
export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("coatings")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("code", "text", (c) => c.notNull().unique())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('powder','e-coat')`))
    .addColumn("chemistry", "text", (c) => c.notNull())
    .addColumn("colour_name", "text", (c) => c.notNull())
    .addColumn("swatch_hex", "text", (c) => c.notNull())
    .addColumn("specific_gravity", "real")
    .addColumn("volume_solids_fraction", "real")
    .addColumn("weight_solids_fraction", "real")
    .addColumn("film_density_g_per_cm3", "real")
    .addColumn("film_min_um", "real", (c) => c.notNull())
    .addColumn("film_max_um", "real", (c) => c.notNull())
    .addColumn("price_per_kg", "real", (c) => c.notNull())
    .addColumn("container_kind", "text", (c) => c.notNull().check(sql`container_kind in ('box','drum')`))
    .addColumn("container_kg", "real", (c) => c.notNull())
    .addColumn("supplier_name", "text", (c) => c.notNull())
    .addColumn("supplier_email", "text", (c) => c.notNull())
    .addColumn("lead_time_days", "integer", (c) => c.notNull())
    .addColumn("shelf_life_months", "integer", (c) => c.notNull())
    .addColumn("reorder_point_kg", "real", (c) => c.notNull().defaultTo(0))
    .addColumn("archived_at", "integer")
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("coating_cure_points")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("coating_id", "integer", (c) => c.notNull().references("coatings.id").onDelete("cascade"))
    .addColumn("metal_temp_c", "real", (c) => c.notNull())
    .addColumn("hold_min", "real", (c) => c.notNull().check(sql`hold_min >= 0`))
    .addUniqueConstraint("coating_cure_points_temp", ["coating_id", "metal_temp_c"])
    .execute();

  await db.schema
    .createTable("coating_lots")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("coating_id", "integer", (c) => c.notNull().references("coatings.id").onDelete("cascade"))
    .addColumn("lot_number", "text", (c) => c.notNull())
    .addColumn("received_at", "integer", (c) => c.notNull())
    .addColumn("expires_at", "integer", (c) => c.notNull())
    .addColumn("kg_on_hand", "real", (c) => c.notNull().check(sql`kg_on_hand >= 0`))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addUniqueConstraint("coating_lots_number", ["coating_id", "lot_number"])
    .execute();

  await db.schema
    .createTable("lines")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("name", "text", (c) => c.notNull().unique())
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('conveyor','batch')`))
    .addColumn("notes", "text", (c) => c.notNull().defaultTo(""))
    .addColumn("hourly_cost", "real", (c) => c.notNull())
    // the usable window of one carrier (conveyor) or one rack (batch oven), and its load limit
    .addColumn("window_width_mm", "real", (c) => c.notNull())
    .addColumn("window_height_mm", "real", (c) => c.notNull())
    .addColumn("window_depth_mm", "real", (c) => c.notNull())
    .addColumn("max_load_kg", "real", (c) => c.notNull())
    // conveyor lines
    .addColumn("line_speed_min_m_per_min", "real")
    .addColumn("line_speed_max_m_per_min", "real")
    .addColumn("line_speed_nominal_m_per_min", "real")
    .addColumn("carrier_pitch_m", "real")
    // batch ovens
    .addColumn("interior_width_mm", "real")
    .addColumn("interior_height_mm", "real")
    .addColumn("interior_depth_mm", "real")
    .addColumn("racks_per_load", "integer")
    .addColumn("air_temp_c", "real")
    .addColumn("heat_transfer_coefficient_w_per_m2k", "real")
    .addColumn("load_min", "real")
    .addColumn("unload_min", "real")
    .addColumn("archived_at", "integer")
    .addColumn("created_at", "integer", (c) => c.notNull())
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("line_stages")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("line_id", "integer", (c) => c.notNull().references("lines.id").onDelete("cascade"))
    .addColumn("position", "integer", (c) => c.notNull())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("kind", "text", (c) =>
      c
        .notNull()
        .check(sql`kind in ('clean','rinse','conversion','e-coat','dry-off','powder-booth','cure-oven','cool')`),
    )
    .addColumn("length_m", "real", (c) => c.notNull().check(sql`length_m > 0`))
    .addColumn("temp_c", "real")
    .addColumn("heat_transfer_coefficient_w_per_m2k", "real")
    .addColumn("colour_change_min", "real")
    .addUniqueConstraint("line_stages_position", ["line_id", "position"])
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of ["line_stages", "lines", "coating_lots", "coating_cure_points", "coatings"]) {
    await db.schema.dropTable(t).execute();
  }
}
