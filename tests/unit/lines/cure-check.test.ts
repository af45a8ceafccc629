import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cureCheck, cureOvenPosition, type CureCheckLine } from "@/lib/lines/cure-check";
import { interpolateCureSchedule } from "@/lib/coating-math/cure";
import { DomainError } from "@/lib/coating-math/errors";
import type { StageInput } from "@/lib/lines/stages";

/*
 * Hand working for every expected figure below (lumped model, Çengel, Heat Transfer, ch. 4):
 *   t_heat = ρ c (thickness/2) / h · ln((T_air − T₀)/(T_air − T_metal)), steel ρ 7850 kg/m³, c 490 J/kgK.
 *   h 30 W/m²K: τ(1.5 mm) = 7850 × 490 × 0.00075 / 30 = 96.1625 s = 1.602708 min; τ(6 mm) = 6.410833 min.
 *   Air 210 °C, start 20 °C: ln(190/20) = 2.251292 (to 190 °C); ln(190/10) = 2.944439 (to 200 °C).
 */
const powderLine = (ovenLengthM = 60): CureCheckLine => ({
  kind: "conveyor",
  lineSpeedMinMPerMin: 1,
  lineSpeedMaxMPerMin: 5,
  stages: [
    { name: "Pretreat", kind: "conversion", lengthM: 8, tempC: 50 },
    { name: "Dry-off", kind: "dry-off", lengthM: 10, tempC: 150, heatTransferCoefficientWPerM2K: 25 },
    { name: "Booth", kind: "powder-booth", lengthM: 6, colourChangeMin: 20 },
    { name: "Powder cure", kind: "cure-oven", lengthM: ovenLengthM, tempC: 210, heatTransferCoefficientWPerM2K: 30 },
    { name: "Cool", kind: "cool", lengthM: 15 },
  ],
});
const singlePoint = { kind: "powder" as const, cureSchedule: [{ metalTempC: 190, holdMin: 12 }] };
// source: Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings": a polyester powder
// at 10 min / 200 °C, equivalently ~8 min / 210 °C or ~12 min / 190 °C
const polyester = {
  kind: "powder" as const,
  cureSchedule: [
    { metalTempC: 190, holdMin: 12 },
    { metalTempC: 200, holdMin: 10 },
    { metalTempC: 210, holdMin: 8 },
  ],
};

describe("cureCheck on a conveyor line (60 m oven at 3 m/min = 20 min dwell)", () => {
  // source: hand working above (lumped model, Çengel ch. 4); dwell = oven path / speed (REFERENCES.md)
  //   1.5 mm: heat-up 1.602708 × 2.251292 = 3.6082; + 12 = 15.6082; margin 20 − 15.6082 = +4.39;
  //           fastest curing speed 60 / 15.6082 = 3.8441 m/min
  //   6 mm:   heat-up 14.4327; + 12 = 26.4327; margin −6.43; fastest 60 / 26.4327 = 2.2699 m/min
  it.each([
    [1.5, 3.61, 15.61, 4.39, true, 3.8441],
    [6, 14.43, 26.43, -6.43, false, 2.2699],
  ])("%d mm steel: heat-up %d min, needs %d, margin %d, passes %s, fastest %d m/min", (thicknessMm, heatUp, needed, margin, pass, fastest) => {
    const r = cureCheck({ line: powderLine(), coating: singlePoint, thicknessMm, lineSpeedMPerMin: 3, startTempC: 20 });
    if (r.lineKind !== "conveyor") throw new Error("expected a conveyor result");
    expect(r.dwellMin).toBeCloseTo(20, 12);
    expect(r.heatUpMin!).toBeCloseTo(heatUp, 2);
    expect(r.holdMin).toBe(12);
    expect(r.requiredMin!).toBeCloseTo(needed, 2);
    expect(r.marginMin!).toBeCloseTo(margin, 2);
    expect(r.pass).toBe(pass);
    expect(r.fastestCuringSpeedMPerMin!).toBeCloseTo(fastest, 4);
    expect(r.fastestCuringSpeedInRangeMPerMin!).toBeCloseTo(fastest, 4);
    expect(r.ovenStage).toEqual({ position: 3, name: "Powder cure", lengthM: 60 });
    expect(r.reason).toMatch(pass ? /^Cures with 4\.39 min to spare/ : /^Does not cure.*short by 6\.43 min.*2\.27 m\/min or slower/);
  });

  it("picks the schedule point with the shortest heat-up + hold below the air temperature", () => {
    // source: hand working above with the Process Heating polyester schedule; 210 °C is not below the
    // 210 °C air, so it is never reachable.
    //   1.5 mm: to 190 °C 3.6082 + 12 = 15.6082; to 200 °C 1.602708 × 2.944439 = 4.7191 + 10 = 14.7191 → 200 °C
    //   6 mm:   to 190 °C 14.4327 + 12 = 26.4327; to 200 °C 18.8763 + 10 = 28.8763 → 190 °C
    const thin = cureCheck({ line: powderLine(), coating: polyester, thicknessMm: 1.5, lineSpeedMPerMin: 3 });
    const thick = cureCheck({ line: powderLine(), coating: polyester, thicknessMm: 6, lineSpeedMPerMin: 3 });
    expect(thin.curePoint).toEqual({ metalTempC: 200, holdMin: 10 });
    expect(thin.requiredMin!).toBeCloseTo(14.7191, 4);
    expect(thick.curePoint).toEqual({ metalTempC: 190, holdMin: 12 });
    expect(thick.requiredMin!).toBeCloseTo(26.4327, 4);
    expect(thin.points.map((p) => [p.metalTempC, p.totalMin === null ? null : Number(p.totalMin.toFixed(4))])).toEqual([
      [190, 15.6082],
      [200, 14.7191],
      [210, null],
    ]);
  });

  it("fails with no point when the air is not above any schedule temperature", () => {
    // source: Process Heating (cure is on metal temperature); metal never reaches the air temperature
    const cool = powderLine();
    if (cool.kind === "conveyor") (cool.stages[3] as StageInput).tempC = 185;
    const r = cureCheck({ line: cool, coating: polyester, thicknessMm: 2, lineSpeedMPerMin: 3 });
    expect(r.pass).toBe(false);
    expect(r.curePoint).toBeNull();
    expect(r.reason).toContain("not above any point");
  });

  it("says when even the slowest speed is too fast", () => {
    // hand: 20 m oven, 6 mm part needs 26.4327 min → fastest 0.7566 m/min, below the 1 m/min minimum
    const r = cureCheck({ line: powderLine(20), coating: singlePoint, thicknessMm: 6, lineSpeedMPerMin: 1 });
    if (r.lineKind !== "conveyor") throw new Error("expected a conveyor result");
    expect(r.fastestCuringSpeedMPerMin!).toBeCloseTo(20 / 26.4327, 4);
    expect(r.fastestCuringSpeedInRangeMPerMin).toBeNull();
    expect(r.reason).toContain("slowest speed");
  });

  it("caps the fastest curing speed at the line's maximum", () => {
    // hand: 1.5 mm needs 15.6082 min; a 100 m oven allows 6.41 m/min but the line tops out at 5
    const r = cureCheck({ line: powderLine(100), coating: singlePoint, thicknessMm: 1.5, lineSpeedMPerMin: 5 });
    if (r.lineKind !== "conveyor") throw new Error("expected a conveyor result");
    expect(r.fastestCuringSpeedMPerMin!).toBeCloseTo(100 / 15.6082, 3);
    expect(r.fastestCuringSpeedInRangeMPerMin).toBe(5);
    expect(r.pass).toBe(true);
  });

  it("uses the e-coat bake oven for an e-coat and the powder oven for a powder", () => {
    // common practice, no source: each coat cures in the oven that follows where it is applied
    const stages: StageInput[] = [
      { name: "E-coat tank", kind: "e-coat", lengthM: 12, tempC: 32 },
      { name: "E-coat bake", kind: "cure-oven", lengthM: 75, tempC: 215, heatTransferCoefficientWPerM2K: 35 },
      { name: "Booth", kind: "powder-booth", lengthM: 6 },
      { name: "Powder cure", kind: "cure-oven", lengthM: 60, tempC: 210, heatTransferCoefficientWPerM2K: 30 },
    ];
    expect(cureOvenPosition(stages, "e-coat")).toBe(1);
    expect(cureOvenPosition(stages, "powder")).toBe(3);
    expect(() => cureOvenPosition(stages.slice(2), "e-coat")).toThrow(/no e-coat tank stage/);
    expect(() => cureOvenPosition(stages.slice(0, 3), "powder")).toThrow(/No cure oven follows/);
  });
});

describe("cureCheck in a batch oven (cycle = load + heat-up + hold + unload)", () => {
  // source: lumped model (Çengel ch. 4), hand working: air 200 °C, h 22 W/m²K, 3 mm steel:
  //   τ = 7850 × 490 × 0.0015 / 22 = 262.26 s = 4.371023 min
  //   to 180 °C: 4.371023 × ln(180/20) = 9.6041 + 15 = 24.6041; to 190 °C: × ln(180/10) = 12.6339 + 12 = 24.6339
  //   → 180 °C; cycle 10 + 24.6041 + 10 = 44.6041 min
  const oven: CureCheckLine = { kind: "batch", airTempC: 200, heatTransferCoefficientWPerM2K: 22, loadMin: 10, unloadMin: 10 };
  const schedule = { kind: "powder" as const, cureSchedule: [{ metalTempC: 180, holdMin: 15 }, { metalTempC: 190, holdMin: 12 }] };

  it("gives the cycle from the best point", () => {
    const r = cureCheck({ line: oven, coating: schedule, thicknessMm: 3 });
    if (r.lineKind !== "batch") throw new Error("expected a batch result");
    expect(r.curePoint).toEqual({ metalTempC: 180, holdMin: 15 });
    expect(r.heatUpMin!).toBeCloseTo(9.6041, 4);
    expect(r.cycleMin!).toBeCloseTo(44.6041, 4);
    expect(r.pass).toBe(true);
  });

  it("refuses a line speed for a batch oven", () => {
    expect(() => cureCheck({ line: oven, coating: schedule, thicknessMm: 3, lineSpeedMPerMin: 2 })).toThrow(DomainError);
  });
});

describe("cureCheck refuses impossible input with the field", () => {
  it.each([
    ["a speed above the line's range", { lineSpeedMPerMin: 6 }, "lineSpeedMPerMin"],
    ["a speed below the line's range", { lineSpeedMPerMin: 0.5 }, "lineSpeedMPerMin"],
    ["no speed on a conveyor", { lineSpeedMPerMin: undefined }, "lineSpeedMPerMin"],
    ["a zero thickness", { thicknessMm: 0 }, "thicknessMm"],
  ])("%s", (_n, patch, field) => {
    try {
      cureCheck({ line: powderLine(), coating: singlePoint, thicknessMm: 2, lineSpeedMPerMin: 3, ...patch });
      expect.fail("should throw");
    } catch (e) {
      expect(e).toBeInstanceOf(DomainError);
      expect((e as DomainError).field).toBe(field);
    }
  });

  it("accepts the range's end points exactly (inclusive bounds)", () => {
    // PRODUCT.md: bounds are inclusive, compared with a small tolerance
    expect(() => cureCheck({ line: powderLine(), coating: singlePoint, thicknessMm: 2, lineSpeedMPerMin: 5 })).not.toThrow();
    expect(() => cureCheck({ line: powderLine(), coating: singlePoint, thicknessMm: 2, lineSpeedMPerMin: 1 })).not.toThrow();
  });
});

describe("cureCheck invariants", () => {
  const props = { seed: 20261202, numRuns: 200 } as const;
  it("a thicker section never needs less time, and passes only at or below the fastest curing speed", () => {
    // Çengel ch. 4: heat-up is proportional to thickness in the lumped model
    fc.assert(
      fc.property(fc.double({ min: 0.3, max: 20, noNaN: true }), fc.double({ min: 1.01, max: 4, noNaN: true }), fc.double({ min: 1, max: 5, noNaN: true }), (t, k, speed) => {
        const thin = cureCheck({ line: powderLine(), coating: polyester, thicknessMm: t, lineSpeedMPerMin: speed });
        const thick = cureCheck({ line: powderLine(), coating: polyester, thicknessMm: t * k, lineSpeedMPerMin: speed });
        expect(thick.requiredMin!).toBeGreaterThan(thin.requiredMin!);
        if (thin.lineKind === "conveyor") {
          const fastest = thin.fastestCuringSpeedMPerMin!;
          if (Math.abs(speed - fastest) > 1e-9 * fastest) expect(thin.pass).toBe(speed < fastest);
        }
      }),
      props,
    );
  });
});

describe("cure schedule interpolation (three points)", () => {
  // source: Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings": 12 min / 190 °C,
  // 10 min / 200 °C, 8 min / 210 °C; straight lines between points (common practice, no source):
  // 195 °C → 11 min, 205 °C → 9 min, 192.5 °C → 11.5 min
  it.each([
    [190, 12],
    [192.5, 11.5],
    [195, 11],
    [200, 10],
    [205, 9],
    [210, 8],
  ])("%d °C metal → %d min hold", (tempC, holdMin) => {
    expect(interpolateCureSchedule(polyester.cureSchedule, tempC)).toBeCloseTo(holdMin, 10);
  });

  it.each([[185], [215]])("refuses %d °C, outside the schedule", (tempC) => {
    expect(() => interpolateCureSchedule(polyester.cureSchedule, tempC)).toThrow(/outside the schedule \(190–210 °C\)/);
  });
});
