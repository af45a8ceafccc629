import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import type { Role } from "@/db/schema";
import type { ProfileDetail, ProfilePreview, ProfileSummary } from "@/lib/server/profiles";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as listGet, POST as createPost } from "@/app/api/profiles/route";
import { POST as previewPost } from "@/app/api/profiles/preview/route";
import { DELETE as oneDelete, GET as oneGet } from "@/app/api/profiles/[id]/route";
import { POST as applyPost } from "@/app/api/profiles/[id]/apply-fit/route";
import { GET as loggersGet, POST as loggersPost } from "@/app/api/loggers/route";
import { GET as lineGet, PUT as linePut } from "@/app/api/lines/[id]/route";
import { POST as cureCheckPost } from "@/app/api/lines/[id]/cure-check/route";
import { demoProfile, toCsv } from "../unit/profiles/synthetic-profile";

const cookies = useSignedInDemo();

const LINE1 = "Line 1 — E-coat and powder";
const LOGGER = "Logger 7 (SN 40217)";

async function ids() {
  const db = await getDb();
  const line = await db.selectFrom("lines").select("id").where("name", "=", LINE1).executeTakeFirstOrThrow();
  const oven = await db.selectFrom("line_stages").select(["position", "heat_transfer_coefficient_w_per_m2k as h"]).where("line_id", "=", line.id).where("name", "=", "Powder cure oven").executeTakeFirstOrThrow();
  const coating = await db.selectFrom("coatings").select("id").where("code", "=", "PP-410").executeTakeFirstOrThrow();
  const batch = await db.selectFrom("lines").select("id").where("kind", "=", "batch").executeTakeFirstOrThrow();
  return { lineId: line.id, position: oven.position, hBefore: oven.h, coatingId: coating.id, batchId: batch.id };
}

const count = async (table: "oven_profiles" | "loggers" | "heat_transfer_fits") =>
  Number((await (await getDb()).selectFrom(table).select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n);

const mapping = {
  timeColumn: "Elapsed (s)",
  timeFormat: "seconds",
  temperatureUnit: "C",
  airColumn: "T1 Air (°C)",
  probes: [
    { column: "T2 (°C)", label: "Thin bracket", thicknessMm: 1.5 },
    { column: "T3 (°C)", label: "Thick base plate", thicknessMm: 8 },
  ],
};

async function body(over: Record<string, unknown> = {}) {
  const { lineId, position, coatingId } = await ids();
  return { name: "Test pass", lineId, stagePosition: position, coatingId, loggerName: "Logger 9", fileName: "pass.csv", csv: toCsv(demoProfile()), mapping, ...over };
}

const post = (role: Role | null, b: unknown) => createPost(request("/api/profiles", { method: "POST", body: b, cookie: role ? cookies[role] : null }));
const get = (role: Role, id: number | string, query = "") => oneGet(request(`/api/profiles/${id}${query}`, { cookie: cookies[role] }), params({ id: String(id) }));
const apply = (role: Role, id: number | string, b: unknown) => applyPost(request(`/api/profiles/${id}/apply-fit`, { method: "POST", body: b, cookie: cookies[role] }), params({ id: String(id) }));
const preview = (b: unknown) => previewPost(request("/api/profiles/preview", { method: "POST", body: b, cookie: cookies.supervisor }));
const cureCheck = async (lineId: number, thicknessMm: number, coatingId: number) => {
  const res = await cureCheckPost(request(`/api/lines/${lineId}/cure-check`, { method: "POST", body: { coatingId, thicknessMm, lineSpeedMPerMin: 3 }, cookie: cookies.supervisor }), params({ id: String(lineId) }));
  expect(res.status).toBe(200);
  return (await res.json()).cureCheck as { pass: boolean; heatUpMin: number; heatTransferCoefficientWPerM2K: number };
};

describe("GET /api/profiles and /api/loggers", () => {
  it("lists the demo profile with each probe's verdict against its coating", async () => {
    const res = await listGet(request("/api/profiles", { cookie: cookies.manager }));
    expect(res.status).toBe(200);
    const { profiles } = (await res.json()) as { profiles: ProfileSummary[] };
    expect(profiles).toHaveLength(1);
    expect(profiles[0]).toMatchObject({ lineName: LINE1, stageName: "Powder cure oven", coatingCode: "PP-410", loggerName: LOGGER, sampleCount: 157 });
    expect(profiles[0].probes.map((p) => [p.label, p.thicknessMm, p.pass, p.underCured])).toEqual([
      ["Thin bracket", 1.5, true, false],
      ["Thick base plate", 8, false, true],
    ]);
  });

  it("filters by line and refuses a bad line id", async () => {
    const { batchId } = await ids();
    const res = await listGet(request(`/api/profiles?lineId=${batchId}`, { cookie: cookies.supervisor }));
    expect((await res.json()).profiles).toEqual([]);
    const bad = await listGet(request("/api/profiles?lineId=abc", { cookie: cookies.supervisor }));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields.lineId).toBeDefined();
  });

  it.each<[Role, number]>([["operator", 403], ["purchaser", 403], ["engineer", 200], ["admin", 200]])("%s → %d", async (role, status) => {
    expect((await listGet(request("/api/profiles", { cookie: cookies[role] }))).status).toBe(status);
  });

  it("lists the demo logger with its remembered mapping", async () => {
    const res = await loggersGet(request("/api/loggers", { cookie: cookies.engineer }));
    const { loggers } = await res.json();
    expect(loggers).toHaveLength(1);
    expect(loggers[0].name).toBe(LOGGER);
    expect(loggers[0].mapping).toEqual(mapping);
  });

  it("POST /api/loggers remembers a new logger (201) and replaces its mapping (200)", async () => {
    const first = await loggersPost(request("/api/loggers", { method: "POST", body: { name: "Logger 12", mapping }, cookie: cookies.supervisor }));
    expect(first.status).toBe(201);
    const changed = { ...mapping, temperatureUnit: "F" };
    const again = await loggersPost(request("/api/loggers", { method: "POST", body: { name: "Logger 12", mapping: changed }, cookie: cookies.supervisor }));
    expect(again.status).toBe(200);
    const row = await (await getDb()).selectFrom("loggers").selectAll().where("name", "=", "Logger 12").executeTakeFirstOrThrow();
    expect(JSON.parse(row.mapping_json).temperatureUnit).toBe("F");
    const refused = await loggersPost(request("/api/loggers", { method: "POST", body: { name: "", mapping }, cookie: cookies.supervisor }));
    expect(refused.status).toBe(400);
    expect((await loggersPost(request("/api/loggers", { method: "POST", body: { name: "X", mapping }, cookie: cookies.manager }))).status).toBe(403);
  });
});

describe("POST /api/profiles/preview", () => {
  it("uses the named logger's remembered mapping when the file has its columns", async () => {
    const res = await preview({ csv: toCsv(demoProfile()), loggerName: LOGGER });
    expect(res.status).toBe(200);
    const { preview: p } = (await res.json()) as { preview: ProfilePreview };
    expect(p.mappingSource).toBe("logger");
    expect(p.ok).toBe(true);
    expect(p.rowCount).toBe(157);
    expect(p.summary!.probes.map((q) => q.label)).toEqual(["Thin bracket", "Thick base plate"]);
  });

  it("suggests a mapping for a new file and asks for the thicknesses", async () => {
    const { preview: p } = (await (await preview({ csv: toCsv(demoProfile()) })).json()) as { preview: ProfilePreview };
    expect(p.mappingSource).toBe("suggested");
    expect(p.mapping!.airColumn).toBe("T1 Air (°C)");
    expect(p.ok).toBe(false);
    expect(p.problems.map((q) => q.field)).toEqual(["mapping.probes.0.thicknessMm", "mapping.probes.1.thicknessMm"]);
    expect(await count("oven_profiles")).toBe(1);
  });

  it("shows the rows with bad cells beside the first rows", async () => {
    const csv = toCsv(demoProfile()).split("\n").map((l, i) => (i === 100 ? l.replace(/,[^,]+$/, ",open") : l)).join("\n");
    const { preview: p } = (await (await preview({ csv, mapping })).json()) as { preview: ProfilePreview };
    expect(p.problems).toEqual([{ field: "csv", row: 101, column: "T3 (°C)", message: 'Row 101, column "T3 (°C)": "open" is not a number.' }]);
    expect(p.rows.map((r) => r.row)).toEqual([...Array.from({ length: 12 }, (_, i) => i + 2), 101]);
  });

  it("answers an unreadable file with the problem, not an error", async () => {
    const { preview: p } = (await (await preview({ csv: "just some words\n" })).json()) as { preview: ProfilePreview };
    expect(p.ok).toBe(false);
    expect(p.problems[0].field).toBe("csv");
  });
});

describe("POST /api/profiles", () => {
  it("stores the profile, judges each probe and remembers the mapping for the logger", async () => {
    const before = await count("oven_profiles");
    const res = await post("supervisor", await body());
    expect(res.status).toBe(201);
    const { profile } = (await res.json()) as { profile: ProfileDetail };
    expect(profile.oven).toMatchObject({ lineName: LINE1, stageName: "Powder cure oven", current: { name: "Powder cure oven", airTempC: 210, heatTransferCoefficientWPerM2K: 30 } });
    // the polyester schedule tops at 210 °C; default margin 20 K
    expect(profile.overbakeLimitC).toBe(230);
    const [thin, thick] = profile.probes;
    expect(thin.verdict!.pass).toBe(true);
    expect(thin.reasons[0]).toMatch(/^Cured: cure index \d+ %/);
    expect(thick.verdict!.underCured).toBe(true);
    expect(thick.reasons[0]).toContain("never reached 190 °C");
    // the demo oven's true h is 24 W/m²K (tests/unit/profiles/synthetic-profile.ts)
    for (const p of profile.probes) expect(Math.abs(p.fit!.heatTransferCoefficientWPerM2K / 24 - 1)).toBeLessThan(0.03);
    expect(profile.chart.timeS).toHaveLength(157);
    expect(profile.chart.probes[0].modelC).toHaveLength(157);

    expect(await count("oven_profiles")).toBe(before + 1);
    const db = await getDb();
    const row = await db.selectFrom("oven_profiles").selectAll().where("id", "=", profile.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ name: "Test pass", stage_name: "Powder cure oven", run_id: null, sample_count: 157, duration_s: 1560, probe_count: 2, file_name: "pass.csv" });
    expect(JSON.parse(row.series_json).probes[1].tempsC).toHaveLength(157);
    const logger = await db.selectFrom("loggers").selectAll().where("name", "=", "Logger 9").executeTakeFirstOrThrow();
    expect(JSON.parse(logger.mapping_json)).toEqual(mapping);
    expect(row.logger_id).toBe(logger.id);
  });

  it("keeps an optional run id as plain text", async () => {
    const res = await post("engineer", await body({ runId: "run-2026-0042" }));
    expect(res.status).toBe(201);
    expect((await res.json()).profile.runId).toBe("run-2026-0042");
  });

  it("gives the same verdicts for the same pass logged in °F", async () => {
    const c = (await (await post("supervisor", await body())).json()).profile as ProfileDetail;
    const fMapping = { ...mapping, temperatureUnit: "F", airColumn: "T1 Air (°F)", probes: mapping.probes.map((p) => ({ ...p, column: p.column.replace("C", "F") })) };
    const res = await post("supervisor", await body({ csv: toCsv(demoProfile(), { unit: "F" }), mapping: fMapping }));
    expect(res.status).toBe(201);
    const f = (await res.json()).profile as ProfileDetail;
    f.probes.forEach((p, k) => {
      expect(p.verdict!.pass).toBe(c.probes[k].verdict!.pass);
      expect(p.verdict!.cureIndex).toBeCloseTo(c.probes[k].verdict!.cureIndex, 3);
      expect(p.fit!.heatTransferCoefficientWPerM2K).toBeCloseTo(c.probes[k].fit!.heatTransferCoefficientWPerM2K, 1);
    });
  });

  const lines = () => toCsv(demoProfile()).trimEnd().split("\n");
  const swapCell = (all: string[], line: number, col: number, value: string) => {
    const cells = all[line - 1].split(",");
    cells[col] = value;
    all[line - 1] = cells.join(",");
    return all;
  };
  it.each<[string, () => string, Record<string, unknown>, { field: string; row?: number; column?: string; text: string }]>([
    ["no time column", () => lines().map((l) => l.split(",").slice(1).join(",")).join("\n"), { mapping: { ...mapping, timeColumn: null } }, { field: "mapping.timeColumn", text: "No time column" }],
    ["times out of order", () => swapCell(lines(), 50, 0, "100").join("\n"), {}, { field: "csv", row: 50, column: "Elapsed (s)", text: "is earlier than row 49" }],
    ["a repeated time", () => swapCell(lines(), 30, 0, "270").join("\n"), {}, { field: "csv", row: 30, column: "Elapsed (s)", text: "repeats the time of row 29" }],
    ["text in a temperature column", () => swapCell(lines(), 80, 2, "n/a").join("\n"), {}, { field: "csv", row: 80, column: "T2 (°C)", text: '"n/a" is not a number' }],
    ["a probe that never warms up", () => lines().map((l, i) => (i === 0 ? l : swapCell([l], 1, 3, "23.4")[0])).join("\n"), {}, { field: "mapping.probes.1.column", column: "T3 (°C)", text: "rises only 0 K" }],
    ["the air probe missing", () => lines().map((l) => l.split(",").filter((_, i) => i !== 1).join(",")).join("\n"), { mapping: { ...mapping, airColumn: null } }, { field: "mapping.airColumn", text: "No air probe" }],
    ["the air column named but not in the file", () => lines().map((l) => l.split(",").filter((_, i) => i !== 1).join(",")).join("\n"), {}, { field: "mapping.airColumn", column: "T1 Air (°C)", text: "no column named" }],
  ])("%s: 400 with the row and column, nothing stored", async (_n, csv, over, expected) => {
    const [profiles, loggers] = [await count("oven_profiles"), await count("loggers")];
    const res = await post("supervisor", await body({ csv: csv(), ...over }));
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(error.code).toBe("invalid_input");
    expect(error.fields[expected.field]).toBeDefined();
    const hit = (error.problems as { field: string; row?: number; column?: string; message: string }[]).find((p) => p.field === expected.field && p.message.includes(expected.text));
    expect(hit, JSON.stringify(error.problems)).toBeDefined();
    if (expected.row !== undefined) expect(hit!.row).toBe(expected.row);
    if (expected.column !== undefined) expect(hit!.column).toBe(expected.column);
    expect(await count("oven_profiles")).toBe(profiles);
    expect(await count("loggers")).toBe(loggers);
  });

  it("refuses an oven that is not an oven, a batch oven with a stage, and an unknown coating", async () => {
    const { batchId, lineId } = await ids();
    const notOven = await post("supervisor", await body({ stagePosition: 0 }));
    expect(notOven.status).toBe(400);
    expect((await notOven.json()).error.fields.stagePosition).toContain("Powder cure oven");
    const batch = await post("supervisor", await body({ lineId: batchId, stagePosition: 2 }));
    expect((await batch.json()).error.fields.stagePosition).toContain("batch oven has no stages");
    const coating = await post("supervisor", await body({ coatingId: 9999 }));
    expect((await coating.json()).error.fields.coatingId).toBe("No such coating.");
    const line = await post("supervisor", await body({ lineId: lineId + 999 }));
    expect((await line.json()).error.fields.lineId).toBe("No such line.");
    expect(await count("oven_profiles")).toBe(1);
  });

  it("stores a batch oven's profile with no stage", async () => {
    const { batchId } = await ids();
    const res = await post("engineer", await body({ lineId: batchId, stagePosition: null }));
    expect(res.status).toBe(201);
    const { profile } = (await res.json()) as { profile: ProfileDetail };
    expect(profile.oven).toMatchObject({ stagePosition: null, stageName: "Batch oven B — gas", current: { heatTransferCoefficientWPerM2K: 22 } });
  });

  it.each<[string, Record<string, unknown>, string]>([
    ["an unknown field", { colour: "red" }, "colour"],
    ["a negative thickness", { mapping: { ...mapping, probes: [{ column: "T2 (°C)", label: "", thicknessMm: -1 }] } }, "mapping.probes.0.thicknessMm"],
    ["a time format it does not know", { mapping: { ...mapping, timeFormat: "hours" } }, "mapping.timeFormat"],
    ["no name", { name: " " }, "name"],
  ])("refuses %s with the field named", async (_n, over, field) => {
    const res = await post("supervisor", await body(over));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields[field]).toBeDefined();
  });

  it.each<[Role | null, number]>([[null, 401], ["manager", 403], ["operator", 403], ["purchaser", 403]])("%s may not import (%d)", async (role, status) => {
    expect((await post(role, await body())).status).toBe(status);
    expect(await count("oven_profiles")).toBe(1);
  });
});

describe("GET /api/profiles/[id]", () => {
  const seededId = async () => (await (await getDb()).selectFrom("oven_profiles").select("id").executeTakeFirstOrThrow()).id;

  it("judges the demo profile against another coating on request", async () => {
    const db = await getDb();
    // PH-510's schedule (180 °C / 15 min, 190 / 12, 200 / 8) starts lower than PP-410's
    const hybrid = await db.selectFrom("coatings").select("id").where("code", "=", "PH-510").executeTakeFirstOrThrow();
    const own = ((await (await get("manager", await seededId())).json()).profile as ProfileDetail);
    const other = ((await (await get("manager", await seededId(), `?coatingId=${hybrid.id}`)).json()).profile as ProfileDetail);
    expect(own.coating.code).toBe("PP-410");
    expect(other.coating.code).toBe("PH-510");
    expect(other.coatingId).toBe(own.coatingId);
    expect(other.probes[1].verdict!.reachedLowestAtMin).not.toBeNull();
    expect(other.probes[0].verdict!.cureIndex).toBeGreaterThan(own.probes[0].verdict!.cureIndex);
  });

  it.each<[string, string, number]>([
    ["no-such-profile", "", 404],
    ["999", "", 404],
    ["SEEDED", "?coatingId=abc", 400],
    ["SEEDED", "?coatingId=9999", 400],
  ])("%s%s → %d", async (id, query, status) => {
    const res = await get("supervisor", id === "SEEDED" ? await seededId() : id, query);
    expect(res.status).toBe(status);
  });
});

describe("POST /api/profiles/[id]/apply-fit", () => {
  it("stores the fitted h on the oven stage, records it, and the line's cure check follows", async () => {
    const { lineId, position, hBefore, coatingId } = await ids();
    expect(hBefore).toBe(30);
    // 3 mm steel, PP-410 in a 210 °C oven at 30 W/m²K: heat-up 7.2 min + 12 min hold = 19.2 < 20 min dwell (cures);
    // at 24 W/m²K: τ = 7850 × 490 × 0.0015 / 24 = 240.4 s = 4.007 min; 4.007 × ln(190/20) = 9.02 min + 12 = 21.0 > 20 (does not)
    const before = await cureCheck(lineId, 3, coatingId);
    expect(before.pass).toBe(true);

    const created = (await (await post("supervisor", await body())).json()).profile as ProfileDetail;
    const fitted = created.probes[0].fit!.heatTransferCoefficientWPerM2K;
    const res = await apply("supervisor", created.id, { probeIndex: 0 });
    expect(res.status).toBe(200);
    const out = await res.json();
    expect(out.fit).toMatchObject({ profileId: created.id, profileName: "Test pass", probeLabel: "Thin bracket", thicknessMm: 1.5, beforeWPerM2K: 30, appliedBy: "Tobias Wrenfield" });
    expect(out.fit.afterWPerM2K).toBeCloseTo(fitted, 9);
    expect(out.oven.current.heatTransferCoefficientWPerM2K).toBeCloseTo(fitted, 9);

    const db = await getDb();
    const stage = await db.selectFrom("line_stages").select("heat_transfer_coefficient_w_per_m2k as h").where("line_id", "=", lineId).where("position", "=", position).executeTakeFirstOrThrow();
    expect(stage.h).toBeCloseTo(fitted, 9);
    const fits = await db.selectFrom("heat_transfer_fits").selectAll().execute();
    expect(fits).toHaveLength(1);
    expect(fits[0]).toMatchObject({ line_id: lineId, stage_position: position, stage_name: "Powder cure oven", h_before_w_per_m2k: 30, probe_label: "Thin bracket" });

    const after = await cureCheck(lineId, 3, coatingId);
    expect(after.heatTransferCoefficientWPerM2K).toBeCloseTo(fitted, 9);
    expect(after.pass).toBe(false);
    expect(after.heatUpMin).toBeGreaterThan(before.heatUpMin);

    // the history shows on every profile of that oven
    const seeded = (await (await get("manager", (await db.selectFrom("oven_profiles").select("id").where("id", "!=", created.id).executeTakeFirstOrThrow()).id)).json()).profile as ProfileDetail;
    expect(seeded.fitHistory.map((f) => f.probeLabel)).toEqual(["Thin bracket"]);
  });

  it("stores a batch oven's h on the line", async () => {
    const { batchId } = await ids();
    const created = (await (await post("engineer", await body({ lineId: batchId, stagePosition: null }))).json()).profile as ProfileDetail;
    const res = await apply("manager", created.id, { probeIndex: 1 });
    expect(res.status).toBe(200);
    const line = await (await getDb()).selectFrom("lines").select("heat_transfer_coefficient_w_per_m2k as h").where("id", "=", batchId).executeTakeFirstOrThrow();
    expect(line.h).toBeCloseTo(created.probes[1].fit!.heatTransferCoefficientWPerM2K, 9);
  });

  it("refuses (409) when the line's stages changed since the measurement, and writes nothing", async () => {
    const { lineId, position } = await ids();
    const created = (await (await post("supervisor", await body())).json()).profile as ProfileDetail;
    const { line } = await (await lineGet(request(`/api/lines/${lineId}`, { cookie: cookies.manager }), params({ id: String(lineId) }))).json();
    const { id: _id, archived: _a, createdAt: _c, updatedAt: _u, ...rest } = line;
    const stages = line.stages.map(({ position: _p, ...s }: { position: number }) => s);
    stages[position].name = "Powder cure oven (rebuilt)";
    const put = await linePut(request(`/api/lines/${lineId}`, { method: "PUT", body: { ...rest, stages }, cookie: cookies.manager }), params({ id: String(lineId) }));
    expect(put.status).toBe(200);
    const res = await apply("supervisor", created.id, { probeIndex: 0 });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toContain('now "Powder cure oven (rebuilt)"');
    expect(await count("heat_transfer_fits")).toBe(0);
    const detail = (await (await get("supervisor", created.id)).json()).profile as ProfileDetail;
    expect(detail.oven.current).toBeNull();
  });

  it.each<[Role, unknown, number]>([
    ["supervisor", { probeIndex: 5 }, 400],
    ["supervisor", { probeIndex: -1 }, 400],
    ["supervisor", {}, 400],
    ["operator", { probeIndex: 0 }, 403],
    ["purchaser", { probeIndex: 0 }, 403],
  ])("%s %j → %d", async (role, b, status) => {
    const id = (await (await getDb()).selectFrom("oven_profiles").select("id").executeTakeFirstOrThrow()).id;
    expect((await apply(role, id, b)).status).toBe(status);
    expect(await count("heat_transfer_fits")).toBe(0);
  });

  it("404 for a profile that does not exist", async () => {
    expect((await apply("supervisor", 999, { probeIndex: 0 })).status).toBe(404);
  });
});

describe("DELETE /api/profiles/[id]", () => {
  it("deletes the profile and keeps the history of the h it set", async () => {
    const created = (await (await post("supervisor", await body())).json()).profile as ProfileDetail;
    await apply("supervisor", created.id, { probeIndex: 0 });
    expect((await oneDelete(request(`/api/profiles/${created.id}`, { method: "DELETE", cookie: cookies.manager }), params({ id: String(created.id) }))).status).toBe(403);
    const res = await oneDelete(request(`/api/profiles/${created.id}`, { method: "DELETE", cookie: cookies.engineer }), params({ id: String(created.id) }));
    expect(res.status).toBe(200);
    const db = await getDb();
    expect(await db.selectFrom("oven_profiles").select("id").where("id", "=", created.id).executeTakeFirst()).toBeUndefined();
    const fit = await db.selectFrom("heat_transfer_fits").selectAll().executeTakeFirstOrThrow();
    expect(fit.profile_id).toBeNull();
    expect(fit.profile_name).toBe("Test pass");
    const again = await oneDelete(request(`/api/profiles/${created.id}`, { method: "DELETE", cookie: cookies.engineer }), params({ id: String(created.id) }));
    expect(again.status).toBe(404);
  });
});
