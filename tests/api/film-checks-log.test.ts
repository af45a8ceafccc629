import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import type { FilmCheckView, RunFilmChecks } from "@/lib/server/film-checks";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as runGet, POST as runPost } from "@/app/api/runs/[id]/film-checks/route";
import { DELETE as oneDelete, PUT as onePut } from "@/app/api/film-checks/[id]/route";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();

/** Today's in-progress fender run and its seeded e-coat check (2 areas of 5 spots of 3 readings). */
async function seeded(): Promise<{ runId: number; checkId: number; areas: number[][][]; gaugeId: number }> {
  const db = await getDb();
  const row = await db.selectFrom("film_checks").selectAll().executeTakeFirstOrThrow();
  return { runId: row.run_id, checkId: row.id, areas: JSON.parse(row.readings_json) as number[][][], gaugeId: row.gauge_id! };
}

async function load(runId: number, role: Role): Promise<RunFilmChecks> {
  const res = await runGet(request(`/api/runs/${runId}/film-checks`, { cookie: cookies[role] }), params({ id: String(runId) }));
  expect(res.status).toBe(200);
  return (await res.json()) as RunFilmChecks;
}

function put(id: number, body: unknown, role: Role) {
  return onePut(request(`/api/film-checks/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
}

describe("editing a film check and reading its log", () => {
  it("logs an operator's one-reading edit as field: old → new in µm, and in mil for a US-customary reader", async () => {
    const { runId, checkId, areas, gaugeId } = await seeded();
    // seeded area 1, spot 2 is [19, 20, 21]: change its third reading 21 → 25 µm
    expect(areas[0][1]).toEqual([19, 20, 21]);
    const edited = structuredClone(areas);
    edited[0][1][2] = 25;
    const res = await put(checkId, { rule: "sspc-pa2", coatIndex: 0, gaugeId, areas: edited, notes: "First carrier off the e-coat oven." }, "operator");
    expect(res.status).toBe(200);
    const { check } = (await res.json()) as { check: FilmCheckView };
    expect(check.areas![0][1]).toEqual([19, 20, 25]);

    const db = await getDb();
    const rows = await db.selectFrom("film_check_log").selectAll().where("entity", "=", "film_check").where("entity_id", "=", checkId).orderBy("id").execute();
    expect(rows.map((r) => r.action)).toEqual(["create", "update"]);
    expect(JSON.parse(JSON.parse(rows[1].old_json!).readings_json)[0][1]).toEqual([19, 20, 21]);
    expect(JSON.parse(JSON.parse(rows[1].new_json!).readings_json)[0][1]).toEqual([19, 20, 25]);

    const metric = await load(runId, "operator");
    const entry = metric.log.find((l) => l.entity === "film_check" && l.action === "update")!;
    expect(entry).toMatchObject({
      userName: "Samir Holloway",
      summary: "Edited coat 1 (EC-200), SSPC-PA 2.",
      changes: [{ field: "area 1, spot 2, reading 3", from: "21 µm", to: "25 µm" }],
    });
    expect(entry.at).toBeGreaterThan(0);
    // the seeded creation reads as a sentence; mean of the 30 seeded readings 629 / 30 = 20.97 → 21 µm
    expect(metric.log.find((l) => l.entity === "film_check" && l.action === "create")!.summary).toBe(
      "Recorded coat 1 (EC-200), SSPC-PA 2: 30 readings, mean 21 µm.",
    );

    // the demo manager reads US customary; source: NIST SP 811, 1 mil = 25.4 µm: 21 µm = 0.83 mil, 25 µm = 0.98 mil
    const us = await load(runId, "manager");
    expect(us.log.find((l) => l.action === "update")!.changes).toEqual([{ field: "area 1, spot 2, reading 3", from: "0.83 mil", to: "0.98 mil" }]);
  });

  it("logs gauge, spec override and notes changes by name and unit", async () => {
    const { runId, checkId, areas } = await seeded();
    const db = await getDb();
    const pullOff = await db.selectFrom("gauges").select("id").where("name", "=", "Gauge 2 — pull-off").executeTakeFirstOrThrow();
    const res = await put(checkId, { rule: "sspc-pa2", coatIndex: 0, gaugeId: pullOff.id, specMinUm: 15, areas, notes: "Re-read with the pull-off gauge." }, "supervisor");
    expect(res.status).toBe(200);
    const { log } = await load(runId, "supervisor");
    expect(log[0].changes).toEqual([
      { field: "spec minimum", from: "the coating's", to: "15 µm" },
      { field: "gauge", from: "Gauge 1 — electronic", to: "Gauge 2 — pull-off" },
      { field: "notes", from: "“First carrier off the e-coat oven.”", to: "“Re-read with the pull-off gauge.”" },
    ]);
    expect(log[0].userName).toBe("Tobias Wrenfield");
  });

  it("summarises a change of shape as counts and means", async () => {
    const { runId, checkId, areas } = await seeded();
    // drop the second area: 15 readings left, all of area 1: 20+21+22+19+20+21+22+23+21+20+19+21+22+22+20 = 313; 313 / 15 = 20.87
    const res = await put(checkId, { rule: "sspc-pa2", coatIndex: 0, areas: [areas[0]], notes: "First carrier off the e-coat oven." }, "operator");
    expect(res.status).toBe(200);
    const { log } = await load(runId, "operator");
    expect(log[0].changes).toEqual([
      { field: "gauge", from: "Gauge 1 — electronic", to: "not recorded" },
      { field: "readings", from: "30 readings, mean 21 µm", to: "15 readings, mean 20.9 µm" },
    ]);
  });

  it("refuses a bad edit naming the reading and keeps the stored readings and log as they were", async () => {
    const { checkId, areas } = await seeded();
    const bad = structuredClone(areas);
    bad[1][3][0] = -4;
    const res = await put(checkId, { rule: "sspc-pa2", coatIndex: 0, areas: bad }, "operator");
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty("areas.1.3.0");
    const short = structuredClone(areas);
    short[0][4] = [20, 21];
    const res2 = await put(checkId, { rule: "sspc-pa2", coatIndex: 0, areas: short }, "operator");
    expect(res2.status).toBe(400);
    expect(((await res2.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty("areas.0.4");
    const db = await getDb();
    const row = await db.selectFrom("film_checks").select("readings_json").where("id", "=", checkId).executeTakeFirstOrThrow();
    expect(JSON.parse(row.readings_json)).toEqual(areas);
    expect((await db.selectFrom("film_check_log").select("id").where("action", "=", "update").execute()).length).toBe(0);
  });

  it.each([
    { role: "operator" as Role, status: 200 },
    { role: "supervisor" as Role, status: 200 },
    { role: "admin" as Role, status: 200 },
    { role: "engineer" as Role, status: 403 },
    { role: "manager" as Role, status: 403 },
    { role: "purchaser" as Role, status: 403 },
  ])("edit by $role: $status", async ({ role, status }) => {
    const { checkId, areas } = await seeded();
    const res = await put(checkId, { rule: "sspc-pa2", coatIndex: 0, areas, notes: `by ${role}` }, role);
    expect(res.status).toBe(status);
    const row = await (await getDb()).selectFrom("film_checks").select("notes").where("id", "=", checkId).executeTakeFirstOrThrow();
    expect(row.notes).toBe(status === 200 ? `by ${role}` : "First carrier off the e-coat oven.");
  });

  it("logs a deletion with what was deleted; the run's log keeps it after the check is gone", async () => {
    const { runId, checkId } = await seeded();
    const res = await oneDelete(request(`/api/film-checks/${checkId}`, { method: "DELETE", cookie: cookies.operator }), params({ id: String(checkId) }));
    expect(res.status).toBe(200);
    const body = await load(runId, "operator");
    expect(body.checks).toEqual([]);
    expect(body.log[0]).toMatchObject({ action: "delete", entityId: checkId, userName: "Samir Holloway", summary: "Deleted coat 1 (EC-200), SSPC-PA 2 (30 readings, mean 21 µm)." });
    const row = await (await getDb()).selectFrom("film_check_log").selectAll().where("action", "=", "delete").executeTakeFirstOrThrow();
    expect(row.new_json).toBeNull();
    expect(JSON.parse(row.old_json!).coat_position).toBe(0);
  });

  it("tells a done run as locked to the operator but not to the admin", async () => {
    const { runId } = await seeded();
    await (await getDb()).updateTable("runs").set({ status: "done" }).where("id", "=", runId).execute();
    expect((await load(runId, "operator")).run.locked).toBe(true);
    expect((await load(runId, "admin")).run.locked).toBe(false);
  });
});

describe("sampling plan of the run", () => {
  it("needs 7 SSPC-PA 2 areas per coat for 600 fenders and counts what is recorded", async () => {
    const { runId } = await seeded();
    // BC-2210 is a 1100 × 320 × 2 mm plate: 2 × 1.1 × 0.32 + 2 × 1.1 × 0.002 + 2 × 0.32 × 0.002 = 0.70968 m²,
    // less 0.0015 m² masked = 0.70818 m² a part; × 600 = 424.9 m² = 4573.7 ft² (NIST SP 811: 1 ft² = 0.09290304 m²).
    // source: SSPC-PA 2 — over 1000 ft²: 3 areas for the first 1000 plus one per further 1000 or part: 3 + ceil(3.57) = 7;
    // 5 spots an area = 35 spots; 3 readings a spot = 105 readings.
    const before = await load(runId, "engineer");
    expect(before.sampling.unavailable).toBeNull();
    expect(before.sampling.coats.map((c) => [c.coatIndex, c.areaCount, c.spotCount, c.minReadingCount])).toEqual([
      [0, 7, 35, 105],
      [1, 7, 35, 105],
    ]);
    expect(before.sampling.coats[0].surfaceAreaM2).toBeCloseTo(424.908, 2);
    // the seeded e-coat check: 2 complete areas (10 spots, 30 readings); nothing yet on the powder coat
    expect(before.sampling.coats[0]).toMatchObject({ recordedAreas: 2, recordedSpots: 10, completeAreas: 2, recordedReadings: 30 });
    expect(before.sampling.coats[1]).toMatchObject({ recordedAreas: 0, recordedSpots: 0, completeAreas: 0, recordedReadings: 0 });

    // one powder area of only 4 spots is recorded but not complete
    const spot = [70, 70, 70];
    const res = await runPost(
      request(`/api/runs/${runId}/film-checks`, { method: "POST", body: { rule: "sspc-pa2", coatIndex: 1, areas: [[spot, spot, spot, spot]] }, cookie: cookies.operator }),
      params({ id: String(runId) }),
    );
    expect(res.status).toBe(201);
    const after = await load(runId, "operator");
    expect(after.sampling.coats[1]).toMatchObject({ recordedAreas: 1, recordedSpots: 4, completeAreas: 0, recordedReadings: 12 });
  });
});
