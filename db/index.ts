import fs from "node:fs";
import path from "node:path";
import BetterSqlite3 from "better-sqlite3";
import { Kysely, Migrator, SqliteDialect } from "kysely";
import type { Database } from "./schema";
import { migrationProvider } from "./migrations/registry";

export type Db = Kysely<Database>;

interface Handle {
  path: string;
  sqlite: BetterSqlite3.Database;
  db: Db;
  ready: Promise<void>;
}

// One handle per process. Kept on globalThis because Next bundles instrumentation and routes
// separately (and dev reloads modules); two handles on one file would defeat WAL locking.
const globalKey = Symbol.for("coatwright.db");
type GlobalWithDb = typeof globalThis & { [globalKey]?: Handle };

export function databasePath(): string {
  return path.resolve(/*turbopackIgnore: true*/ process.env.DATABASE_PATH || "./data/coatwright.db");
}

/** Opens (once) the SQLite file with WAL, foreign keys and a busy timeout. Never called at import. */
export function openDatabase(file = databasePath()): Handle {
  const g = globalThis as GlobalWithDb;
  const existing = g[globalKey];
  if (existing && existing.path === file) return existing;
  if (existing) closeDatabase();
  fs.mkdirSync(/*turbopackIgnore: true*/ path.dirname(file), { recursive: true });
  const sqlite = new BetterSqlite3(file);
  sqlite.pragma("journal_mode = WAL");
  sqlite.pragma("foreign_keys = ON");
  sqlite.pragma("busy_timeout = 5000");
  sqlite.pragma("synchronous = NORMAL");
  const db = new Kysely<Database>({ dialect: new SqliteDialect({ database: sqlite }) });
  const handle: Handle = { path: file, sqlite, db, ready: migrate(db).then(() => undefined) };
  g[globalKey] = handle;
  return handle;
}

export async function migrate(db: Db): Promise<string[]> {
  const migrator = new Migrator({ db, provider: migrationProvider });
  const { error, results } = await migrator.migrateToLatest();
  if (error) throw error instanceof Error ? error : new Error(String(error));
  return (results ?? []).filter((r) => r.status === "Success").map((r) => r.migrationName);
}

/** The migrated Kysely instance. */
export async function getDb(): Promise<Db> {
  const handle = openDatabase();
  await handle.ready;
  return handle.db;
}

/** The raw better-sqlite3 handle (for lucia's adapter and online backups). */
export async function getSqlite(): Promise<BetterSqlite3.Database> {
  const handle = openDatabase();
  await handle.ready;
  return handle.sqlite;
}

export function closeDatabase(): void {
  const g = globalThis as GlobalWithDb;
  const handle = g[globalKey];
  if (!handle) return;
  g[globalKey] = undefined;
  handle.sqlite.close();
}
