import { describe, expect, it } from "vitest";
import { POST as planPost, type RackPlanResult } from "@/app/api/rack/plan/route";
import { ROLES } from "@/lib/server/access";
import type { Role } from "@/db/schema";
import { placementProblems, type CheckedInput } from "../unit/rack/check-placements";
import { request, useSignedInDemo } from "./helpers";

const cookies = useSignedInDemo("once");

function plan(body: unknown, role: Role = "supervisor", headers?: Record<string, string>) {
  return planPost(request("/api/rack/plan", { method: "POST", body, cookie: cookies[role], headers }));
}

async function planOk(body: CheckedInput): Promise<RackPlanResult> {
  const res = await plan(body);
  expect(res.status).toBe(200);
  const out = (await res.json()) as RackPlanResult;
  // The independent checker (tests/unit/rack) re-derives the contract's rules: inside the window,
  // no overlap, gaps ≥ clearance, allowed orientations, load limit.
  expect(placementProblems(body, out)).toEqual([]);
  return out;
}

// A 200 (length) × 100 (width) × 300 (height) mm part of 1.5 kg; a 1000 × 1000 × 100 mm window.
const part = { lengthMm: 200, widthMm: 100, heightMm: 300, massKg: 1.5 };
const window = { widthMm: 1000, heightMm: 1000, depthMm: 100, maxLoadKg: 100 };
const base: CheckedInput = { part, carrier: window, clearanceMm: 0, orientations: "upright" };

describe("POST /api/rack/plan: hand-worked plans", () => {
  it("upright, no clearance: 5 along travel × 3 tiers × 1 across = 15", async () => {
    // Hand working (common practice, no source): upright keeps the 300 mm height vertical; the
    // 100 mm depth only takes the part with its 100 mm width across, so it stands 200 along x:
    // floor(1000/200) = 5 along, floor(1000/300) = 3 tiers, 1 across → 15; 22.5 kg ≤ 100 kg.
    // The 100 mm left at the top takes nothing upright (it is 300 tall).
    const out = await planOk(base);
    expect(out).toMatchObject({ count: 15, spaceCount: 15, limitedBy: "space" });
    expect(out.blocks).toEqual([
      { orientation: { alongWidthMm: 200, alongHeightMm: 300, alongDepthMm: 100 }, grid: [5, 3, 1], count: 15, originMm: [0, 0, 0] },
    ]);
    expect(out.placements).toHaveLength(15);
    expect(out.placements[0]).toEqual({ minMm: [0, 0, 0], sizeMm: [200, 300, 100] });
    expect(out.placements[14].minMm).toEqual([800, 600, 0]);
    expect(out.reason).toBe("Space limits the carrier to 15 parts: 5 along travel × 3 tiers × 1 across, no clearance.");
  });

  it("50 mm clearance: 4 along travel × 3 tiers = 12, each part 250 mm from the next", async () => {
    // n parts with gap c need n·s + (n − 1)·c ≤ W: along x 4·200 + 3·50 = 950 ≤ 1000 (5 would
    // need 1200); up 3·300 + 2·50 = 1000 ≤ 1000 exactly (the bound is inclusive).
    const out = await planOk({ ...base, clearanceMm: 50 });
    expect(out).toMatchObject({ count: 12, limitedBy: "space" });
    expect(out.blocks.map((b) => b.grid)).toEqual([[4, 3, 1]]);
    expect(out.placements.slice(0, 4).map((p) => p.minMm)).toEqual([
      [0, 0, 0],
      [250, 0, 0],
      [500, 0, 0],
      [750, 0, 0],
    ]);
    expect(out.placements[4].minMm).toEqual([0, 350, 0]);
    expect(out.placements[11].minMm).toEqual([750, 700, 0]);
    expect(out.reason).toContain("50 mm clearance");
  });

  it("a 10 kg load limit keeps 6 of the 15 parts, lowest tier first", async () => {
    // floor(10 / 1.5) = 6: the whole bottom tier (5) and one part of the second.
    const out = await planOk({ ...base, carrier: { ...window, maxLoadKg: 10 } });
    expect(out).toMatchObject({ count: 6, spaceCount: 15, limitedBy: "load" });
    expect(out.placements.map((p) => p.minMm[1])).toEqual([0, 0, 0, 0, 0, 300]);
    expect(out.blocks[0].count).toBe(6);
    expect(out.reason).toBe("The 10 kg load limit allows 6 of the 15 parts that fit.");
  });

  it("a whole-number load: 0.3 kg of 0.1 kg parts is 3 parts, not 2", async () => {
    // 0.3 / 0.1 is 2.9999999999999996 in floating point; the limit is inclusive.
    const out = await planOk({ ...base, part: { ...part, massKg: 0.1 }, carrier: { ...window, maxLoadKg: 0.3 } });
    expect(out).toMatchObject({ count: 3, limitedBy: "load" });
  });

  it("a load limit below one part's mass is a plan of 0 with the reason, not an error", async () => {
    const out = await planOk({ ...base, carrier: { ...window, maxLoadKg: 1 } });
    expect(out).toMatchObject({ count: 0, spaceCount: 15, limitedBy: "load", blocks: [], placements: [] });
    expect(out.reason).toMatch(/1 kg load limit is below one part's mass \(1\.5 kg\)/);
  });

  it.each([
    // 2000 mm long in a 1000 mm cube: every orientation puts 2000 along some axis.
    ["any", { lengthMm: 2000, widthMm: 100, heightMm: 100, massKg: 1 }, "in every orientation"],
    ["upright", { lengthMm: 2000, widthMm: 100, heightMm: 100, massKg: 1 }, "in every upright orientation"],
  ] as const)("a part that fits nowhere (%s) is count 0 with the reason", async (mode, p, words) => {
    const out = await planOk({ part: p, carrier: { widthMm: 1000, heightMm: 1000, depthMm: 1000, maxLoadKg: 500 }, clearanceMm: 0, orientations: mode });
    expect(out).toMatchObject({ count: 0, limitedBy: "space", blocks: [], placements: [] });
    expect(out.reason).toBe(`The part (2000 × 100 × 100 mm) is larger than the 1000 × 1000 × 1000 mm window ${words}.`);
  });

  it("a 400 mm tall part in a 100 mm high window: none upright, one lying along travel", async () => {
    // 100 × 100 × 400 (height 400): only the 400 along x fits a 400 × 100 × 100 window.
    const p = { lengthMm: 100, widthMm: 100, heightMm: 400, massKg: 2 };
    const carrier = { widthMm: 400, heightMm: 100, depthMm: 100, maxLoadKg: 50 };
    const upright = await planOk({ part: p, carrier, clearanceMm: 0, orientations: "upright" });
    expect(upright.count).toBe(0);
    const lying = await planOk({ part: p, carrier, clearanceMm: 0, orientations: "any" });
    expect(lying.count).toBe(1);
    expect(lying.blocks[0].orientation).toEqual({ alongWidthMm: 400, alongHeightMm: 100, alongDepthMm: 100 });
  });

  it("a forced orientation is kept, even when it fits nothing", async () => {
    // Width along x and length across: depth 200 > 100, so nothing fits that way.
    const forced = { alongWidthMm: 100, alongHeightMm: 300, alongDepthMm: 200 };
    const out = await planOk({ ...base, orientation: forced });
    expect(out.count).toBe(0);
    expect(out.reason).toContain("in the chosen orientation");
    // In a 200 mm deep window it fits: floor(1000/100) = 10 along × 3 tiers × 1 = 30.
    const deep = await planOk({ ...base, carrier: { ...window, depthMm: 200 }, orientation: forced });
    expect(deep.blocks).toEqual([expect.objectContaining({ orientation: forced, grid: [10, 3, 1], count: 30 })]);
  });
});

describe("POST /api/rack/plan: bad input is a 400 naming the field", () => {
  it.each([
    ["a zero part length", { ...base, part: { ...part, lengthMm: 0 } }, "part.lengthMm"],
    ["a negative window depth", { ...base, carrier: { ...window, depthMm: -5 } }, "carrier.depthMm"],
    ["a zero mass", { ...base, part: { ...part, massKg: 0 } }, "part.massKg"],
    ["a zero load limit", { ...base, carrier: { ...window, maxLoadKg: 0 } }, "carrier.maxLoadKg"],
    ["a negative clearance", { ...base, clearanceMm: -1 }, "clearanceMm"],
    ["a clearance larger than the window", { ...base, clearanceMm: 1500 }, "clearanceMm"],
    ["a size sent as text", { ...base, part: { ...part, heightMm: "300" } }, "part.heightMm"],
    ["an unknown orientation mode", { ...base, orientations: "sideways" }, "orientations"],
    ["an unknown top-level field", { ...base, colour: "RAL 6005" }, "colour"],
    ["an unknown part field", { ...base, part: { ...part, areaM2: 1 } }, "part.areaM2"],
    ["a missing carrier", { part, clearanceMm: 0, orientations: "any" }, "carrier"],
    ["an upright orientation that lays the part down", { ...base, orientation: { alongWidthMm: 300, alongHeightMm: 200, alongDepthMm: 100 } }, "orientation"],
    ["an orientation that is not the part's sizes", { ...base, orientations: "any", orientation: { alongWidthMm: 250, alongHeightMm: 300, alongDepthMm: 100 } }, "orientation"],
    // 1 mm cubes in a 1 m³ window would be a billion parts: a unit mistake, refused.
    ["more than 10,000 parts on one carrier", { ...base, part: { lengthMm: 1, widthMm: 1, heightMm: 1, massKg: 0.001 }, carrier: { widthMm: 1000, heightMm: 1000, depthMm: 1000, maxLoadKg: 1e6 } }, "part"],
  ])("%s", async (_name, body, field) => {
    const res = await plan(body);
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(error.code).toBe("invalid_input");
    expect(Object.keys(error.fields)).toContain(field);
    expect(error.message).toContain(field);
  });

  it("malformed JSON is a 400 on the body", async () => {
    const res = await planPost(request("/api/rack/plan", { method: "POST", raw: "{part:", cookie: cookies.supervisor, headers: { "content-type": "application/json" } }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toHaveProperty("body");
  });
});

describe("POST /api/rack/plan: access", () => {
  it("answers 401 without a session", async () => {
    const res = await planPost(request("/api/rack/plan", { method: "POST", body: base }));
    expect(res.status).toBe(401);
    expect((await res.json()).error.code).toBe("unauthenticated");
  });

  it.each(ROLES)("answers 200 for the %s role (planning reads and stores nothing)", async (role) => {
    const res = await plan(base, role);
    expect(res.status).toBe(200);
    expect((await res.json()).count).toBe(15);
  });

  it("refuses a post from another site", async () => {
    const res = await plan(base, "supervisor", { origin: "http://elsewhere.test" });
    expect(res.status).toBe(403);
  });
});
