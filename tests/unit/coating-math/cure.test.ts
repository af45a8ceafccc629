import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  bestCurePoint,
  cureHeatUp,
  interpolateCureSchedule,
  ovenProductHeatLoad,
} from "@/lib/coating-math/cure";
import { DomainError } from "@/lib/coating-math/errors";
import { expectRelClose, propertyRuns } from "./expect-close";

const oven = {
  airTempC: 210,
  startTempC: 20,
  targetMetalTempC: 190,
  holdMin: 12,
  heatTransferCoefficientWPerM2K: 30,
  densityKgPerM3: 7850,
  specificHeatJPerKgK: 490,
  ovenDwellMin: 20,
};

describe("cureHeatUp (lumped capacitance)", () => {
  // source: Çengel, Heat Transfer, ch. 4: t = ρ c L_c / h · ln((T_air − T₀)/(T_air − T)), L_c = t/2.
  // Hand working, h 30 W/m²K, ρc = 7850 × 490 = 3 846 500 J/m³K, ln(190/20) = ln 9.5 = 2.251292:
  //   1.5 mm: L_c 0.00075 m → τ = 3 846 500 × 0.00075 / 30 = 96.1625 s = 1.602708 min;
  //           heat-up 1.602708 × 2.251292 = 3.6082 min; + 12 hold = 15.608; 20 − 15.608 = +4.39
  //   6 mm:   τ = 4 × 1.602708 = 6.410833 min; heat-up 14.4326 min; total 26.4326; 20 − 26.43 = −6.43
  //   Bi = h L_c / k = 30 × 0.00075 / 50 = 0.00045 (1.5 mm); 0.0018 (6 mm)
  it.each([
    [1.5, 1.602708, 3.61, 15.61, 4.39, 0.00045],
    [6, 6.410833, 14.43, 26.43, -6.43, 0.0018],
  ])("%d mm steel: τ %d min, heat-up %d, total %d, margin %d", (thicknessMm, tau, heatUp, total, margin, bi) => {
    const r = cureHeatUp({ ...oven, thicknessMm });
    expect(Math.abs(r.timeConstantMin - tau)).toBeLessThan(1e-6);
    expect(r.heatUpMin).toBeCloseTo(heatUp, 2);
    expect(r.totalMin).toBeCloseTo(total, 2);
    expect(r.dwellMarginMin ?? Number.NaN).toBeCloseTo(margin, 2);
    expectRelClose(r.biotNumber, bi, 1e-9);
    expect(r.warnings).toEqual([]);
  });

  it("treats a round bar through its equivalent thickness (half the diameter)", () => {
    // source: PRODUCT.md: 2·V/A of a long bar is D/2; V/A = D/4 is its L_c (Çengel, ch. 4)
    const bar = cureHeatUp({ ...oven, thicknessMm: 12 / 2 });
    const plate = cureHeatUp({ ...oven, thicknessMm: 6 });
    expect(bar.heatUpMin).toBe(plate.heatUpMin);
  });

  it("heats thin aluminium far sooner than thick steel", () => {
    // source: Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings" (qualitative);
    // aluminium ρ 2700, c 900, k 200 (from memory): τ = 2700 × 900 × 0.001 / 30 = 81 s for 2 mm
    const aluminium = cureHeatUp({
      ...oven,
      thicknessMm: 2,
      densityKgPerM3: 2700,
      specificHeatJPerKgK: 900,
      thermalConductivityWPerMK: 200,
    });
    const steel = cureHeatUp({ ...oven, thicknessMm: 10 });
    expectRelClose(aluminium.timeConstantMin, 81 / 60, 1e-12);
    expect(aluminium.heatUpMin * 3).toBeLessThan(steel.heatUpMin);
  });

  it.each([
    // Çengel, ch. 4: lumped model valid for Bi < 0.1. Bi by hand: h × (t/2 in m) / k
    [100, 100, 50, 0.1, true], // 100 × 0.05 / 50 = 0.1, at the limit → warn
    [200, 100, 50, 0.2, true],
    [60, 10, 45, 0.006666666666666667, false],
  ])("h %d, %d mm, k %d → Bi %d, warns %s", (h, thicknessMm, k, bi, warns) => {
    const r = cureHeatUp({
      ...oven,
      thicknessMm,
      heatTransferCoefficientWPerM2K: h,
      thermalConductivityWPerMK: k,
    });
    expectRelClose(r.biotNumber, bi, 1e-12);
    expect(r.warnings.length).toBe(warns ? 1 : 0);
    if (warns) expect(r.warnings[0]).toMatch(/Biot number .* at or above 0\.1/);
  });

  it("needs no heat-up when the part is already at the target", () => {
    const r = cureHeatUp({ ...oven, thicknessMm: 3, startTempC: 195 });
    expect(r.heatUpMin).toBe(0);
    expect(r.totalMin).toBe(12);
  });

  it.each([
    [{ targetMetalTempC: 210 }, "targetMetalTempC"],
    [{ targetMetalTempC: 230 }, "targetMetalTempC"],
    [{ thicknessMm: 0 }, "thicknessMm"],
    [{ heatTransferCoefficientWPerM2K: -5 }, "heatTransferCoefficientWPerM2K"],
    [{ holdMin: -1 }, "holdMin"],
    [{ airTempC: -300 }, "airTempC"],
    [{ heatTransferCoefficientWPerM2K: 1e-320 }, "heatTransferCoefficientWPerM2K"],
  ])("refuses %o naming %s", (patch, field) => {
    expect(() => cureHeatUp({ ...oven, thicknessMm: 2, ...patch })).toThrow(
      expect.objectContaining({ name: "DomainError", field }),
    );
  });

  it("says why a target at the air temperature is refused", () => {
    expect(() => cureHeatUp({ ...oven, thicknessMm: 2, targetMetalTempC: 210 })).toThrow(
      /must be below the oven air temperature/,
    );
  });
});

describe("cure schedule", () => {
  // source: Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings": a polyester
  // powder at 10 min / 200 °C ≈ 8 min / 210 °C ≈ 12 min / 190 °C. Straight lines between the
  // points are our reading (no source).
  const polyester = [
    { metalTempC: 200, holdMin: 10 },
    { metalTempC: 190, holdMin: 12 },
    { metalTempC: 210, holdMin: 8 },
  ];

  it.each([
    [190, 12],
    [195, 11],
    [200, 10],
    [205, 9],
    [207.5, 8.5],
    [210, 8],
  ])("%d °C → %d min", (tempC, holdMin) => {
    expectRelClose(interpolateCureSchedule(polyester, tempC), holdMin, 1e-12);
  });

  it.each([185, 210.5])("%d °C is outside the schedule", (tempC) => {
    expect(() => interpolateCureSchedule(polyester, tempC)).toThrow(/outside the schedule/);
  });

  it("refuses a schedule that lists a temperature twice, or none", () => {
    expect(() =>
      interpolateCureSchedule([...polyester, { metalTempC: 200, holdMin: 11 }], 200),
    ).toThrow(expect.objectContaining({ field: "points" }));
    expect(() => interpolateCureSchedule([], 200)).toThrow(DomainError);
  });

  it.each([
    // air 220 °C, start 20 °C, h 30; heat-up τ · ln(200 / (220 − T)), hold from the schedule.
    // 1.5 mm (τ 1.602708 min): 190 → 3.040 + 12 = 15.04; 200 → 3.690 + 10 = 13.69;
    //                          210 → 4.801 + 8 = 12.80 → best 210 °C
    [1.5, 220, 210, 12.80],
    // 6 mm (τ 6.410833 min):   190 → 12.162 + 12 = 24.16; 200 → 14.761 + 10 = 24.76;
    //                          210 → 19.205 + 8 = 27.21 → best 190 °C: thick steel favours a lower point
    [6, 220, 190, 24.16],
    // air 205 °C: 210 is out of reach; 1.5 mm: 190 → τ ln(185/15) = 4.028 + 12 = 16.03;
    // 200 → τ ln(185/5) = 5.787 + 10 = 15.79 → best 200 °C
    [1.5, 205, 200, 15.79],
  ])("%d mm steel in %d °C air cures best at %d °C (%d min)", (thicknessMm, airTempC, bestTemp, totalMin) => {
    const heatUp = (metalTempC: number) =>
      cureHeatUp({ ...oven, thicknessMm, airTempC, targetMetalTempC: metalTempC, holdMin: 0 }).heatUpMin;
    const best = bestCurePoint(polyester, airTempC, heatUp);
    expect(best?.metalTempC).toBe(bestTemp);
    expect(best?.totalMin ?? Number.NaN).toBeCloseTo(totalMin, 1);
  });

  it("finds no point when the air is not hotter than any", () => {
    expect(bestCurePoint(polyester, 190, () => 1)).toBeNull();
  });

  it("breaks ties toward the lower temperature", () => {
    // schedule points each totalling 15 min with a heat-up of 5
    const best = bestCurePoint(
      [
        { metalTempC: 200, holdMin: 10 },
        { metalTempC: 180, holdMin: 10 },
      ],
      250,
      () => 5,
    );
    expect(best).toEqual({ metalTempC: 180, holdMin: 10, heatUpMin: 5, totalMin: 15 });
  });
});

describe("ovenProductHeatLoad", () => {
  it("1000 lb/h of steel heated 350 °F takes 42,000 Btu/h", () => {
    // steel c ≈ 0.12 Btu/lb°F (from memory, REFERENCES.md); Q = ṁ c ΔT = 1000 × 0.12 × 350
    // = 42,000 Btu/h by hand. Metric inputs by NIST SP 811 exact factors: 1000 lb = 453.59237 kg;
    // 0.12 Btu/lb°F = 0.12 × 4186.8 = 502.416 J/kgK; 350 °F step = 350/1.8 K.
    // W: 42,000 × 0.29307107 = 12,308.985 W (NIST SP 811).
    const r = ovenProductHeatLoad({ massKgPerHour: 453.59237, specificHeatJPerKgK: 502.416, deltaTK: 350 / 1.8 });
    expectRelClose(r.btuPerHour, 42_000, 1e-12);
    expectRelClose(r.powerW, 12_308.985, 1e-8);
    expectRelClose(r.powerKw, 12.308985, 1e-8);
  });

  it("is zero for no mass and refuses negative temperature rises", () => {
    expect(ovenProductHeatLoad({ massKgPerHour: 0, specificHeatJPerKgK: 490, deltaTK: 180 }).powerW).toBe(0);
    expect(() => ovenProductHeatLoad({ massKgPerHour: 10, specificHeatJPerKgK: 490, deltaTK: -1 })).toThrow(
      expect.objectContaining({ field: "deltaTK" }),
    );
  });
});

describe("properties (fast-check)", () => {
  const inputs = fc.record({
    thicknessMm: fc.double({ min: 0.1, max: 100, noNaN: true }),
    airTempC: fc.double({ min: 100, max: 400, noNaN: true }),
    startTempC: fc.double({ min: -50, max: 40, noNaN: true }),
    targetDrop: fc.double({ min: 0.5, max: 50, noNaN: true }),
    holdMin: fc.double({ min: 0, max: 60, noNaN: true }),
    h: fc.double({ min: 5, max: 300, noNaN: true }),
  });

  it("thicker steel takes longer to heat; every output is finite", () => {
    fc.assert(
      fc.property(inputs, fc.double({ min: 1e-3, max: 5, noNaN: true }), (p, step) => {
        const base = {
          airTempC: p.airTempC,
          startTempC: p.startTempC,
          targetMetalTempC: p.airTempC - p.targetDrop,
          holdMin: p.holdMin,
          heatTransferCoefficientWPerM2K: p.h,
        };
        const thin = cureHeatUp({ ...base, thicknessMm: p.thicknessMm });
        const thick = cureHeatUp({ ...base, thicknessMm: p.thicknessMm * (1 + step) });
        expect(thick.heatUpMin).toBeGreaterThan(thin.heatUpMin);
        expect(thick.biotNumber).toBeGreaterThan(thin.biotNumber);
        for (const v of [thin.timeConstantMin, thin.heatUpMin, thin.totalMin, thin.biotNumber]) {
          expect(Number.isFinite(v)).toBe(true);
        }
      }),
      propertyRuns,
    );
  });

  it("a higher target (closer to the air) takes longer", () => {
    fc.assert(
      fc.property(inputs, fc.double({ min: 0.1, max: 0.9, noNaN: true }), (p, share) => {
        const base = {
          thicknessMm: p.thicknessMm,
          airTempC: p.airTempC,
          startTempC: p.startTempC,
          holdMin: p.holdMin,
          heatTransferCoefficientWPerM2K: p.h,
        };
        const target = p.airTempC - p.targetDrop;
        const lower = p.startTempC + share * (target - p.startTempC);
        expect(cureHeatUp({ ...base, targetMetalTempC: target }).heatUpMin).toBeGreaterThan(
          cureHeatUp({ ...base, targetMetalTempC: lower }).heatUpMin,
        );
      }),
      propertyRuns,
    );
  });
});
