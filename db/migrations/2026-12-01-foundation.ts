import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<unknown>): Promise<void> {
  await db.schema
    .createTable("users")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("email", "text", (c) => c.notNull().unique())
    .addColumn("name", "text", (c) => c.notNull())
    .addColumn("role", "text", (c) =>
      c.notNull().check(sql`role in ('admin','manager','supervisor','engineer','purchaser','operator')`),
    )
    .addColumn("password_hash", "text")
    .addColumn("active", "integer", (c) => c.notNull().defaultTo(1))
    .addColumn("unit_system", "text", (c) => c.notNull().defaultTo("metric").check(sql`unit_system in ('metric','us')`))
    .addColumn("created_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("sessions")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("user_id", "text", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("expires_at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("sessions_user").on("sessions").column("user_id").execute();

  await db.schema
    .createTable("auth_tokens")
    .addColumn("id", "text", (c) => c.primaryKey())
    .addColumn("user_id", "text", (c) => c.notNull().references("users.id").onDelete("cascade"))
    .addColumn("kind", "text", (c) => c.notNull().check(sql`kind in ('invite','reset')`))
    .addColumn("expires_at", "integer", (c) => c.notNull())
    .addColumn("used_at", "integer")
    .addColumn("created_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("sign_in_failures")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("key", "text", (c) => c.notNull())
    .addColumn("at", "integer", (c) => c.notNull())
    .execute();
  await db.schema.createIndex("sign_in_failures_key_at").on("sign_in_failures").columns(["key", "at"]).execute();

  await db.schema
    .createTable("plant_settings")
    .addColumn("id", "integer", (c) => c.primaryKey().check(sql`id = 1`))
    .addColumn("plant_name", "text", (c) => c.notNull())
    .addColumn("currency", "text", (c) => c.notNull().defaultTo("USD"))
    .addColumn("shift_hours", "real", (c) => c.notNull().defaultTo(8))
    .addColumn("default_unit_system", "text", (c) => c.notNull().defaultTo("metric"))
    .addColumn("updated_at", "integer", (c) => c.notNull())
    .execute();

  await db.schema
    .createTable("mail_outbox")
    .addColumn("id", "integer", (c) => c.primaryKey().autoIncrement())
    .addColumn("from_address", "text", (c) => c.notNull())
    .addColumn("to_addresses", "text", (c) => c.notNull())
    .addColumn("subject", "text", (c) => c.notNull())
    .addColumn("text_body", "text", (c) => c.notNull())
    .addColumn("received_at", "integer", (c) => c.notNull())
    .execute();
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const t of ["mail_outbox", "plant_settings", "sign_in_failures", "auth_tokens", "sessions", "users"]) {
    await db.schema.dropTable(t).execute();
  }
}
