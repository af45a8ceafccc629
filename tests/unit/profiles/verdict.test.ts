import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cureIndex, probeVerdict, timeAboveS, verdictReasons } from "@/lib/profiles/verdict";
import { interpolateCureSchedule } from "@/lib/coating-math/cure";
import { DomainError } from "@/lib/coating-math/errors";
import { readCsvTable } from "@/lib/profiles/csv-table";
import { mapProfile, suggestMapping } from "@/lib/profiles/mapping";
import { demoProfile, toCsv } from "./synthetic-profile";

// source: Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings": a polyester
// powder at 10 min / 200 °C, equivalently ~8 min / 210 °C or ~12 min / 190 °C
const polyester = [
  { metalTempC: 190, holdMin: 12 },
  { metalTempC: 200, holdMin: 10 },
  { metalTempC: 210, holdMin: 8 },
];

/** (minutes, °C) pairs → the verdict's inputs */
const curve = (points: [number, number][]) => ({ timeS: points.map(([m]) => m * 60), metalC: points.map(([, c]) => c) });

describe("a single-point schedule (hand working by inspection)", () => {
  // 10 min at 190 °C; above 190 °C every minute counts 1/10.
  // Curve: 20 °C → 190 °C at 5 min → 210 °C at 15 min → 190 °C at 20 min → 20 °C at 25 min.
  // At or above 190 °C from 5 to 20 min = 15 min → index 15/10 = 1.5. Peak 210 °C at 15 min.
  const c = curve([[0, 20], [5, 190], [15, 210], [20, 190], [25, 20]]);
  const v = probeVerdict({ ...c, schedule: [{ metalTempC: 190, holdMin: 10 }] });

  it("times, peak and index", () => {
    expect(v.reachedLowestAtMin).toBeCloseTo(5, 12);
    expect(v.peakC).toBe(210);
    expect(v.peakAtMin).toBe(15);
    expect(v.points[0].aboveMin).toBeCloseTo(15, 12);
    expect(v.cureIndex).toBeCloseTo(1.5, 12);
    expect(v.pass).toBe(true);
  });
});

describe("the polyester schedule on a hand-worked profile", () => {
  /*
   * Curve (min, °C): (0,20) (10,190) (12,200) (18,200) (20,215) (22,215) (25,100).
   * t_req: 12 min at 190, 10 at 200, 8 at 210, linear between, 8 above 210 (highest point's).
   * On a piece where T is linear in t and t_req linear in T, t_req is linear in t, so
   *   ∫ dt / t_req = Δt · ln(r_b / r_a) / (r_b − r_a),  or Δt / r when r is constant.
   *   0–10        below 190 (reaches it at the end)                          0
   *   10–12       190→200, r 12→10:  2 · ln(10/12) / (10 − 12)               0.1823216
   *   12–18       200, r 10:         6 / 10                                  0.6
   *   18–19.3333  200→210 (210 crossed at 18 + 2·10/15), r 10→8:
   *               1.333333 · ln(0.8) / (−2) = 1.333333 · 0.1115718          0.1487624
   *   19.3333–20  above 210, r 8:    0.666667 / 8                            0.0833333
   *   20–22       215, r 8:          2 / 8                                   0.25
   *   22–25       215→100 (−115/3 °C/min): crosses 210 at 22.130435, 200 at 22.391304, 190 at 22.652174
   *               22–22.130435 r 8:            0.130435 / 8                 0.0163043
   *               22.130435–22.391304 r 8→10:  0.260870 · ln(1.25) / 2      0.0291057
   *               22.391304–22.652174 r 10→12: 0.260870 · ln(1.2) / 2       0.0237811
   *   Σ = 1.3336084 → 133 %.
   * Time at or above 190: 10 → 22.652174 = 12.652174 min; 200: 12 → 22.391304 = 10.391304;
   * 210: 19.333333 → 22.130435 = 2.797101. Peak 215 °C first at 20 min.
   */
  const c = curve([[0, 20], [10, 190], [12, 200], [18, 200], [20, 215], [22, 215], [25, 100]]);

  it("cure index 1.33361", () => {
    expect(cureIndex(c.timeS, c.metalC, polyester)).toBeCloseTo(1.3336084, 6);
  });

  it.each([
    [190, 12.652174, true],
    [200, 10.391304, true],
    [210, 2.797101, false],
  ])("at or above %d °C for %d min (met: %s)", (tempC, minutes, met) => {
    const v = probeVerdict({ ...c, schedule: polyester });
    const p = v.points.find((x) => x.metalTempC === tempC)!;
    expect(p.aboveMin).toBeCloseTo(minutes, 5);
    expect(p.met).toBe(met);
  });

  it("reach time, peak, and the time counted at the highest point's hold", () => {
    const v = probeVerdict({ ...c, schedule: polyester, overbakeLimitC: 230 });
    expect(v.reachedLowestAtMin).toBeCloseTo(10, 9);
    expect([v.peakC, v.peakAtMin]).toEqual([215, 20]);
    expect(v.aboveHighestMin).toBeCloseTo(2.797101, 5);
    expect([v.underCured, v.overbaked, v.pass]).toEqual([false, false, true]);
    const reasons = verdictReasons(v, undefined, 20);
    expect(reasons[0]).toBe("Cured: cure index 133 %. The metal reached 190 °C after 10 min, peaked at 215 °C and spent 12.7 min at or above it.");
    expect(reasons[1]).toContain("counts at its 8 min hold (common practice, no single source)");
  });

  it("over-bake above a 212 °C limit for 2.478 min", () => {
    // 212 crossed rising at 18 + 2·12/15 = 19.6 min and falling at 22 + 3·3/115 = 22.078261 min
    const v = probeVerdict({ ...c, schedule: polyester, overbakeLimitC: 212 });
    expect(v.overbaked).toBe(true);
    expect(v.pass).toBe(false);
    expect(v.aboveOverbakeMin).toBeCloseTo(2.478261, 5);
    expect(verdictReasons(v, undefined, 2)).toContain("Over-baked: the metal peaked at 215 °C, above the 212 °C limit (highest schedule point 210 °C + 2 K margin), for 2.5 min.");
  });
});

describe("under-cure", () => {
  /*
   * Curve (min, °C): (0,20) (10,195) (14,195) (16,20).
   *   rising: 190 at 10·170/175 = 9.714286; 9.714286–10, r 12→11: 0.285714 · ln(11/12)/(11 − 12) = 0.0248604
   *   plateau 195 (r = 11): 4 / 11 = 0.3636364
   *   falling: 190 at 14 + 2·5/175 = 14.057143; 14–14.057143, r 11→12: 0.057143 · ln(12/11) = 0.0049721
   *   Σ = 0.3934689 → 39 %; 4.342857 min at or above 190 °C where 12 are needed.
   */
  it("a short soak: index 0.39347", () => {
    const v = probeVerdict({ ...curve([[0, 20], [10, 195], [14, 195], [16, 20]]), schedule: polyester });
    expect(v.cureIndex).toBeCloseTo(0.3934689, 6);
    expect(v.underCured).toBe(true);
    expect(v.points[0].aboveMin).toBeCloseTo(4.342857, 5);
    expect(verdictReasons(v)[0]).toBe(
      "Under-cured: cure index 39 %. The metal reached 190 °C after 9.7 min and peaked at 195 °C; it spent 4.3 min at or above 190 °C, where 12 min are needed.",
    );
  });

  it("never reaching the lowest point: index 0 and the reason says so", () => {
    const v = probeVerdict({ ...curve([[0, 20], [10, 185], [20, 186]]), schedule: polyester });
    expect(v.cureIndex).toBe(0);
    expect(v.reachedLowestAtMin).toBeNull();
    expect(verdictReasons(v)).toEqual(["Under-cured: the metal peaked at 186 °C and never reached 190 °C, the lowest temperature of the cure schedule (cure index 0 %)."]);
  });

  it("words temperatures in the caller's units", () => {
    const v = probeVerdict({ ...curve([[0, 20], [10, 185], [20, 186]]), schedule: polyester });
    // source: NIST SP 811 — 186 °C = 366.8 °F, 190 °C = 374 °F
    const f = { temp: (c: number) => `${Math.round((c * 9) / 5 + 32)} °F`, delta: (k: number) => `${(k * 9) / 5} °F` };
    expect(verdictReasons(v, f)[0]).toContain("peaked at 367 °F and never reached 374 °F");
  });
});

describe("cure index against the schedule's own interpolation", () => {
  // A soak at a steady T counts d / t_req(T); t_req from interpolateCureSchedule (lib/coating-math,
  // itself checked against Process Heating's schedule).
  it("property: a steady soak gives duration / interpolated hold", () => {
    fc.assert(
      fc.property(fc.double({ min: 190, max: 230, noNaN: true }), fc.double({ min: 0.5, max: 60, noNaN: true }), (tempC, minutes) => {
        const hold = interpolateCureSchedule(polyester, Math.min(tempC, 210));
        expect(cureIndex([0, minutes * 60], [tempC, tempC], polyester)).toBeCloseTo(minutes / hold, 9);
      }),
    );
  });

  it("property: stretching time by k multiplies the index by k", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 20, max: 240, noNaN: true }), { minLength: 2, maxLength: 30 }), fc.double({ min: 0.1, max: 10, noNaN: true }), (temps, k) => {
        const t = temps.map((_, i) => i * 30);
        const base = cureIndex(t, temps, polyester);
        expect(cureIndex(t.map((x) => x * k), temps, polyester)).toBeCloseTo(base * k, 6);
      }),
    );
  });

  it("property: a hotter curve never cures less (holds fall as temperature rises)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 20, max: 240, noNaN: true }), { minLength: 2, maxLength: 30 }), fc.double({ min: 0, max: 30, noNaN: true }), (temps, rise) => {
        const t = temps.map((_, i) => i * 30);
        expect(cureIndex(t, temps.map((c) => c + rise), polyester)).toBeGreaterThanOrEqual(cureIndex(t, temps, polyester) - 1e-12);
      }),
    );
  });

  it("property: time above a level never exceeds the run and falls as the level rises", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 20, max: 240, noNaN: true }), { minLength: 2, maxLength: 30 }), fc.double({ min: 20, max: 240, noNaN: true }), (temps, level) => {
        const t = temps.map((_, i) => i * 30);
        const above = timeAboveS(t, temps, level);
        expect(above).toBeGreaterThanOrEqual(0);
        expect(above).toBeLessThanOrEqual(t[t.length - 1] + 1e-9);
        expect(timeAboveS(t, temps, level + 5)).toBeLessThanOrEqual(above + 1e-9);
      }),
    );
  });
});

describe("°F and °C logger files give the same verdict", () => {
  // source: NIST SP 811 for the °F file (written as 1.8 · °C + 32, to 0.01 °F)
  const verdicts = (unit: "C" | "F") => {
    const table = readCsvTable(toCsv(demoProfile(), { unit }));
    const m = suggestMapping(table);
    const { series } = mapProfile(table, { ...m, probes: m.probes.map((p, i) => ({ ...p, thicknessMm: [1.5, 8][i] })) });
    return series!.probes.map((p) => probeVerdict({ timeS: series!.timeS, metalC: p.tempsC, schedule: polyester, overbakeLimitC: 230 }));
  };
  const c = verdicts("C");
  const f = verdicts("F");

  it.each([0, 1])("probe %d", (k) => {
    expect([f[k].pass, f[k].underCured, f[k].overbaked]).toEqual([c[k].pass, c[k].underCured, c[k].overbaked]);
    // the files are rounded to 0.01 °C and 0.01 °F: readings agree within 0.01 K
    expect(f[k].peakC).toBeCloseTo(c[k].peakC, 2);
    expect(f[k].cureIndex).toBeCloseTo(c[k].cureIndex, 3);
  });

  it("the demo's thin bracket cures and its thick base plate does not", () => {
    expect(c.map((v) => v.pass)).toEqual([true, false]);
    expect(c[1].reachedLowestAtMin).toBeNull();
  });
});

describe("impossible input", () => {
  it.each<[string, () => unknown, string]>([
    ["no schedule", () => cureIndex([0, 60], [200, 200], []), "schedule"],
    ["a zero hold", () => cureIndex([0, 60], [200, 200], [{ metalTempC: 200, holdMin: 0 }]), "schedule.0.holdMin"],
    ["a repeated temperature", () => cureIndex([0, 60], [200, 200], [{ metalTempC: 200, holdMin: 5 }, { metalTempC: 200, holdMin: 6 }]), "schedule"],
    ["times not increasing", () => cureIndex([0, 60, 60], [200, 200, 200], polyester), "timeS.2"],
    ["lists of different length", () => cureIndex([0, 60], [200], polyester), "metalC"],
    ["a single reading", () => probeVerdict({ timeS: [0], metalC: [200], schedule: polyester }), "timeS"],
    ["a non-finite temperature", () => cureIndex([0, 60], [200, Number.NaN], polyester), "metalC.1"],
  ])("%s", (_n, run, field) => {
    try {
      run();
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(DomainError);
      expect((e as DomainError).field).toBe(field);
    }
  });
});
