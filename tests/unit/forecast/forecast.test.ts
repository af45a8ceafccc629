import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { ecoatPaintKg, forecastCoating, powderSprayedKg, type ForecastCoatingInput } from "@/lib/forecast/forecast";
import { DomainError } from "@/lib/coating-math/errors";

/*
 * Hand-worked example (common practice, no source: a FEFO stock walk done on paper).
 * 20 kg boxes, 7 days' lead time, reorder point 10 kg.
 * Lots: A 15 kg expiring day 5, B 30 kg expiring day 100. Runs: day 2 10 kg, day 6 20 kg, day 10 35 kg.
 * Open request PR-1: 20 kg arriving day 8.
 *   day 0–1  A 15 + B 30 = 45
 *   day 2    FEFO takes 10 from A → A 5, B 30 = 35
 *   day 5    A expires with 5 kg → written off; B 30 = 30
 *   day 6    20 from B → B 10 = 10 (not below the reorder point of 10)
 *   day 8    PR-1 arrives: B 10 + 20 = 30
 *   day 10   need 35: B 10 then PR-1 20 → 5 kg short: stock-out on day 10, closing 0
 *   order = shortfall 5 + reorder point 10 − closing 0 = 15 kg → ceil(15 / 20) = 1 box
 *   latest order day = 10 − 7 = 3
 */
const example: ForecastCoatingInput = {
  containerKg: 20,
  leadTimeDays: 7,
  reorderPointKg: 10,
  lots: [
    { lotNumber: "A", kgOnHand: 15, expiresDay: 5 },
    { lotNumber: "B", kgOnHand: 30, expiresDay: 100 },
  ],
  demands: [
    { day: 2, kg: 10, runId: 1 },
    { day: 6, kg: 20, runId: 2 },
    { day: 10, kg: 35, runId: 3 },
  ],
  arrivals: [{ day: 8, kg: 20, reference: "PR-1" }],
};

describe("forecastCoating, hand-worked example", () => {
  const f = forecastCoating(example, 28);
  it.each([
    ["demandKg", f.demandKg, 65],
    ["stockKg", f.stockKg, 45],
    ["incomingKg", f.incomingKg, 20],
    ["stockOutDay", f.stockOutDay, 10],
    ["shortfallKg", f.shortfallKg, 5],
    ["closingStockKg", f.closingStockKg, 0],
    ["orderKg", f.orderKg, 15],
    ["orderContainers", f.orderContainers, 1],
    ["latestOrderDay", f.latestOrderDay, 3],
  ])("%s", (_name, actual, expected) => {
    expect(actual).toBeCloseTo(expected as number, 9);
  });

  it("writes off lot A on day 5 with 5 kg left", () => {
    expect(f.expiringLots).toEqual([{ lotNumber: "A", expiresDay: 5, wastedKg: 5 }]);
  });

  it.each([
    [0, 45],
    [2, 35],
    [5, 30],
    [6, 10],
    [8, 30],
    [10, 0],
    [27, 0],
  ])("stock at the end of day %i is %f kg", (day, kg) => {
    expect(f.series[day].stockKg).toBeCloseTo(kg, 9);
  });

  it("needs nothing over the first week: closing 10 kg sits on the reorder point", () => {
    const week = forecastCoating(example, 7);
    expect(week).toMatchObject({ stockOutDay: null, reorderDay: null, orderContainers: 0, latestOrderDay: null, demandKg: 30 });
    expect(week.closingStockKg).toBeCloseTo(10, 9);
  });
});

describe("bad input", () => {
  it.each([
    ["horizonDays", 367],
    ["horizonDays", 0],
  ])("%s = %f is refused naming the field", (field, horizon) => {
    expect(() => forecastCoating(example, horizon)).toThrow(DomainError);
    try {
      forecastCoating(example, horizon);
    } catch (e) {
      expect((e as DomainError).field).toBe(field);
    }
  });
  it("a container of 0 kg is refused", () => {
    expect(() => forecastCoating({ ...example, containerKg: 0 }, 28)).toThrow(/containerKg|greater than 0/);
  });
});

describe("material per coat", () => {
  // source: Products Finishing coverage, metric m²/kg = 1000 / (SG × µm): SG 1.5, 60 µm → 11.11 m²/kg;
  // 100 m² / 11.11 = 9 kg deposited; at 60 % utilisation 9 / 0.6 = 15 kg sprayed.
  it("powder as sprayed", () => {
    expect(powderSprayedKg({ areaM2: 100, filmUm: 60, specificGravity: 1.5, utilisation: 0.6 })).toBeCloseTo(15, 9);
  });
  // derived: 4 kg solids / 0.5 weight solids = 8 kg paint; + 10 % losses = 8.8 kg
  it("e-coat paint as supplied with a loss allowance", () => {
    expect(ecoatPaintKg({ depositedSolidsKg: 4, weightSolidsFraction: 0.5, lossAllowanceFraction: 0.1 })).toBeCloseTo(8.8, 9);
  });
});

describe("invariants", () => {
  // mass balance (common practice, no source): start + arrivals = used + written off + closing + 0 shortfall offset
  it("stock + arrivals = demand met + written off + closing", () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ kg: fc.double({ min: 0, max: 500, noNaN: true }), expiresDay: fc.integer({ min: 1, max: 60 }) }), { maxLength: 4 }),
        fc.array(fc.record({ day: fc.integer({ min: 0, max: 29 }), kg: fc.double({ min: 0, max: 300, noNaN: true }) }), { maxLength: 6 }),
        (lots, demands) => {
          const f = forecastCoating(
            {
              containerKg: 25,
              leadTimeDays: 5,
              reorderPointKg: 0,
              lots: lots.map((l, i) => ({ lotNumber: `L${i}`, kgOnHand: l.kg, expiresDay: l.expiresDay })),
              demands: demands.map((d, i) => ({ ...d, runId: i })),
              arrivals: [],
            },
            30,
          );
          const wasted = f.expiringLots.reduce((a, l) => a + l.wastedKg, 0);
          const met = f.demandKg - f.shortfallKg;
          expect(f.stockKg).toBeCloseTo(met + wasted + f.closingStockKg, 6);
          // a shortfall of a few micrograms (float dust) orders nothing: compare with 1 mg tolerance
          expect(f.orderContainers * 25).toBeGreaterThanOrEqual(f.orderKg - 1e-6);
        },
      ),
      { seed: 20261202, numRuns: 300 },
    );
  });
});
