import { describe, expect, it } from "vitest";
import { planRun } from "../../../lib/runs/plan-run";
import { maskingItems } from "../../../lib/runs/masking";
import { rackTiers, runSteps, safetyNotes } from "../../../lib/runs/sheet";
import { batchOven, benchEnd, ecoat, greenPowder, line1, line2, whiteHybrid } from "./fixtures";

const twoCoat = planRun({
  part: benchEnd,
  quantity: 100,
  line: line1,
  racking: { clearanceMm: 0, orientations: "upright" },
  coats: [
    { coating: ecoat, filmUm: 20 },
    { coating: greenPowder, filmUm: 70, firstPassEfficiency: 0.5 },
  ],
});

describe("run sheet content", () => {
  it.each([
    ["Plug the M10 holes\n\n- Cap the studs\r\n• Tape the earth tab  ", ["Plug the M10 holes", "Cap the studs", "Tape the earth tab"]],
    ["", []],
  ])("masking list %j", (text, items) => {
    expect(maskingItems(text)).toEqual(items);
  });

  it("lists the steps in the order the parts meet them, each stage with its dwell at the run's speed", () => {
    const steps = runSteps({ kind: "conveyor", stages: line1.stages }, twoCoat);
    expect(steps.slice(0, 3).map((s) => s.kind)).toEqual(["masking", "hang", "blow-off"]);
    expect(steps[steps.length - 1].kind).toBe("unload");
    const line = steps.slice(3, -1);
    expect(line.map((s) => s.stageName)).toEqual(line1.stages.map((s) => s.name));
    // dwell = stage length / line speed (REFERENCES.md): the 75 m e-coat bake at 3 m/min is 25 min
    const bake = line.find((s) => s.stageName === "E-coat bake oven")!;
    expect(bake).toMatchObject({ kind: "cure", coat: 0, dwellMin: 25, tempC: 215 });
    expect(line.find((s) => s.kind === "e-coat")).toMatchObject({ coat: 0 });
    expect(line.find((s) => s.kind === "spray")).toMatchObject({ coat: 1 });
    expect(line.find((s) => s.stageName === "Powder cure oven")).toMatchObject({ kind: "cure", coat: 1, dwellMin: 20 });
  });

  it("marks stages a run passes without using", () => {
    const powderOnly = planRun({ part: benchEnd, quantity: 10, line: line1, racking: { clearanceMm: 0, orientations: "upright" }, coats: [{ coating: greenPowder, filmUm: 70, firstPassEfficiency: 0.5 }] });
    const steps = runSteps({ kind: "conveyor", stages: line1.stages }, powderOnly);
    expect(steps.find((s) => s.kind === "e-coat")).toMatchObject({ idle: true });
    expect(steps.find((s) => s.stageName === "E-coat bake oven")).toMatchObject({ idle: true });
  });

  it("a batch-oven run: spray, load and cure per coat", () => {
    const plan = planRun({ part: benchEnd, quantity: 20, line: batchOven, racking: { clearanceMm: 20, orientations: "any" }, coats: [{ coating: whiteHybrid, filmUm: 60, firstPassEfficiency: 0.5 }] });
    expect(runSteps({ kind: "batch" }, plan).map((s) => s.kind)).toEqual(["masking", "hang", "blow-off", "pretreat", "spray", "load", "cure", "unload"]);
  });

  // REFERENCES.md, "Safety documents to point users to"
  it.each([
    ["e-coat + powder on Line 1", { kind: "conveyor" as const, stages: line1.stages }, twoCoat, ["powder", "oven", "pretreatment", "e-coat"]],
    [
      "powder on Line 2",
      { kind: "conveyor" as const, stages: line2.stages },
      planRun({ part: benchEnd, quantity: 10, line: line2, racking: { clearanceMm: 0, orientations: "upright" }, coats: [{ coating: greenPowder, filmUm: 70, firstPassEfficiency: 0.5 }] }),
      ["powder", "oven", "pretreatment"],
    ],
  ])("safety notes for %s", (_what, line, plan, topics) => {
    const notes = safetyNotes(line, plan);
    expect(notes.map((n) => n.topic)).toEqual(topics);
    const refs = notes.flatMap((n) => n.refs);
    if (topics.includes("powder")) expect(refs).toEqual(expect.arrayContaining(["NFPA 33", "NFPA 652", "NFPA 654"]));
    expect(refs).toContain("NFPA 86");
    if (topics.includes("e-coat")) expect(refs).toEqual(expect.arrayContaining(["NFPA 70E", "OSHA 29 CFR 1910.147"]));
    expect(refs).toContain("OSHA 29 CFR 1910.132");
  });

  it("groups placements into tiers by the height of their lower face", () => {
    const p = (y: number) => ({ minMm: [0, y, 0], sizeMm: [10, 10, 10] });
    expect(rackTiers([p(500), p(0), p(0), p(500.0000000001), p(250)])).toEqual([
      { bottomMm: 0, count: 2 },
      { bottomMm: 250, count: 1 },
      { bottomMm: 500, count: 2 },
    ]);
  });
});
