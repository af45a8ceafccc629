import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/lib/geometry/errors";
import { DENSITY_KG_PER_M3, massFromVolumeKg, netCoatedAreaM2, plateMassKg, solidBoxMassKg } from "@/lib/geometry/mass";

// NIST SP 811 exact factors, typed here on purpose as the outside reference
const KG_PER_LB = 0.45359237;
const M2_PER_FT2 = 0.09290304;
const MM_PER_IN = 25.4;

describe("densities", () => {
  // source: common handbook values, from memory (carbon steel 7850, stainless 8000, aluminium 2700 kg/m³)
  it.each([
    ["steel", 7850],
    ["stainless", 8000],
    ["aluminium", 2700],
  ] as const)("%s = %i kg/m³", (material, density) => {
    expect(DENSITY_KG_PER_M3[material]).toBe(density);
    expect(massFromVolumeKg(1e-3, material)).toBeCloseTo(density / 1000, 12);
  });
});

describe("plate mass from one face and the thickness", () => {
  it("steel plate ≈ 40.8 lb per ft² per inch of thickness", () => {
    // source: steel service-centre plate tables, 40.8 lb/ft² per inch (REFERENCES.md, Parts)
    const kg = plateMassKg(M2_PER_FT2, MM_PER_IN, "steel");
    expect(kg / KG_PER_LB).toBeGreaterThan(40.8 * 0.995);
    expect(kg / KG_PER_LB).toBeLessThan(40.8 * 1.005);
  });

  it.each([
    // 1 m² x 1 mm = 0.001 m³ of metal
    [1, 1, "aluminium", 2.7],
    [0.5, 3, "steel", 11.775],
    [2, 1.5, "stainless", 24],
  ] as const)("%f m² x %f mm of %s = %f kg", (area, thickness, material, kg) => {
    expect(plateMassKg(area, thickness, material)).toBeCloseTo(kg, 12);
  });

  it("refuses negative or non-finite inputs", () => {
    expect(() => plateMassKg(-1, 2, "steel")).toThrow(GeometryError);
    expect(() => plateMassKg(1, Number.NaN, "steel")).toThrow(/thickness/);
    expect(() => massFromVolumeKg(1, "brass" as "steel")).toThrow(/Unknown material "brass"/);
  });
});

describe("coated area net of masking", () => {
  it.each([
    [1.2, 0.2, 1.0],
    [1, 0, 1],
    [1, 1, 0],
    // 0.3 - 0.1 - 0.2 style rounding must not go below zero
    [0.1 + 0.2, 0.3, 0],
  ])("%f m² - %f m² masked = %f m²", (area, masked, net) => {
    expect(netCoatedAreaM2(area, masked)).toBeCloseTo(net, 12);
    expect(netCoatedAreaM2(area, masked)).toBeGreaterThanOrEqual(0);
  });

  it("masking more than the area is refused in plain words", () => {
    try {
      netCoatedAreaM2(1, 1.5);
      expect.unreachable();
    } catch (e) {
      expect((e as GeometryError).code).toBe("masked_exceeds_area");
      expect((e as GeometryError).field).toBe("maskedAreaM2");
      expect((e as GeometryError).message).toBe("The masked area (1.5 m²) is larger than the part's area (1 m²).");
    }
  });

  it("never negative, never more than the area", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (area, share) => {
        const net = netCoatedAreaM2(area, area * share);
        expect(net).toBeGreaterThanOrEqual(0);
        expect(net).toBeLessThanOrEqual(area);
      }),
    );
  });
});

describe("solid block of the bounding box", () => {
  it("a 1 ft cube of steel at 7850 kg/m³ weighs about 490 lb", () => {
    // source: NIST SP 811 (1 ft = 0.3048 m, 1 lb = 0.45359237 kg); 0.3048³ m³ × 7850 kg/m³ = 222.28 kg = 490.05 lb
    const ft = 12 * MM_PER_IN;
    expect(solidBoxMassKg(ft, ft, ft, 7850) / KG_PER_LB).toBeCloseTo(490.05, 1);
  });

  it("a 100 mm cube: 1 L; a thin-wall estimate from 2 m² of 2 mm steel is twice what the block weighs", () => {
    // hand working: 0.1³ m³ × 7850 kg/m³ = 7.85 kg; half of 2 m² × 0.002 m × 7850 kg/m³ = 15.7 kg
    expect(solidBoxMassKg(100, 100, 100, 7850)).toBeCloseTo(7.85, 12);
    expect(plateMassKg(1, 2, "steel")).toBeCloseTo(15.7, 12);
  });

  it("refuses a negative size", () => {
    expect(() => solidBoxMassKg(-1, 1, 1, 7850)).toThrow(GeometryError);
  });
});
