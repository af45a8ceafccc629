import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { FilmCheckLogTable, FilmChecksTable, FilmTestsTable, GaugesTable } from "../schema";

export type FilmCheckRow = Selectable<FilmChecksTable>;
export type FilmTestRow = Selectable<FilmTestsTable>;
export type GaugeRow = Selectable<GaugesTable>;
export type FilmLogRow = Selectable<FilmCheckLogTable>;

export type FilmCheckWithNames = FilmCheckRow & { created_by_name: string | null; gauge_name: string | null };
export type FilmTestWithName = FilmTestRow & { recorded_by_name: string | null };

export function filmChecksOfRun(db: Db, runId: number): Promise<FilmCheckWithNames[]> {
  return db
    .selectFrom("film_checks")
    .leftJoin("users", "users.id", "film_checks.created_by")
    .leftJoin("gauges", "gauges.id", "film_checks.gauge_id")
    .selectAll("film_checks")
    .select(["users.name as created_by_name", "gauges.name as gauge_name"])
    .where("film_checks.run_id", "=", runId)
    .orderBy("film_checks.coat_position")
    .orderBy("film_checks.id")
    .execute();
}

export function findFilmCheck(db: Db, id: number): Promise<FilmCheckWithNames | undefined> {
  return db
    .selectFrom("film_checks")
    .leftJoin("users", "users.id", "film_checks.created_by")
    .leftJoin("gauges", "gauges.id", "film_checks.gauge_id")
    .selectAll("film_checks")
    .select(["users.name as created_by_name", "gauges.name as gauge_name"])
    .where("film_checks.id", "=", id)
    .executeTakeFirst();
}

export async function insertFilmCheck(db: Db, row: Insertable<FilmChecksTable>): Promise<number> {
  return (await db.insertInto("film_checks").values(row).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updateFilmCheck(db: Db, id: number, patch: Updateable<FilmChecksTable>): Promise<void> {
  await db.updateTable("film_checks").set(patch).where("id", "=", id).execute();
}

export async function deleteFilmCheck(db: Db, id: number): Promise<void> {
  await db.deleteFrom("film_checks").where("id", "=", id).execute();
}

export function filmTestsOfRun(db: Db, runId: number): Promise<FilmTestWithName[]> {
  return db
    .selectFrom("film_tests")
    .leftJoin("users", "users.id", "film_tests.recorded_by")
    .selectAll("film_tests")
    .select("users.name as recorded_by_name")
    .where("film_tests.run_id", "=", runId)
    .orderBy("film_tests.recorded_at")
    .orderBy("film_tests.id")
    .execute();
}

export async function insertFilmTest(db: Db, row: Insertable<FilmTestsTable>): Promise<number> {
  return (await db.insertInto("film_tests").values(row).returning("id").executeTakeFirstOrThrow()).id;
}

export function listGaugeRows(db: Db): Promise<GaugeRow[]> {
  return db.selectFrom("gauges").selectAll().orderBy("name").execute();
}

/** How many film checks name each gauge (gauges no check names are absent). */
export async function gaugeUseCounts(db: Db): Promise<Map<number, number>> {
  const rows = await db
    .selectFrom("film_checks")
    .select(["gauge_id", (eb) => eb.fn.countAll<number>().as("n")])
    .where("gauge_id", "is not", null)
    .groupBy("gauge_id")
    .execute();
  return new Map(rows.map((r) => [r.gauge_id as number, Number(r.n)]));
}

export async function deleteGauge(db: Db, id: number): Promise<void> {
  await db.deleteFrom("gauges").where("id", "=", id).execute();
}

export function findGaugeByName(db: Db, name: string): Promise<GaugeRow | undefined> {
  return db.selectFrom("gauges").selectAll().where("name", "=", name).executeTakeFirst();
}

export function findGauge(db: Db, id: number): Promise<GaugeRow | undefined> {
  return db.selectFrom("gauges").selectAll().where("id", "=", id).executeTakeFirst();
}

export async function insertGauge(db: Db, row: Insertable<GaugesTable>): Promise<number> {
  return (await db.insertInto("gauges").values(row).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updateGauge(db: Db, id: number, patch: Updateable<GaugesTable>): Promise<void> {
  await db.updateTable("gauges").set(patch).where("id", "=", id).execute();
}

export async function insertFilmLog(db: Db, row: Insertable<FilmCheckLogTable>): Promise<void> {
  await db.insertInto("film_check_log").values(row).execute();
}

export function filmLogOfRun(db: Db, runId: number): Promise<(FilmLogRow & { user_name: string | null })[]> {
  return db
    .selectFrom("film_check_log")
    .leftJoin("users", "users.id", "film_check_log.user_id")
    .selectAll("film_check_log")
    .select("users.name as user_name")
    .where("film_check_log.run_id", "=", runId)
    .orderBy("film_check_log.at", "desc")
    .orderBy("film_check_log.id", "desc")
    .execute();
}

/** Film checks of one coating on one line, with their run's date, oldest first. */
export function checksForTrend(db: Db, coatingId: number, lineId: number) {
  return db
    .selectFrom("film_checks")
    .innerJoin("runs", "runs.id", "film_checks.run_id")
    .innerJoin("run_coats", (j) =>
      j.onRef("run_coats.run_id", "=", "film_checks.run_id").onRef("run_coats.position", "=", "film_checks.coat_position"),
    )
    .select([
      "film_checks.id",
      "film_checks.run_id",
      "film_checks.rule",
      "film_checks.spec_min_um",
      "film_checks.spec_max_um",
      "film_checks.readings_json",
      "runs.run_date",
      "run_coats.film_um",
    ])
    .where("run_coats.coating_id", "=", coatingId)
    .where("runs.line_id", "=", lineId)
    .orderBy("runs.run_date")
    .orderBy("film_checks.run_id")
    .execute();
}
