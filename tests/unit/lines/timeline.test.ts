import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { lineTimeline } from "@/lib/lines/timeline";
import { checkStages, type StageInput } from "@/lib/lines/stages";
import { DomainError } from "@/lib/coating-math/errors";
import { stageLengthForDwellM } from "@/lib/coating-math/line";
import { ftPerMinToMPerMin, ftToM, inToMm } from "@/lib/coating-math/units";

const FT = 0.3048; // NIST SP 811, exact

describe("lineTimeline against the published worked examples", () => {
  it("10 ft/min at 24 in pitch: 300 carriers/h; 200 ft of oven path: 20 min", () => {
    // source: REFERENCES.md, conveyor lines (derived): carriers/h = speed × 60 / pitch; dwell = path / speed
    const t = lineTimeline({
      stages: [{ name: "Cure oven", kind: "cure-oven", lengthM: ftToM(200), tempC: 200, heatTransferCoefficientWPerM2K: 30 }],
      lineSpeedMPerMin: ftPerMinToMPerMin(10),
      carrierPitchM: inToMm(24) / 1000,
    });
    expect(t.carriersPerHour!).toBeCloseTo(300, 9);
    expect(t.stages[0].dwellMin).toBeCloseTo(20, 9);
  });

  it.each([
    // source: Metal Finishing Organic Finishing Guidebook 2012: dry-off needs 3–5 min; at 4 ft/min
    // that is 12–20 ft of oven
    [3, 12],
    [5, 20],
  ])("a dry-off of %d min at 4 ft/min needs %d ft and the timeline gives that dwell back", (dwellMin, lengthFt) => {
    const speed = ftPerMinToMPerMin(4);
    expect(stageLengthForDwellM(dwellMin, speed)).toBeCloseTo(lengthFt * FT, 9);
    const t = lineTimeline({ stages: [{ name: "Dry-off", kind: "dry-off", lengthM: lengthFt * FT }], lineSpeedMPerMin: speed });
    expect(t.stages[0].dwellMin).toBeCloseTo(dwellMin, 9);
  });

  it("lays stages end to end: start of each = end of the last; total = all lengths / speed", () => {
    // hand: at 2 m/min, 9 m → 4.5 min (0–4.5), 3 m → 1.5 (4.5–6), 12 m dry-off → 6 (6–12),
    // 60 m oven → 30 (12–42); 84 m in all → 42 min; pitch 0.6 m → 2 × 60 / 0.6 = 200 carriers/h
    const stages: StageInput[] = [
      { name: "Clean", kind: "clean", lengthM: 9, tempC: 55 },
      { name: "Rinse", kind: "rinse", lengthM: 3 },
      { name: "Dry-off", kind: "dry-off", lengthM: 12, tempC: 150 },
      { name: "Cure", kind: "cure-oven", lengthM: 60, tempC: 205, heatTransferCoefficientWPerM2K: 28 },
    ];
    const t = lineTimeline({ stages, lineSpeedMPerMin: 2, carrierPitchM: 0.6 });
    expect(t.stages.map((s) => [s.startMin, s.endMin, s.dwellMin])).toEqual([
      [0, 4.5, 4.5],
      [4.5, 6, 1.5],
      [6, 12, 6],
      [12, 42, 30],
    ]);
    expect(t.totalLengthM).toBe(84);
    expect(t.totalMin).toBe(42);
    expect(t.carriersPerHour).toBeCloseTo(200, 10);
  });
});

describe("lineTimeline refuses bad lines", () => {
  it.each([
    ["an empty stage list", [], 2, undefined, "stages"],
    ["a stage of zero length", [{ name: "Rinse", kind: "rinse", lengthM: 0 }], 2, undefined, "stages.0.lengthM"],
    ["a speed outside the line's range", [{ name: "Rinse", kind: "rinse", lengthM: 3 }], 7, { lineSpeedMinMPerMin: 1, lineSpeedMaxMPerMin: 5 }, "lineSpeedMPerMin"],
  ] as const)("%s", (_n, stages, speed, speedRange, field) => {
    try {
      lineTimeline({ stages: stages as unknown as StageInput[], lineSpeedMPerMin: speed, speedRange });
      expect.fail("should throw");
    } catch (e) {
      expect(e).toBeInstanceOf(DomainError);
      expect((e as DomainError).field).toBe(field);
    }
  });

  it("checkStages names the second stage's zero length", () => {
    expect(() => checkStages([{ name: "a", kind: "clean", lengthM: 1 }, { name: "b", kind: "rinse", lengthM: 0 }])).toThrow(/stages\.1\.lengthM/);
  });
});

describe("lineTimeline invariants", () => {
  it("halving the speed doubles every dwell and the total", () => {
    // dwell = length / speed (REFERENCES.md): dwell is inversely proportional to speed
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0.1, max: 200, noNaN: true }), { minLength: 1, maxLength: 12 }), fc.double({ min: 0.2, max: 20, noNaN: true }), (lengths, speed) => {
        const stages = lengths.map((lengthM, i) => ({ name: `S${i}`, kind: "rinse" as const, lengthM }));
        const fast = lineTimeline({ stages, lineSpeedMPerMin: speed });
        const slow = lineTimeline({ stages, lineSpeedMPerMin: speed / 2 });
        expect(slow.totalMin).toBeCloseTo(2 * fast.totalMin, 6);
        slow.stages.forEach((s, i) => expect(s.dwellMin).toBeCloseTo(2 * fast.stages[i].dwellMin, 6));
        expect(fast.stages.at(-1)!.endMin).toBeCloseTo(fast.totalMin, 6);
      }),
      { seed: 20261202, numRuns: 200 },
    );
  });
});
