import type { Insertable, Selectable } from "kysely";
import type { Db } from "../index";
import type { HeatTransferFitsTable, LoggersTable, OvenProfilesTable } from "../schema";

export type LoggerRow = Selectable<LoggersTable>;
export type ProfileRow = Selectable<OvenProfilesTable>;
export type NewProfileRow = Insertable<OvenProfilesTable>;
export type FitRow = Selectable<HeatTransferFitsTable>;
export type NewFitRow = Insertable<HeatTransferFitsTable>;

/** A profile row without its (large) series, for lists. */
export type ProfileSummaryRow = Omit<ProfileRow, "series_json" | "mapping_json">;

export function listLoggerRows(db: Db): Promise<LoggerRow[]> {
  return db.selectFrom("loggers").selectAll().orderBy("name").execute();
}

export function findLoggerByName(db: Db, name: string): Promise<LoggerRow | undefined> {
  return db.selectFrom("loggers").selectAll().where("name", "=", name).executeTakeFirst();
}

export function findLoggerRow(db: Db, id: number): Promise<LoggerRow | undefined> {
  return db.selectFrom("loggers").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Saves the mapping under the logger's name (new logger or the remembered mapping replaced); returns its id. */
export async function upsertLogger(db: Db, name: string, mappingJson: string, at: number): Promise<{ id: number; created: boolean }> {
  const existing = await findLoggerByName(db, name);
  if (existing) {
    await db.updateTable("loggers").set({ mapping_json: mappingJson, updated_at: at }).where("id", "=", existing.id).execute();
    return { id: existing.id, created: false };
  }
  const { id } = await db.insertInto("loggers").values({ name, mapping_json: mappingJson, created_at: at, updated_at: at }).returning("id").executeTakeFirstOrThrow();
  return { id, created: true };
}

const summaryColumns = [
  "id",
  "name",
  "line_id",
  "stage_position",
  "stage_name",
  "coating_id",
  "run_id",
  "logger_id",
  "file_name",
  "measured_on",
  "notes",
  "overbake_margin_k",
  "sample_count",
  "duration_s",
  "probe_count",
  "created_by",
  "created_at",
] as const;

export function listProfileRows(db: Db, filter: { lineId?: number } = {}): Promise<ProfileRow[]> {
  let q = db.selectFrom("oven_profiles").selectAll();
  if (filter.lineId !== undefined) q = q.where("line_id", "=", filter.lineId);
  return q.orderBy("created_at", "desc").orderBy("id", "desc").execute();
}

export function listProfileSummaries(db: Db, filter: { lineId?: number } = {}): Promise<ProfileSummaryRow[]> {
  let q = db.selectFrom("oven_profiles").select(summaryColumns);
  if (filter.lineId !== undefined) q = q.where("line_id", "=", filter.lineId);
  return q.orderBy("created_at", "desc").orderBy("id", "desc").execute();
}

export function findProfileRow(db: Db, id: number): Promise<ProfileRow | undefined> {
  return db.selectFrom("oven_profiles").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function insertProfile(db: Db, row: NewProfileRow): Promise<number> {
  const { id } = await db.insertInto("oven_profiles").values(row).returning("id").executeTakeFirstOrThrow();
  return id;
}

/** Deletes a profile; its fits stay in the history with profile_id cleared (foreign key ON DELETE SET NULL). */
export async function deleteProfile(db: Db, id: number): Promise<boolean> {
  const r = await db.deleteFrom("oven_profiles").where("id", "=", id).executeTakeFirst();
  return Number(r.numDeletedRows) > 0;
}

export async function insertFit(db: Db, row: NewFitRow): Promise<number> {
  const { id } = await db.insertInto("heat_transfer_fits").values(row).returning("id").executeTakeFirstOrThrow();
  return id;
}

/** Fits stored on one oven (line + stage position; null position = a batch oven), newest first, with who applied them. */
export function fitsOfOven(db: Db, lineId: number, stagePosition: number | null) {
  let q = db
    .selectFrom("heat_transfer_fits as f")
    .leftJoin("users as u", "u.id", "f.applied_by")
    .selectAll("f")
    .select("u.name as applied_by_name")
    .where("f.line_id", "=", lineId);
  q = stagePosition === null ? q.where("f.stage_position", "is", null) : q.where("f.stage_position", "=", stagePosition);
  return q.orderBy("f.applied_at", "desc").orderBy("f.id", "desc").execute();
}

export function userNames(db: Db, ids: string[]): Promise<{ id: string; name: string }[]> {
  if (!ids.length) return Promise.resolve([]);
  return db.selectFrom("users").select(["id", "name"]).where("id", "in", ids).execute();
}
