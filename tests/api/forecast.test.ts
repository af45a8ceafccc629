import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";
import { GET as forecastGet } from "@/app/api/forecast/route";
import { GET as csvGet } from "@/app/api/forecast.csv/route";
import type { ForecastView } from "@/lib/server/forecast";

useTempDatabase();
let manager = "";
beforeEach(async () => {
  await resetDatabase();
  manager = await signInAs("manager");
}, 60_000);
afterAll(teardown);

describe("GET /api/forecast", () => {
  it("counts the demo plan's planned and in-progress runs, and only those", async () => {
    const res = await forecastGet(request("/api/forecast?horizonDays=28", { cookie: manager }));
    expect(res.status).toBe(200);
    const f = (await res.json()).forecast as ForecastView;
    expect(f.horizonDays).toBe(28);
    const db = await getDb();
    const counted = await db.selectFrom("runs").select("id").where("status", "in", ["planned", "in-progress"]).execute();
    const runIds = new Set(f.coatings.flatMap((c) => c.demands.map((d) => d.runId)));
    expect(runIds.size).toBeGreaterThan(0);
    for (const id of runIds) expect(counted.map((r) => r.id)).toContain(id);
    for (const c of f.coatings) {
      expect(c.series).toHaveLength(28);
      expect(c.orderContainers * c.containerKg).toBeGreaterThanOrEqual(c.orderKg - 1e-9);
    }
  });

  it.each(["367", "0", "abc", "1.5"])("refuses horizonDays=%s naming the field", async (h) => {
    const res = await forecastGet(request(`/api/forecast?horizonDays=${h}`, { cookie: manager }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields.horizonDays).toMatch(/at most a year/);
  });

  it("exports CSV with a header and one row per coating", async () => {
    const res = await csvGet(request("/api/forecast.csv?horizonDays=14", { cookie: manager }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toContain("text/csv");
    const lines = (await res.text()).trim().split("\r\n");
    expect(lines[0]).toContain("code,name,kind,supplier,demand_kg");
    const json = (await (await forecastGet(request("/api/forecast?horizonDays=14", { cookie: manager }))).json()).forecast as ForecastView;
    expect(lines).toHaveLength(json.coatings.length + 1);
  });
});
