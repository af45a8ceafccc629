import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { RackInputError } from "@/lib/rack/rack-error";
import { batchOvenRackingThroughput, conveyorRackingThroughput } from "@/lib/rack/throughput";

describe("conveyor: carriers/h = line speed × 60 / pitch", () => {
  it.each([
    // source: REFERENCES.md, conveyor lines worked example (derived): 10 ft/min at 24 in pitch →
    // 300 carriers/h. Units converted with mathjs, not typed-in factors.
    {
      name: "10 ft/min, 24 in centres",
      lineSpeedMPerMin: unit(10, "ft").toNumber("m"),
      carrierPitchM: unit(24, "inch").toNumber("m"),
      partsPerCarrier: 12,
      loadedFraction: 1,
      carriersPerHour: 300,
      partsPerHour: 3600,
    },
    // common practice, no source: 3 m/min · 60 / 0.5 m = 360; 90 % of carriers loaded with 8
    // parts → 360 · 8 · 0.9 = 2592 parts/h.
    {
      name: "3 m/min, 0.5 m pitch, 90 % loaded",
      lineSpeedMPerMin: 3,
      carrierPitchM: 0.5,
      partsPerCarrier: 8,
      loadedFraction: 0.9,
      carriersPerHour: 360,
      partsPerHour: 2592,
    },
  ])("$name", (row) => {
    const out = conveyorRackingThroughput(row);
    expect(out.carriersPerHour).toBeCloseTo(row.carriersPerHour, 9);
    expect(out.partsPerHour).toBeCloseTo(row.partsPerHour, 9);
  });

  it.each([
    { field: "carrierPitchM", input: { lineSpeedMPerMin: 3, carrierPitchM: 0, partsPerCarrier: 1 } },
    { field: "loadedFraction", input: { lineSpeedMPerMin: 3, carrierPitchM: 1, partsPerCarrier: 1, loadedFraction: 1.2 } },
    { field: "lineSpeedMPerMin", input: { lineSpeedMPerMin: -1, carrierPitchM: 1, partsPerCarrier: 1 } },
  ])("rejects a bad $field", ({ field, input }) => {
    expect(() => conveyorRackingThroughput(input)).toThrow(RackInputError);
    expect(() => conveyorRackingThroughput(input)).toThrow(expect.objectContaining({ field }));
  });
});

describe("batch oven: cycle = load + heat-up + hold + unload", () => {
  // common practice, no source; hand working:
  //  4 racks × 12 parts = 48 per load; cycle 10 + 25 + 20 + 10 = 65 min; 48 · 60 / 65 = 44.31/h.
  //  8 h = 480 min → 7 whole cycles (455 min) → 336 parts; 7.5 h = 450 min → 6 (390) → 288.
  //  A 60 min cycle in an 8 h shift: exactly 8 cycles, the bound inclusive → 384.
  it.each([
    { shiftLengthH: 8, holdMin: 20, cycleMin: 65, loadsPerShift: 7, partsPerShift: 336, partsPerHour: 2880 / 65 },
    { shiftLengthH: 7.5, holdMin: 20, cycleMin: 65, loadsPerShift: 6, partsPerShift: 288, partsPerHour: 2880 / 65 },
    { shiftLengthH: 8, holdMin: 15, cycleMin: 60, loadsPerShift: 8, partsPerShift: 384, partsPerHour: 48 },
  ])("$shiftLengthH h shift, $cycleMin min cycle → $partsPerShift parts", (row) => {
    const out = batchOvenRackingThroughput({
      racksPerLoad: 4,
      partsPerRack: 12,
      loadMin: 10,
      heatUpMin: 25,
      holdMin: row.holdMin,
      unloadMin: 10,
      shiftLengthH: row.shiftLengthH,
    });
    expect(out.partsPerLoad).toBe(48);
    expect(out.cycleMin).toBe(row.cycleMin);
    expect(out.loadsPerShift).toBe(row.loadsPerShift);
    expect(out.partsPerShift).toBe(row.partsPerShift);
    expect(out.partsPerHour).toBeCloseTo(row.partsPerHour, 9);
  });

  it("rejects a cycle of no time", () => {
    const zero = { racksPerLoad: 1, partsPerRack: 1, loadMin: 0, heatUpMin: 0, holdMin: 0, unloadMin: 0, shiftLengthH: 8 };
    expect(() => batchOvenRackingThroughput(zero)).toThrow(RackInputError);
  });
});
