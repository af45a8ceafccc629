import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { params, request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";
import { GET as useGet, POST as usePost } from "@/app/api/runs/[id]/actual-use/route";
import { GET as runGet } from "@/app/api/runs/[id]/route";
import type { ActualUseView } from "@/lib/server/feedback";
import type { RunDetail } from "@/lib/server/runs";

useTempDatabase();
let operator = "";
beforeEach(async () => {
  await resetDatabase();
  operator = await signInAs("operator");
}, 60_000);
afterAll(teardown);

/** Copies of the demo's in-progress Line 1 run with the given status: same line, part and powder. */
async function copies(n: number, status: "done" | "planned"): Promise<number[]> {
  const db = await getDb();
  const src = await db.selectFrom("runs").selectAll().where("status", "=", "in-progress").orderBy("id").executeTakeFirstOrThrow();
  const coats = await db.selectFrom("run_coats").selectAll().where("run_id", "=", src.id).orderBy("position").execute();
  const ids: number[] = [];
  for (let i = 0; i < n; i++) {
    const { id: _id, ...row } = src;
    const r = await db.insertInto("runs").values({ ...row, status }).returning("id").executeTakeFirstOrThrow();
    await db.insertInto("run_coats").values(coats.map(({ id: _c, ...c }) => ({ ...c, run_id: r.id }))).execute();
    ids.push(r.id);
  }
  return ids;
}

async function actualUse(runId: number): Promise<ActualUseView> {
  return (await (await useGet(request(`/api/runs/${runId}/actual-use`, { cookie: operator }), params({ id: String(runId) }))).json()).actualUse;
}

async function getRun(id: number): Promise<RunDetail> {
  const res = await runGet(request(`/api/runs/${id}`, { cookie: operator }), params({ id: String(id) }));
  expect(res.status).toBe(200);
  return (await res.json()).run as RunDetail;
}

/** Deposited kg of a coat over `parts` parts: area × film × SG / 1000 (Products Finishing coverage, metric form). */
function depositedKgOf(v: ActualUseView, coatIndex: number, parts: number): number {
  const c = v.coats.find((x) => x.coatIndex === coatIndex)!;
  return (c.areaPerPartM2 * parts * c.targetFilmUm * c.specificGravity!) / 1000;
}

describe("a run planned with the measured utilisation", () => {
  it("uses the nominal figure below three recorded runs and the measured one from three on", async () => {
    const done = await copies(3, "done");
    const [planned] = await copies(1, "planned");
    const first = await actualUse(done[0]);
    const powder = first.coats.find((c) => c.kind === "powder")!;
    // no film checks on the copies, so the target film is the film used for the deposited mass
    expect(powder.measuredFilmUm).toBeNull();

    // hand-picked utilisations 0.6, 0.7, 0.8: mean 0.7 once all three are recorded
    const us = [0.6, 0.7, 0.8];
    for (const [i, id] of done.entries()) {
      const v = await actualUse(id);
      const kgUsed = depositedKgOf(v, powder.coatIndex, v.quantity) / us[i];
      const res = await usePost(
        request(`/api/runs/${id}/actual-use`, { method: "POST", body: { coats: [{ coatIndex: powder.coatIndex, partsCoated: v.quantity, kgUsed }] }, cookie: operator }),
        params({ id: String(id) }),
      );
      expect(res.status).toBe(201);
      if (i === 1) {
        // two runs: still nominal
        const c = (await getRun(planned)).plan!.coats[powder.coatIndex];
        expect(c).toMatchObject({ utilizationUsed: "nominal", measuredUtilization: null });
        expect(c.materialUtilization).toBeCloseTo(c.nominalUtilization!, 12);
      }
    }

    const run = await getRun(planned);
    const c = run.plan!.coats[powder.coatIndex];
    expect(c.utilizationUsed).toBe("measured");
    expect(c.measuredUtilization).toBeCloseTo(0.7, 9);
    expect(c.measuredRuns).toBe(3);
    expect(c.materialUtilization).toBeCloseTo(0.7, 9);
    // nominal from the coat's own first-pass and reclaim: η / (1 − r(1 − η)) (derived, REFERENCES.md powder)
    const fpe = run.coats[powder.coatIndex].firstPassEfficiency!;
    const r = run.coats[powder.coatIndex].reclaimEfficiency ?? 0;
    expect(c.nominalUtilization).toBeCloseTo(fpe / (1 - r * (1 - fpe)), 12);
    // powder sprayed = deposited ÷ measured utilisation (transfer efficiency by weight)
    expect(c.materialKg).toBeCloseTo(depositedKgOf(first, powder.coatIndex, run.quantity) / 0.7, 6);
  });
});
