import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { ScenariosTable } from "../schema";

export type ScenarioRow = Selectable<ScenariosTable>;
export type NewScenarioRow = Insertable<ScenariosTable>;

/** A scenario row with the names it points at, for lists. */
export type ScenarioListRow = ScenarioRow & { line_name: string; creator_name: string | null };

function withNames(db: Db) {
  return db
    .selectFrom("scenarios")
    .innerJoin("lines", "lines.id", "scenarios.line_id")
    .leftJoin("users", "users.id", "scenarios.created_by")
    .selectAll("scenarios")
    .select(["lines.name as line_name", "users.name as creator_name"]);
}

export function listScenarioRows(db: Db, opts: { includeArchived?: boolean } = {}): Promise<ScenarioListRow[]> {
  let q = withNames(db);
  if (!opts.includeArchived) q = q.where("scenarios.archived", "=", 0);
  return q.orderBy("scenarios.name").execute();
}

export function findScenarioRow(db: Db, id: number): Promise<ScenarioListRow | undefined> {
  return withNames(db).where("scenarios.id", "=", id).executeTakeFirst();
}

export function findScenarioRows(db: Db, ids: number[]): Promise<ScenarioListRow[]> {
  if (!ids.length) return Promise.resolve([]);
  return withNames(db).where("scenarios.id", "in", ids).execute();
}

/** Live names, lower-cased, for finding a free "… (copy n)". */
export async function liveScenarioNames(db: Db): Promise<Set<string>> {
  const rows = await db.selectFrom("scenarios").select("name").where("archived", "=", 0).execute();
  return new Set(rows.map((r) => r.name.toLowerCase()));
}

export async function insertScenario(db: Db, row: NewScenarioRow): Promise<number> {
  const { id } = await db.insertInto("scenarios").values(row).returning("id").executeTakeFirstOrThrow();
  return id;
}

export async function updateScenario(db: Db, id: number, patch: Updateable<ScenariosTable>): Promise<void> {
  await db.updateTable("scenarios").set(patch).where("id", "=", id).execute();
}

/**
 * Live scenarios on a line, as the usage entries lib/server/lines.ts refuses an archive with
 * (the same { kind, id, label } shape as its UsageRef).
 */
export async function scenarioUsageOfLine(db: Db, lineId: number): Promise<{ kind: string; id: number; label: string }[]> {
  const rows = await db.selectFrom("scenarios").select(["id", "name"]).where("line_id", "=", lineId).where("archived", "=", 0).orderBy("name").execute();
  return rows.map((r) => ({ kind: "scenario", id: r.id, label: `Scenario: ${r.name}` }));
}

/** The figures of a catalogue part that the throughput comparison needs. */
export function findPartFigures(db: Db, id: string) {
  return db
    .selectFrom("parts")
    .select(["id", "number", "name", "area_m2", "inside_area_m2", "masked_area_m2", "mass_kg", "thickness_mm", "length_mm", "width_mm", "height_mm", "archived"])
    .where("id", "=", id)
    .executeTakeFirst();
}
