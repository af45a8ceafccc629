import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DomainError } from "@/lib/coating-math/errors";
import {
  QUANTITY_UNITS,
  type QuantityKind,
  btuPerHToW,
  btuPerLbFToJPerKgK,
  celsiusToFahrenheit,
  convert,
  fahrenheitDeltaToKelvin,
  fahrenheitToCelsius,
  formatQuantity,
  formatSignificant,
  fromDisplay,
  ft2PerLbToM2PerKg,
  ft2ToM2,
  ftPerMinToMPerMin,
  ftToM,
  inToMm,
  kgToLb,
  lbPerFt2ToKgPerM2,
  lbToKg,
  m2ToFt2,
  milToUm,
  mmToIn,
  toDisplay,
  umToMil,
  usGalToL,
  wToBtuPerH,
} from "@/lib/coating-math/units";
import { expectRelClose, propertyRuns } from "./expect-close";

describe("mathjs unit definitions against exact published factors", () => {
  // mathjs prints 25.400000000000002 µm for 1 mil, so every row is compared with a tolerance.
  it.each([
    // source: 16 CFR 500.19 and NIST SP 811 (1 mil = 0.001 in = 25.4 µm, exact)
    [1, "mil", "um", 25.4, 1e-12],
    // source: 16 CFR 500.19 (1 ft² = 929.0304 cm², exact)
    [1, "sqft", "cm^2", 929.0304, 1e-12],
    [1, "ft^2", "m^2", 0.09290304, 1e-12],
    // source: NIST SP 811 (ft = 0.3048 m exact; in = 2.54 cm exact)
    [1, "ft", "m", 0.3048, 1e-12],
    [1, "inch", "mm", 25.4, 1e-12],
    // source: NIST SP 811 (avoirdupois pound = 0.45359237 kg, exact)
    [1, "lbm", "kg", 0.45359237, 1e-12],
    // source: NIST SP 811 (US liquid gallon = 231 in³ = 3.785411784 L, exact)
    [1, "gallon", "L", 3.785411784, 1e-12],
    [1, "gallon", "inch^3", 231, 1e-12],
    // source: NIST SP 811 (Btu_IT = 1055.05585262 J exact; Btu_IT/h = 0.29307107 W, 8 figures)
    [1, "BTU", "J", 1055.05585262, 1e-12],
    [1, "BTU/h", "W", 0.29307107, 1e-8],
    // source: NIST SP 811 (Btu_IT/(lb·°F) = 4186.8 J/(kg·K), exact)
    [1, "BTU/(lbm degR)", "J/(kg K)", 4186.8, 1e-12],
    // source: NIST SP 811 (t/°C = (t/°F − 32)/1.8)
    [212, "degF", "degC", 100, 1e-12],
    [392, "degF", "degC", 200, 1e-12],
    [-40, "degF", "degC", -40, 1e-12],
  ])("%d %s = %d %s", (value, from, to, expected, rel) => {
    expectRelClose(convert(value, from, to), expected, rel);
  });

  it("puts 32 °F at 0 °C (absolute tolerance: relative makes no sense at zero)", () => {
    // source: NIST SP 811
    expect(Math.abs(convert(32, "degF", "degC"))).toBeLessThan(1e-12);
  });
});

describe("named conversions", () => {
  it.each([
    // source: NIST SP 811 / 16 CFR 500.19 exact factors, worked by hand
    ["milToUm", milToUm, 3, 76.2],
    ["umToMil", umToMil, 76.2, 3],
    ["ft2ToM2", ft2ToM2, 12_500, 1161.288],
    ["m2ToFt2", m2ToFt2, 1161.288, 12_500],
    ["lbToKg", lbToKg, 50, 22.6796185],
    ["kgToLb", kgToLb, 0.45359237, 1],
    ["fahrenheitToCelsius", fahrenheitToCelsius, 400, 204.44444444444446],
    ["celsiusToFahrenheit", celsiusToFahrenheit, 190, 374],
    ["fahrenheitDeltaToKelvin", fahrenheitDeltaToKelvin, 350, 194.44444444444446],
    ["ftPerMinToMPerMin", ftPerMinToMPerMin, 10, 3.048],
    ["usGalToL", usGalToL, 55, 208.19764812],
    ["btuPerHToW", btuPerHToW, 100_000, 29_307.107],
    ["wToBtuPerH", wToBtuPerH, 29_307.107, 100_000],
    ["inToMm", inToMm, 24, 609.6],
    ["mmToIn", mmToIn, 609.6, 24],
    ["ftToM", ftToM, 200, 60.96],
    ["btuPerLbFToJPerKgK", btuPerLbFToJPerKgK, 0.12, 502.416],
    // 1 lb/ft² = 0.45359237 / 0.09290304 kg/m² = 4.882427636… (hand)
    ["lbPerFt2ToKgPerM2", lbPerFt2ToKgPerM2, 1, 4.882427636383051],
    ["ft2PerLbToM2PerKg", ft2PerLbToM2PerKg, 4.882427636383051, 1],
  ] as const)("%s(%d) = %d", (_name, fn, input, expected) => {
    // the Btu/h rows use NIST's 8-figure factor, the rest are exact
    expectRelClose(fn(input), expected, 1e-8);
  });

  it("steel plate weighs ~40.8 lb/ft² per inch of thickness at 7850 kg/m³", () => {
    // source: service-centre plate tables (40.8 lb/ft² per inch) — REFERENCES.md, "Parts"
    const kgPerM2 = 7850 * (inToMm(1) / 1000);
    expect(Math.abs(convert(kgPerM2, "kg/m^2", "lbm/ft^2") - 40.8)).toBeLessThan(0.05);
  });

  it("rejects non-finite values with a DomainError", () => {
    expect(() => convert(Number.NaN, "mil", "um")).toThrow(DomainError);
    expect(() => milToUm(Number.POSITIVE_INFINITY)).toThrow(DomainError);
  });
});

describe("display layer", () => {
  it.each([
    // hand conversions with the NIST SP 811 factors
    ["filmUm", 25.4, "us", 1, "mil"],
    ["filmUm", 60, "metric", 60, "µm"],
    ["areaM2", 1161.288, "us", 12_500, "ft²"],
    ["massKg", 22.6796185, "us", 50, "lb"],
    ["temperatureC", 200, "us", 392, "°F"],
    ["speedMPerMin", 3.048, "us", 10, "ft/min"],
    ["volumeL", 3.785411784, "us", 1, "gal"],
    ["powerW", 2500, "metric", 2.5, "kW"],
    ["powerW", 500, "metric", 500, "W"],
    ["powerW", 29_307.107, "us", 100_000, "Btu/h"],
    ["lengthMm", 609.6, "us", 24, "in"],
    ["lengthM", 60.96, "us", 200, "ft"],
    ["coverageM2PerKg", 1, "us", 4.882427636383051, "ft²/lb"],
    ["timeMin", 20, "us", 20, "min"],
  ] as const)("%s %d in %s → %d %s", (kind, metric, system, value, unit) => {
    const shown = toDisplay(kind, metric, system);
    expect(shown.unit).toBe(unit);
    expectRelClose(shown.value, value, 1e-8);
  });

  it.each([
    // hand conversions with the NIST SP 811 factors
    ["massKg", 1, "us", 0.45359237],
    ["temperatureC", 392, "us", 200],
    ["filmUm", 3, "us", 76.2],
    ["powerW", 1200, "metric", 1200],
    ["areaM2", 12.5, "metric", 12.5],
  ] as const)("fromDisplay(%s, %d, %s) = %d", (kind, value, system, metric) => {
    expectRelClose(fromDisplay(kind, value, system), metric, 1e-12);
  });

  it.each([
    // expected text worked by hand: 1000/90 = 11.111 m²/kg; × 4.8824 ft²/lb per m²/kg = 54.249
    ["coverageM2PerKg", 1000 / 90, "metric", 3, "11.1 m²/kg"],
    ["coverageM2PerKg", 1000 / 90, "us", 3, "54.2 ft²/lb"],
    ["areaM2", 1161.288, "us", 3, "12500 ft²"],
    ["temperatureC", 190, "us", 3, "374 °F"],
    ["filmUm", 25.4, "us", 3, "1 mil"],
    ["filmUm", 25.4, "metric", 3, "25.4 µm"],
    ["timeMin", 3.6081, "metric", 3, "3.61 min"],
    ["powerW", 12_308.985, "metric", 3, "12.3 kW"],
    ["massKg", 0.186, "metric", 2, "0.19 kg"],
  ] as const)("formatQuantity(%s, %d, %s, %d) = %s", (kind, metric, system, sig, text) => {
    expect(formatQuantity(kind, metric, system, sig)).toBe(text);
  });

  it.each([
    // common practice, no source: significant-figure rounding, integer digits never dropped
    [0.012345, 3, "0.0123"],
    [12_345, 3, "12345"],
    [9.996, 3, "10"],
    [-0.0001234, 2, "-0.00012"],
    [-0.00001, 1, "-0.00001"],
    [0, 3, "0"],
    [-0.0004, 1, "-0.0004"],
    [1.5, 3, "1.5"],
    [25.400000000000002, 3, "25.4"],
    [-17.777777, 3, "-17.8"],
  ])("formatSignificant(%d, %d) = %s", (value, sig, text) => {
    expect(formatSignificant(value, sig)).toBe(text);
  });

  it("never prints minus zero", () => {
    // common practice, no source
    // below 20 decimals toFixed gives "-0.000…", which must read as plain zero
    expect(formatSignificant(-1e-23, 3)).toBe("0");
    expect(formatSignificant(-0, 3)).toBe("0");
  });
});

describe("round trips (fast-check)", () => {
  const kinds = Object.keys(QUANTITY_UNITS) as QuantityKind[];

  it("fromDisplay(toDisplay(v, us), us) returns v for every kind", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...kinds),
        fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }),
        (kind, metric) => {
          const back = fromDisplay(kind, toDisplay(kind, metric, "us").value, "us");
          expect(Math.abs(back - metric)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(metric)));
        },
      ),
      propertyRuns,
    );
  });

  it("metric display keeps the value, or scales W to kW by exactly 1000", () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...kinds),
        fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }),
        (kind, metric) => {
          const shown = toDisplay(kind, metric, "metric");
          const factor = shown.unit === "kW" ? 1000 : 1;
          expect(Math.abs(shown.value * factor - metric)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(metric)));
        },
      ),
      propertyRuns,
    );
  });

  it("mil ↔ µm and °C ↔ °F round trip", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e4, max: 1e4, noNaN: true }), (x) => {
        expect(Math.abs(umToMil(milToUm(x)) - x)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(x)));
        expect(Math.abs(fahrenheitToCelsius(celsiusToFahrenheit(x)) - x)).toBeLessThanOrEqual(
          1e-9 * Math.max(1, Math.abs(x)),
        );
      }),
      propertyRuns,
    );
  });

  it("formatSignificant never prints NaN, exponents or minus zero", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e12, max: 1e12, noNaN: true }),
        fc.integer({ min: 1, max: 6 }),
        (x, sig) => {
          const text = formatSignificant(x, sig);
          expect(text).toMatch(/^-?\d+(\.\d+)?$/);
          expect(text).not.toBe("-0");
        },
      ),
      propertyRuns,
    );
  });
});
