import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DomainError } from "@/lib/coating-math/errors";
import {
  applyOverrides,
  bestPerMeasure,
  throughputFigures,
  type CompareBatchOven,
  type CompareConveyorLine,
  type ComparePart,
  type ComparePowder,
  type ScenarioOverrides,
  type ThroughputFigures,
} from "@/lib/lines/throughput-compare";

/*
 * Hand working used throughout (every figure below was worked by hand / on a pocket calculator
 * from these formulas, not by running the module):
 *
 * Conveyor (REFERENCES.md "Conveyor lines and ovens"): carriers/h = speed × 60 / pitch;
 *   oven dwell = oven conveyor path / speed. Worked example: 10 ft/min at 24 in pitch → 300
 *   carriers/h; 200 ft of oven → 20 min.
 * Cure (REFERENCES.md "Cure and heat-up", Çengel ch. 4 lumped model): heat-up =
 *   τ · ln((T_air − T₀)/(T_air − T_metal)), τ = ρ c (thickness/2) / h, steel ρ 7850, c 490.
 *   1.5 mm, h 30: τ = 7850 × 490 × 0.00075 / 30 s = 1.6027083 min.
 *   Polyester schedule 190 °C/12 min, 200/10, 210/8 (Process Heating, "Ensuring Adequate Curing").
 *   Air 210 °C, start 20 °C: to 200 °C 1.6027083 × ln(190/10) = 4.7191 + 10 = 14.7191 min;
 *   to 190 °C 1.6027083 × ln(190/20) = 3.6082 + 12 = 15.6082 → 200 °C wins, 14.7191 min needed.
 *   Fastest curing speed = 60 m / 14.7191 min = 4.07634 m/min.
 * Racking: the 400 × 300 × 200 mm part hung upright (200 up) in a 500 × 1500 × 600 mm window with
 *   50 mm clearance: along travel (500 + 50) / (400 + 50) → 1, or (550)/(350) → 1; across
 *   (600 + 50)/(300 + 50) → 1 or 650/450 → 1; two footprints never fit side by side (350 + 350 +
 *   … > 550 and > 650). Tiers (1500 + 50)/(200 + 50) = 6.2 → 6. Space count 6; load 45 / 4 = 11.
 * Powder (REFERENCES.md "Powder"): coverage 1000 / (SG × film) = 1000 / (1.5 × 60) = 11.111 m²/kg
 *   (the published SG 1.5 at 60 µm example); utilisation at FPE 0.5, no reclaim = 0.5; so
 *   0.5 m² / (11.111 × 0.5) = 0.09 kg a part; at 10 a kg, 0.90 material a part.
 * Cost per part = material + line rate / parts per hour (common practice, no source).
 */
const line: CompareConveyorLine = {
  kind: "conveyor",
  name: "Test line",
  hourlyCost: 300,
  windowMm: { widthMm: 500, heightMm: 1500, depthMm: 600 },
  maxLoadKg: 45,
  lineSpeedMinMPerMin: 1,
  lineSpeedMaxMPerMin: 5,
  lineSpeedNominalMPerMin: 3,
  carrierPitchM: 0.6,
  stages: [
    { name: "Pretreat", kind: "conversion", lengthM: 8, tempC: 50 },
    { name: "Booth", kind: "powder-booth", lengthM: 6, colourChangeMin: 20 },
    { name: "Powder cure", kind: "cure-oven", lengthM: 60, tempC: 210, heatTransferCoefficientWPerM2K: 30 },
    { name: "Cool", kind: "cool", lengthM: 15 },
  ],
};

const part: ComparePart = { areaM2: 0.5, insideAreaM2: 0.1, massKg: 4, thicknessMm: 1.5, lengthMm: 400, widthMm: 300, heightMm: 200 };

const powder: ComparePowder = {
  specificGravity: 1.5,
  filmUm: 60,
  firstPassEfficiency: 0.5,
  reclaimEfficiency: 0,
  pricePerKg: 10,
  // source: Process Heating, "Ensuring Adequate Curing of Paint and Powder Coatings"
  cureSchedule: [
    { metalTempC: 190, holdMin: 12 },
    { metalTempC: 200, holdMin: 10 },
    { metalTempC: 210, holdMin: 8 },
  ],
};

const oven: CompareBatchOven = {
  kind: "batch",
  name: "Batch oven",
  hourlyCost: 65,
  windowMm: { widthMm: 1000, heightMm: 2000, depthMm: 2800 },
  maxLoadKg: 250,
  racksPerLoad: 4,
  airTempC: 200,
  heatTransferCoefficientWPerM2K: 22,
  loadMin: 12,
  unloadMin: 10,
};

const figures = (overrides: ScenarioOverrides = {}, p: Partial<ComparePart> = {}, l: CompareConveyorLine | CompareBatchOven = line) =>
  throughputFigures({ line: l, overrides, part: { ...part, ...p }, powder });

function domainField(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    if (e instanceof DomainError) return e.field;
    throw e;
  }
  throw new Error("expected a DomainError");
}

describe("throughputFigures on a conveyor line", () => {
  it("runs at the fastest speed that cures when cure dwell is the limit", () => {
    // source: hand working above. Speed 4.07634 m/min; carriers/h 4.07634 × 60 / 0.6 = 407.634
    // (REFERENCES carriers/h); parts/h × 6 = 2445.81; m²/h × 0.5 = 1222.90; dwell = 60 / 4.07634
    // = 14.7191 = the need, margin 0; powder 0.09 × 2445.81 = 220.122 kg/h;
    // cost 0.90 + 300 / 2445.81 = 0.90 + 0.122659 = 1.022659.
    const r = figures();
    expect(r.speedSource).toBe("fastest-curing");
    expect(r.lineSpeedMPerMin!).toBeCloseTo(4.07634, 5);
    expect(r.partsPerCarrier).toBe(6);
    expect(r.partsPerCarrierSource).toBe("planned");
    expect(r.rackPlan).toMatchObject({ count: 6, spaceCount: 6, limitedBy: "space" });
    expect(r.carriersPerHour).toBeCloseTo(407.634, 3);
    expect(r.partsPerHour).toBeCloseTo(2445.806, 3);
    expect(r.partsPerShift).toBeCloseTo(2445.806 * 8, 1);
    expect(r.areaM2PerHour).toBeCloseTo(1222.903, 3);
    expect(r.eCoatAreaM2PerHour).toBeNull();
    expect(r.ovenName).toBe("Powder cure");
    expect(r.ovenDwellMin).toBeCloseTo(14.7191, 4);
    expect(r.cureRequiredMin!).toBeCloseTo(14.7191, 4);
    expect(r.cureMarginMin).toBe(0);
    expect(r.cures).toBe(true);
    expect(r.powderKgPerPart).toBeCloseTo(0.09, 10);
    expect(r.powderKgPerHour).toBeCloseTo(220.1225, 3);
    expect(r.materialCostPerPart).toBeCloseTo(0.9, 10);
    expect(r.lineCostPerPart!).toBeCloseTo(0.1226590, 6);
    expect(r.costPerPart!).toBeCloseTo(1.0226590, 6);
    expect(r.limit.kind).toBe("cure-dwell");
    expect(r.limit.limitSpeedMPerMin!).toBeCloseTo(4.07634, 5);
    expect(r.limit.sentence).toBe(
      "Cure dwell in Powder cure limits speed to 4.08 m/min (60 m of oven, 14.7 min needed: heat-up 4.72 min to 200 °C, hold 10 min).",
    );
  });

  it("names the line's top speed when a longer oven would cure faster than the conveyor runs", () => {
    // source: hand working. 120 m oven: fastest curing 120 / 14.7191 = 8.15 m/min > 5 m/min top
    // speed → 5 m/min; carriers/h 5 × 60 / 0.6 = 500; parts/h 3000; dwell 120 / 5 = 24 min;
    // margin 24 − 14.7191 = 9.2809; cost 0.90 + 300 / 3000 = 1.00.
    const r = figures({ ovenLengthM: 120 });
    expect(r.speedSource).toBe("line-max");
    expect(r.lineSpeedMPerMin).toBe(5);
    expect(r.carriersPerHour).toBeCloseTo(500, 9);
    expect(r.partsPerHour).toBeCloseTo(3000, 9);
    expect(r.ovenLengthM).toBe(120);
    expect(r.ovenDwellMin).toBeCloseTo(24, 9);
    expect(r.cureMarginMin!).toBeCloseTo(9.2809, 4);
    expect(r.costPerPart!).toBeCloseTo(1, 9);
    expect(r.limit.kind).toBe("line-speed");
    expect(r.limit.sentence).toBe("The conveyor's top speed limits speed to 5 m/min; Powder cure would cure at up to 8.15 m/min.");
  });

  it("reproduces the published worked example: 10 ft/min at 24 in pitch, 200 ft of oven", () => {
    // source: REFERENCES.md "Conveyor lines and ovens": 10 ft/min at 24 in pitch → 300 carriers/h;
    // 200 ft of oven path → 20 min. Exact metric: 3.048 m/min, 0.6096 m, 60.96 m (NIST SP 811 ft).
    // Margin 20 − 14.7191 = 5.2809 min (hand working above); parts/h 300 × 6 = 1800.
    const r = figures({ lineSpeedMPerMin: 3.048, carrierPitchM: 0.6096, ovenLengthM: 60.96 });
    expect(r.speedSource).toBe("scenario");
    expect(r.carriersPerHour).toBeCloseTo(300, 9);
    expect(r.partsPerHour).toBeCloseTo(1800, 9);
    expect(r.ovenDwellMin).toBeCloseTo(20, 9);
    expect(r.cureMarginMin!).toBeCloseTo(5.2809, 4);
    expect(r.cures).toBe(true);
    // 60.96 / 14.7191 = 4.1416 m/min is still below the 5 m/min top speed
    expect(r.limit.kind).toBe("cure-dwell");
    expect(r.limit.sentence).toMatch(/limits speed to 4\.14 m\/min .*; the scenario runs at 3\.05 m\/min\.$/);
  });

  it("a scenario faster than the cure allows is flagged: it does not cure", () => {
    // source: hand working. 4.5 m/min: dwell 60 / 4.5 = 13.3333 min, need 14.7191, margin −1.3857;
    // carriers/h 4.5 × 60 / 0.6 = 450; parts/h 2700.
    const r = figures({ lineSpeedMPerMin: 4.5 });
    expect(r.cures).toBe(false);
    expect(r.ovenDwellMin).toBeCloseTo(13.3333, 4);
    expect(r.cureMarginMin!).toBeCloseTo(-1.3857, 4);
    expect(r.carriersPerHour).toBeCloseTo(450, 9);
    expect(r.partsPerHour).toBeCloseTo(2700, 9);
    expect(r.limit.kind).toBe("cure-dwell");
    expect(r.limit.sentence).toBe(
      "Cure dwell in Powder cure limits speed to 4.08 m/min: at the scenario's 4.5 m/min the part gets 13.3 min of the 14.7 min needed: heat-up 4.72 min to 200 °C, hold 10 min, so it does not cure.",
    );
  });

  it.each([
    // source: hand working (lumped model, Çengel ch. 4) with the Process Heating schedule.
    // 220 °C air: to 210 °C 1.6027083 × ln(200/10) = 4.8013 + 8 = 12.8013 (to 200: 13.6904; to 190:
    // 15.0405) → fastest 60 / 12.8013 = 4.6870 m/min.
    ["220 °C air", { airTempC: 220 }, {}, 12.8013, 4.687],
    // 6 mm section: τ = 6.4108333 min; to 190 °C 6.4108333 × ln(190/20) = 14.4327 + 12 = 26.4327
    // (to 200: 28.8763) → fastest 60 / 26.4327 = 2.26992 m/min.
    ["a 6 mm section", {}, { thicknessMm: 6 }, 26.4327, 2.26992],
  ])("with %s the cure needs %d min and the line runs at %d m/min", (_name, overrides, p, needMin, speed) => {
    const r = figures(overrides as ScenarioOverrides, p as Partial<ComparePart>);
    expect(r.cureRequiredMin!).toBeCloseTo(needMin, 4);
    expect(r.lineSpeedMPerMin!).toBeCloseTo(speed, 4);
    expect(r.airTempC).toBe((overrides as ScenarioOverrides).airTempC ?? 210);
    expect(r.limit.kind).toBe("cure-dwell");
  });

  it("an oven air temperature below every schedule point cures nothing", () => {
    // source: Process Heating: cure is on metal temperature, and metal never exceeds the air.
    const r = figures({ airTempC: 185 });
    expect(r.cures).toBe(false);
    expect(r.speedSource).toBe("nominal");
    expect(r.lineSpeedMPerMin).toBe(3);
    expect(r.cureMarginMin).toBeNull();
    expect(r.limit.kind).toBe("no-cure");
  });

  it("when the load limit, not space, sets parts per carrier it is named as a further limit", () => {
    // source: hand working: 10 kg parts, 45 kg load → floor(4.5) = 4 of the 6 that fit;
    // parts/h 407.634 × 4 = 1630.54.
    const r = figures({}, { massKg: 10 });
    expect(r.partsPerCarrier).toBe(4);
    expect(r.rackPlan).toMatchObject({ count: 4, spaceCount: 6, limitedBy: "load" });
    expect(r.partsPerHour).toBeCloseTo(1630.537, 3);
    expect(r.notes).toContain("The 45 kg load limit allows 4 of the 6 parts that fit.");
  });

  it("a part that fits nowhere makes the carrier the limit; nothing comes off the line", () => {
    // source: hand working: a 600 mm footprint cannot pass a 500 mm wide window either way.
    const r = figures({}, { lengthMm: 600, widthMm: 600, heightMm: 600 });
    expect(r.partsPerCarrier).toBe(0);
    expect(r.partsPerHour).toBe(0);
    expect(r.costPerPart).toBeNull();
    expect(r.lineCostPerPart).toBeNull();
    expect(r.limit.kind).toBe("carrier-space");
    expect(r.limit.sentence).toMatch(/larger than the 500 × 1500 × 600 mm window/);
  });

  it("parts per carrier: a scenario's count wins over one typed by hand, which wins over the plan", () => {
    // source: hand working: carriers/h 407.634 (speed unchanged); × 5 = 2038.17; × 3 = 1222.90.
    const hand = throughputFigures({ line, part, powder, options: { partsPerCarrier: 5 } });
    expect(hand.partsPerCarrierSource).toBe("hand");
    expect(hand.partsPerHour).toBeCloseTo(2038.171, 3);
    expect(hand.notes[0]).toBe("5 per carrier entered by hand; the racking plan gives 6.");
    const both = throughputFigures({ line, part, powder, overrides: { partsPerCarrier: 3 }, options: { partsPerCarrier: 5 } });
    expect(both.partsPerCarrierSource).toBe("scenario");
    expect(both.partsPerHour).toBeCloseTo(1222.903, 3);
  });

  it("an e-coat line reports the e-coated area (outside + inside) per hour too", () => {
    // source: hand working: the e-coat tank is not in the cure path, so parts/h stays 2445.81;
    // (0.5 + 0.1) m² × 2445.81 = 1467.48 m²/h.
    const ecoat: CompareConveyorLine = { ...line, stages: [{ name: "E-coat tank", kind: "e-coat", lengthM: 12, tempC: 32 }, ...line.stages] };
    expect(figures({}, {}, ecoat).eCoatAreaM2PerHour!).toBeCloseTo(1467.483, 3);
  });

  it("warns when the carrier pitch is shorter than the window is wide", () => {
    // common practice, no source: neighbouring carriers closer than their width can touch.
    const r = figures({ carrierPitchM: 0.4 });
    expect(r.notes.some((n) => n.includes("closer than their 500 mm window"))).toBe(true);
  });
});

describe("throughputFigures on a batch oven", () => {
  it("uses the batch cycle from the cure and the racking plan", () => {
    // source: lib/rack batch cycle = load + heat-up + hold + unload (common practice, no source);
    // lumped heat-up (Çengel ch. 4): h 22 → τ = 7850 × 490 × 0.00075 / 22 s = 2.1855114 min; air
    // 200 °C reaches only the 190 °C point: 2.1855114 × ln(180/10) = 6.3169 + 12 = 18.3169 min.
    // Cycle 12 + 18.3169 + 10 = 40.3169 min. Rack: space ≥ 144 (3 × 6 footprints × 8 tiers in
    // 1000 × 2000 × 2800) but load 250 / 4 = 62 per rack. Parts/h 4 × 62 × 60 / 40.3169 = 369.076;
    // racks/h 240 / 40.3169 = 5.95283; loads in 8 h floor(480 / 40.3169) = 11 → 2728 parts;
    // cost 0.90 + 65 / 369.076 = 1.076116.
    const r = figures({}, {}, oven);
    expect(r.lineKind).toBe("batch");
    expect(r.partsPerCarrier).toBe(62);
    expect(r.rackPlan.limitedBy).toBe("load");
    expect(r.batchCycleMin!).toBeCloseTo(40.3169, 4);
    expect(r.ovenDwellMin).toBeCloseTo(18.3169, 4);
    expect(r.cureMarginMin).toBe(0);
    expect(r.partsPerHour).toBeCloseTo(369.0756, 4);
    expect(r.carriersPerHour).toBeCloseTo(5.95283, 5);
    expect(r.partsPerShift).toBe(2728);
    expect(r.powderKgPerHour).toBeCloseTo(33.2168, 4);
    expect(r.costPerPart!).toBeCloseTo(1.076116, 6);
    expect(r.lineSpeedMPerMin).toBeNull();
    expect(r.limit.kind).toBe("batch-cycle");
    expect(r.limit.sentence).toBe(
      "The batch cycle limits output: 40.3 min a load (load 12 min, heat-up 6.32 min to 190 °C, hold 12 min, unload 10 min) for 4 racks × 62 parts.",
    );
  });

  it("an air temperature no higher than the lowest schedule point cures nothing", () => {
    // source: Process Heating: metal never reaches the air temperature, so 190 °C air never gives 190 °C metal.
    const r = figures({ airTempC: 190 }, {}, oven);
    expect(r.cures).toBe(false);
    expect(r.partsPerHour).toBe(0);
    expect(r.costPerPart).toBeNull();
    expect(r.limit.kind).toBe("no-cure");
  });
});

describe("applyOverrides refuses what the line cannot take", () => {
  it.each([
    // common practice, no source: the speed range is the line's own, inclusive
    [{ lineSpeedMPerMin: 6 }, line, "overrides.lineSpeedMPerMin"],
    [{ lineSpeedMPerMin: 0.5 }, line, "overrides.lineSpeedMPerMin"],
    [{ partsPerCarrier: 2.5 }, line, "overrides.partsPerCarrier"],
    [{ carrierPitchM: 0 }, line, "overrides.carrierPitchM"],
    [{ ovenLengthM: -1 }, line, "overrides.ovenLengthM"],
    [{ ovenLengthM: 30 }, oven, "overrides.ovenLengthM"],
    [{ lineSpeedMPerMin: 2 }, oven, "overrides.lineSpeedMPerMin"],
    [{ ovenLengthM: 30 }, { ...line, stages: line.stages.filter((s) => s.kind !== "powder-booth") }, "overrides.ovenLengthM"],
  ] as [ScenarioOverrides, CompareConveyorLine | CompareBatchOven, string][])("%j → %s", (overrides, l, field) => {
    expect(domainField(() => applyOverrides(l, overrides))).toBe(field);
  });

  it("accepts the range's ends (inclusive) and changes only the powder cure oven", () => {
    expect(() => applyOverrides(line, { lineSpeedMPerMin: 5 })).not.toThrow();
    expect(() => applyOverrides(line, { lineSpeedMPerMin: 1 })).not.toThrow();
    const changed = applyOverrides(line, { ovenLengthM: 80, airTempC: 200 }) as CompareConveyorLine;
    expect(changed.stages.map((s) => [s.lengthM, s.tempC ?? null])).toEqual([[8, 50], [6, null], [80, 200], [15, null]]);
    expect(line.stages[2].lengthM).toBe(60);
  });
});

describe("bestPerMeasure", () => {
  const col = (v: Partial<ThroughputFigures>): ThroughputFigures =>
    ({ carriersPerHour: 100, partsPerHour: 600, areaM2PerHour: 300, cureMarginMin: 0, powderKgPerPart: 0.09, costPerPart: 1, cures: true, ...v }) as ThroughputFigures;

  it("picks the highest output and the lowest cost; a column that does not cure competes only on margin", () => {
    // common practice, no source: scrap is not output.
    const best = bestPerMeasure([
      col({ partsPerHour: 600, costPerPart: 1.2, cureMarginMin: 2 }),
      col({ partsPerHour: 900, costPerPart: 0.8, cureMarginMin: 0 }),
      col({ partsPerHour: 1200, costPerPart: 0.5, cureMarginMin: -3, cures: false }),
    ]);
    expect(best.partsPerHour).toEqual([1]);
    expect(best.costPerPart).toEqual([1]);
    expect(best.cureMarginMin).toEqual([0]);
    expect(best.carriersPerHour).toEqual([0, 1]);
  });

  it("counts ties within float tolerance and ignores columns with nothing coming off", () => {
    const best = bestPerMeasure([col({ partsPerHour: 0.1 + 0.2, costPerPart: null }), col({ partsPerHour: 0.3 }), col({ partsPerHour: 0, costPerPart: null })]);
    expect(best.partsPerHour).toEqual([0, 1]);
    expect(best.costPerPart).toEqual([1]);
    expect(bestPerMeasure([]).partsPerHour).toEqual([]);
  });
});

describe("invariants (fast-check)", () => {
  it("parts/h = carriers/h × parts per carrier, and cost per part = material + rate / parts/h", () => {
    // REFERENCES.md conveyor formula; cost per part common practice, no source
    fc.assert(
      fc.property(fc.double({ min: 1, max: 5, noNaN: true }), fc.integer({ min: 1, max: 40 }), (speed, ppc) => {
        const r = throughputFigures({ line, part, powder, overrides: { lineSpeedMPerMin: speed, partsPerCarrier: ppc } });
        expect(r.partsPerHour).toBeCloseTo(r.carriersPerHour * ppc, 6);
        expect(r.costPerPart!).toBeCloseTo(r.materialCostPerPart + line.hourlyCost / r.partsPerHour, 9);
      }),
      { numRuns: 200 },
    );
  });

  it("a longer cure oven never lowers parts per hour", () => {
    fc.assert(
      fc.property(fc.double({ min: 10, max: 300, noNaN: true }), fc.double({ min: 0, max: 100, noNaN: true }), (a, extra) => {
        const short = throughputFigures({ line, part, powder, overrides: { ovenLengthM: a } });
        const long = throughputFigures({ line, part, powder, overrides: { ovenLengthM: a + extra } });
        expect(long.partsPerHour).toBeGreaterThanOrEqual(short.partsPerHour * (1 - 1e-12));
      }),
      { numRuns: 200 },
    );
  });
});
