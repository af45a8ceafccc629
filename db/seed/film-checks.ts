import type { Db } from "../index";

/*
 * Demo film records: a gauge with a remembered CSV mapping, a pull-off gauge whose yearly
 * verification is overdue, and on today's in-progress fender
 * run (BC-2210, Line 1) the e-coat primer's SSPC-PA 2 readings (two areas, all within EC-200's
 * 18–25 µm) and a coverage inspection. The powder coat is left for the operator to measure.
 */
export async function seedFilmChecks(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<void> {
  const { id: gaugeId } = await db
    .insertInto("gauges")
    .values({
      name: "Gauge 1 — electronic",
      gauge_type: "type2",
      serial: "G1-0427",
      verified_at: nowS - 30 * 86_400,
      mapping_json: JSON.stringify({ readingColumn: "Reading", unit: "um" }),
      created_at: nowS,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db
    .insertInto("gauges")
    .values({ name: "Gauge 2 — pull-off", gauge_type: "type1", serial: "PO-1183", verified_at: nowS - 425 * 86_400, mapping_json: null, created_at: nowS })
    .execute();

  const run = await db
    .selectFrom("runs")
    .innerJoin("parts", "parts.id", "runs.part_id")
    .select(["runs.id"])
    .where("parts.number", "=", "BC-2210")
    .where("runs.status", "=", "in-progress")
    .executeTakeFirst();
  if (!run) return;
  const operator = await db.selectFrom("users").select("id").where("role", "=", "operator").executeTakeFirst();
  const areas = [
    [[20, 21, 22], [19, 20, 21], [22, 23, 21], [20, 19, 21], [22, 22, 20]],
    [[21, 22, 23], [20, 21, 20], [19, 21, 22], [23, 22, 21], [20, 20, 21]],
  ];
  const checkValues = {
    run_id: run.id,
    coat_position: 0,
    rule: "sspc-pa2" as const,
    spec_min_um: null,
    spec_max_um: null,
    nominal_um: null,
    gauge_id: gaugeId,
    readings_json: JSON.stringify(areas),
    notes: "First carrier off the e-coat oven.",
    created_by: operator?.id ?? null,
    created_at: nowS - 3600,
    updated_at: nowS - 3600,
  };
  const { id: checkId } = await db.insertInto("film_checks").values(checkValues).returning("id").executeTakeFirstOrThrow();
  // The log keeps the stored columns of the check, as the film-check service writes them.
  const { coat_position, rule, spec_min_um, spec_max_um, nominal_um, gauge_id, readings_json, notes } = checkValues;
  const logged = { coat_position, rule, spec_min_um, spec_max_um, nominal_um, gauge_id, readings_json, notes };
  const testData = { result: "pass", notes: "No bare spots on the inside return." };
  const { id: testId } = await db
    .insertInto("film_tests")
    .values({ run_id: run.id, kind: "coverage", data_json: JSON.stringify(testData), recorded_by: operator?.id ?? null, recorded_at: nowS - 3500 })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db
    .insertInto("film_check_log")
    .values([
      { run_id: run.id, entity: "film_check", entity_id: checkId, action: "create", user_id: operator?.id ?? null, at: nowS - 3600, old_json: null, new_json: JSON.stringify(logged) },
      { run_id: run.id, entity: "film_test", entity_id: testId, action: "create", user_id: operator?.id ?? null, at: nowS - 3500, old_json: null, new_json: JSON.stringify({ kind: "coverage", ...testData }) },
    ])
    .execute();
}
