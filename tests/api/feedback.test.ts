import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { params, request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";
import { GET as useGet, POST as usePost } from "@/app/api/runs/[id]/actual-use/route";
import { GET as feedbackGet } from "@/app/api/feedback/route";
import { PATCH as feedbackPatch } from "@/app/api/feedback/[id]/route";
import { POST as resetPost } from "@/app/api/feedback/reset/route";
import { GET as forecastGet } from "@/app/api/forecast/route";
import type { ActualUseView, EstimateView } from "@/lib/server/feedback";
import type { ForecastView } from "@/lib/server/forecast";

useTempDatabase();
let operator = "";
let supervisor = "";
beforeEach(async () => {
  await resetDatabase();
  operator = await signInAs("operator");
  supervisor = await signInAs("supervisor");
}, 60_000);
afterAll(teardown);

/** Copies of the demo's in-progress Line 1 run, marked done: same line, part and powder. */
async function doneRuns(n: number): Promise<number[]> {
  const db = await getDb();
  const src = await db.selectFrom("runs").selectAll().where("status", "=", "in-progress").orderBy("id").executeTakeFirstOrThrow();
  const coats = await db.selectFrom("run_coats").selectAll().where("run_id", "=", src.id).orderBy("position").execute();
  const ids: number[] = [];
  for (let i = 0; i < n; i++) {
    const { id: _id, ...row } = src;
    const r = await db.insertInto("runs").values({ ...row, status: "done" }).returning("id").executeTakeFirstOrThrow();
    await db.insertInto("run_coats").values(coats.map(({ id: _c, ...c }) => ({ ...c, run_id: r.id }))).execute();
    ids.push(r.id);
  }
  return ids;
}

async function actualUse(runId: number): Promise<ActualUseView> {
  return (await (await useGet(request(`/api/runs/${runId}/actual-use`, { cookie: operator }), params({ id: String(runId) }))).json()).actualUse;
}

/** kg that makes the coat's utilisation `u`: deposited (area × film × SG / 1000) ÷ u. */
function kgFor(v: ActualUseView, coatIndex: number, parts: number, u: number): number {
  const c = v.coats.find((x) => x.coatIndex === coatIndex)!;
  const film = c.measuredFilmUm ?? c.targetFilmUm;
  return (c.areaPerPartM2 * parts * film * c.specificGravity!) / 1000 / u;
}

function post(runId: number, body: unknown) {
  return usePost(request(`/api/runs/${runId}/actual-use`, { method: "POST", body, cookie: operator }), params({ id: String(runId) }));
}

describe("actual use and the running estimate", () => {
  it("refuses 0 kg and a run that is not done, naming the field", async () => {
    const [id] = await doneRuns(1);
    const v = await actualUse(id);
    const powder = v.coats.find((c) => c.kind === "powder")!;
    const zero = await post(id, { coats: [{ coatIndex: powder.coatIndex, partsCoated: 10, kgUsed: 0 }] });
    expect(zero.status).toBe(400);
    expect(Object.keys((await zero.json()).error.fields)).toContain("coats.0.kgUsed");
    const db = await getDb();
    const open = await db.selectFrom("runs").select("id").where("status", "=", "in-progress").executeTakeFirstOrThrow();
    const notDone = await post(open.id, { coats: [{ coatIndex: powder.coatIndex, partsCoated: 10, kgUsed: 1 }] });
    expect(notDone.status).toBe(409);
    expect(await db.selectFrom("material_usage").selectAll().execute()).toHaveLength(0);
  });

  it("asks to confirm more than the run could have sprayed, then saves it", async () => {
    const [id] = await doneRuns(1);
    const v = await actualUse(id);
    const powder = v.coats.find((c) => c.kind === "powder")!;
    // utilisation 5 %: below the plausible floor of 20 %
    const body = { coats: [{ coatIndex: powder.coatIndex, partsCoated: v.quantity, kgUsed: kgFor(v, powder.coatIndex, v.quantity, 0.05) }] };
    const res = await post(id, body);
    expect(res.status).toBe(409);
    const err = (await res.json()).error;
    expect(err.fields.confirm).toBeTruthy();
    expect(err.fields["coats.0.kgUsed"]).toMatch(/more than coat/);
    const db = await getDb();
    expect(await db.selectFrom("material_usage").selectAll().execute()).toHaveLength(0);
    const ok = await post(id, { ...body, confirm: true });
    expect(ok.status).toBe(201);
    expect((await ok.json()).actualUse.coats.find((c: { coatIndex: number }) => c.coatIndex === powder.coatIndex).recorded.utilisation).toBeCloseTo(0.05, 9);
  });

  it("uses the measured utilisation after three runs, ignores an excluded run, and resets", async () => {
    const ids = await doneRuns(4);
    const first = await actualUse(ids[0]);
    const powder = first.coats.find((c) => c.kind === "powder")!;
    // hand-picked utilisations 0.6, 0.7, 0.8 (mean 0.7, s.d. 0.1) and an outlier 0.3 to exclude
    const us = [0.6, 0.7, 0.8, 0.3];
    for (const [i, id] of ids.entries()) {
      const v = await actualUse(id);
      const res = await post(id, { coats: [{ coatIndex: powder.coatIndex, partsCoated: v.quantity, kgUsed: kgFor(v, powder.coatIndex, v.quantity, us[i]) }] });
      expect(res.status).toBe(201);
    }
    const list = async () => ((await (await feedbackGet(request("/api/feedback", { cookie: supervisor }))).json()).estimates as EstimateView[]).find((e) => e.coatingId === powder.coatingId)!;
    let est = await list();
    expect(est.runs).toBe(4);
    expect(est.measured).toBeCloseTo((0.6 + 0.7 + 0.8 + 0.3) / 4, 9);
    const outlier = est.history.find((h) => Math.abs(h.utilisation - 0.3) < 1e-9)!;
    const ex = await feedbackPatch(request(`/api/feedback/${outlier.id}`, { method: "PATCH", body: { excluded: true }, cookie: supervisor }), params({ id: String(outlier.id) }));
    expect(ex.status).toBe(200);
    est = await list();
    expect(est.runs).toBe(3);
    expect(est.measured).toBeCloseTo(0.7, 9);
    expect(est.spread).toBeCloseTo(0.1, 9);
    expect(est.nominal).toBeGreaterThan(0);

    // the forecast plans that line × coating with the measured figure
    const manager = await signInAs("manager");
    const f = (await (await forecastGet(request("/api/forecast", { cookie: manager }))).json()).forecast as ForecastView;
    const d = f.coatings.find((c) => c.coatingId === powder.coatingId)!.demands.filter((x) => x.coatIndex === powder.coatIndex && x.lineName === first.lineName);
    expect(d.length).toBeGreaterThan(0);
    for (const x of d) expect(x).toMatchObject({ measured: true, utilisation: expect.closeTo(0.7, 9) });

    const reset = await resetPost(request("/api/feedback/reset", { method: "POST", body: { lineId: first.lineId, coatingId: powder.coatingId }, cookie: supervisor }));
    expect((await reset.json()).excluded).toBe(4);
    est = await list();
    expect(est).toMatchObject({ runs: 0, measured: null });
  });

  it("the operator may not exclude a run", async () => {
    const res = await feedbackPatch(request("/api/feedback/1", { method: "PATCH", body: { excluded: true }, cookie: operator }), params({ id: "1" }));
    expect(res.status).toBe(403);
  });
});
