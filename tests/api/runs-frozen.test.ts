import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { epochToDate, nowSeconds } from "@/lib/server/coatings";
import { freezeStartedRuns, type RunDetail } from "@/lib/server/runs";
import { params, request, useSignedInDemo } from "./helpers";
import { POST as listPost } from "@/app/api/runs/route";
import { GET as oneGet } from "@/app/api/runs/[id]/route";
import { POST as statusPost } from "@/app/api/runs/[id]/status/route";

// common practice, no source: a job that has been run keeps the plan and the costs it was run
// at (job costing records cost when the work is done); later price or line changes apply to
// jobs not yet started.

const cookies = useSignedInDemo();

const inDays = (n: number) => epochToDate(nowSeconds() + n * 86_400);
const idOf = async (table: "lines" | "coatings" | "parts", column: "name" | "code" | "number", value: string) =>
  (
    await (await getDb())
      .selectFrom(table)
      .select("id")
      .where(column as never, "=", value as never)
      .executeTakeFirstOrThrow()
  ).id as number & string;

async function fenderRun(days: number) {
  return {
    partId: await idOf("parts", "number", "BC-2210"),
    quantity: 120,
    lineId: await idOf("lines", "name", "Line 1 — E-coat and powder"),
    date: inDays(days),
    shift: 1,
    clearanceMm: 50,
    orientations: "any",
    coats: [
      { coatingId: await idOf("coatings", "code", "EC-200"), filmUm: 20 },
      { coatingId: await idOf("coatings", "code", "PP-430"), filmUm: 70, firstPassEfficiency: 0.55, reclaimEfficiency: 0 },
    ],
    masking: "",
    notes: "",
  };
}

async function create(days: number): Promise<RunDetail> {
  const res = await listPost(request("/api/runs", { method: "POST", body: await fenderRun(days), cookie: cookies.supervisor }));
  expect(res.status).toBe(201);
  return (await res.json()).run;
}
const read = async (id: number): Promise<RunDetail> => {
  const res = await oneGet(request(`/api/runs/${id}`, { cookie: cookies.operator }), params({ id: String(id) }));
  expect(res.status).toBe(200);
  return (await res.json()).run;
};
const move = async (id: number, status: string) => {
  const res = await statusPost(request(`/api/runs/${id}/status`, { method: "POST", body: { status }, cookie: cookies.supervisor }), params({ id: String(id) }));
  expect(res.status).toBe(200);
  return (await res.json()).run as RunDetail;
};

/** Doubles the red powder's price and slows Line 1 to half its nominal speed. */
async function changePricesAndLine() {
  const db = await getDb();
  const powder = await db.selectFrom("coatings").select(["id", "price_per_kg"]).where("code", "=", "PP-430").executeTakeFirstOrThrow();
  await db.updateTable("coatings").set({ price_per_kg: powder.price_per_kg * 2 }).where("id", "=", powder.id).execute();
  const line = await db.selectFrom("lines").select(["id", "line_speed_nominal_m_per_min", "line_speed_min_m_per_min"]).where("name", "=", "Line 1 — E-coat and powder").executeTakeFirstOrThrow();
  const slower = Math.max(line.line_speed_min_m_per_min ?? 0, line.line_speed_nominal_m_per_min! / 2);
  await db.updateTable("lines").set({ line_speed_nominal_m_per_min: slower }).where("id", "=", line.id).execute();
  return { oldPrice: powder.price_per_kg };
}

describe("a run keeps its plan once started", () => {
  it("a started run keeps its cost and line time when prices and the line change; a planned one follows them", async () => {
    const started = await create(10);
    const waiting = await create(11);
    await move(started.id, "planned");
    const atStart = await move(started.id, "in-progress");
    expect(atStart.planFrozenAt).toBeGreaterThan(0);
    await move(waiting.id, "planned");
    const before = await read(waiting.id);
    expect(before.planFrozenAt).toBeNull();

    const { oldPrice } = await changePricesAndLine();

    const keptRun = await read(started.id);
    expect(keptRun.plan).toEqual(atStart.plan);
    const done = await move(started.id, "done");
    expect(done.plan).toEqual(atStart.plan);
    expect(done.planFrozenAt).toBe(atStart.planFrozenAt);

    // the waiting run is planned afresh: the powder's cost goes up by its kilograms × the price step
    const after = await read(waiting.id);
    const powderBefore = before.plan!.coats.find((c) => c.code === "PP-430")!;
    const powderAfter = after.plan!.coats.find((c) => c.code === "PP-430")!;
    expect(powderAfter.materialKg).toBeCloseTo(powderBefore.materialKg, 9);
    expect(powderAfter.materialCost).toBeCloseTo(powderBefore.materialCost + powderBefore.materialKg * oldPrice, 6);
    expect(after.plan!.lineTimeMin).toBeGreaterThan(before.plan!.lineTimeMin);
  });

  it("a run cancelled before it starts keeps the plan it had", async () => {
    const run = await create(10);
    const cancelled = await move(run.id, "cancelled");
    expect(cancelled.planFrozenAt).not.toBeNull();
    await changePricesAndLine();
    expect((await read(run.id)).plan).toEqual(cancelled.plan);
  });

  it("at start-up, runs past planning without a kept plan get one, once", async () => {
    const db = await getDb();
    // the demo writes its started and done runs straight into the database
    const unfrozen = await db.selectFrom("runs").select("id").where("status", "in", ["in-progress", "done", "cancelled"]).where("plan_json", "is", null).execute();
    expect(unfrozen.length).toBeGreaterThan(0);
    const planned = await db.selectFrom("runs").select("id").where("status", "in", ["draft", "planned"]).execute();
    const readBefore = await read(unfrozen[0].id);
    expect(readBefore.planFrozenAt).toBeNull();

    expect(await freezeStartedRuns()).toBe(unfrozen.length);
    expect(await freezeStartedRuns()).toBe(0);
    const kept = await read(unfrozen[0].id);
    expect(kept.planFrozenAt).not.toBeNull();
    expect(kept.plan).toEqual(readBefore.plan);
    await changePricesAndLine();
    expect((await read(unfrozen[0].id)).plan).toEqual(readBefore.plan);
    // draft and planned runs are left to follow changes
    const still = await db.selectFrom("runs").select("id").where("id", "in", planned.map((p) => p.id)).where("plan_json", "is not", null).execute();
    expect(still).toEqual([]);
  });
});
