import { describe, expect, it } from "vitest";
import { fitHeatTransfer, simulateLumped } from "@/lib/profiles/fit";
import { DomainError } from "@/lib/coating-math/errors";
import { demoProfile, rampAir, syntheticProfile } from "./synthetic-profile";

// Steel ρ 7850 kg/m³, c 490 J/kgK (REFERENCES.md, from memory; the cure check uses the same).
const RHO_C = 7850 * 490;

describe("fitHeatTransfer recovers a known h", () => {
  // source: the lumped model (Çengel, Heat Transfer, ch. 4) integrated by RK4 in the test with a
  // known h: the fit must give it back. The brief's case: 35 W/m²K, 3 mm steel, air ramping to 200 °C.
  it("35 W/m²K, 3 mm steel, air ramping 20 → 200 °C over 5 min: within 2 %", () => {
    const p = syntheticProfile({ durationS: 1800, sampleS: 5, airC: rampAir(20, 200, 300), startC: 20, probes: [{ label: "plate", thicknessMm: 3, hWPerM2K: 35 }] });
    const fit = fitHeatTransfer({ timeS: p.timeS, airC: p.airC, metalC: p.probes[0].tempsC, thicknessMm: 3 });
    expect(Math.abs(fit.heatTransferCoefficientWPerM2K / 35 - 1)).toBeLessThan(0.02);
    // τ = ρ c L_c / h = 7850 × 490 × 0.0015 / 35 = 164.85 s = 2.7475 min
    expect(fit.timeConstantMin).toBeCloseTo(2.7475, 1);
    // the model run forward lies on the curve it was fitted to
    expect(fit.rmsK).toBeLessThan(0.1);
    expect(fit.warnings).toEqual([]);
  });

  it.each([
    [1.5, 20, 10],
    [3, 35, 5],
    [8, 24, 10],
    [6, 60, 10],
    [12, 45, 15],
  ])("%d mm at %d W/m²K, read every %d s: within 2 %", (thicknessMm, h, sampleS) => {
    const p = syntheticProfile({ durationS: 3600, sampleS, airC: rampAir(25, 210, 240), startC: 25, probes: [{ label: "p", thicknessMm, hWPerM2K: h }] });
    const fit = fitHeatTransfer({ timeS: p.timeS, airC: p.airC, metalC: p.probes[0].tempsC, thicknessMm });
    expect(Math.abs(fit.heatTransferCoefficientWPerM2K / h - 1)).toBeLessThan(0.02);
  });

  it("with ±0.5 K logger noise: within 3 % (common practice for a noisy fit, no source)", () => {
    const p = syntheticProfile({ durationS: 1800, sampleS: 5, airC: rampAir(20, 200, 300), startC: 20, noiseK: 0.5, seed: 3, probes: [{ label: "plate", thicknessMm: 3, hWPerM2K: 35 }] });
    const fit = fitHeatTransfer({ timeS: p.timeS, airC: p.airC, metalC: p.probes[0].tempsC, thicknessMm: 3 });
    expect(Math.abs(fit.heatTransferCoefficientWPerM2K / 35 - 1)).toBeLessThan(0.03);
    // the residual is about the noise: uniform ±0.5 K has an RMS of 0.5/√3 = 0.29 K
    expect(fit.rmsK).toBeLessThan(0.5);
  });

  it.each([0, 1])("the demo conveyor pass (true h 24 W/m²K), probe %d: within 3 %", (k) => {
    const p = demoProfile();
    const fit = fitHeatTransfer({ timeS: p.timeS, airC: p.airC, metalC: p.probes[k].tempsC, thicknessMm: p.probes[k].thicknessMm });
    expect(Math.abs(fit.heatTransferCoefficientWPerM2K / 24 - 1)).toBeLessThan(0.03);
  });
});

describe("the closed form on a hand-worked curve", () => {
  /*
   * Readings every 10 s: metal 20, 30, …, 80 °C (1 K/s), air 100 °C throughout; 1 mm plate, L_c = 0.5 mm.
   * Central differences at readings 1–5: dT/dt = 20 K / 20 s = 1 K/s, so y = 7850 × 490 × 0.0005 × 1 = 1923.25 W/m².
   * x = 70, 60, 50, 40, 30 K (all above 10 K).
   * h = Σ(y·x) / Σ(x²) = 1923.25 × 250 / (4900 + 3600 + 2500 + 1600 + 900) = 480812.5 / 13500 = 35.61574 W/m²K.
   */
  it("h = 35.61574 W/m²K from 5 readings", () => {
    const timeS = [0, 10, 20, 30, 40, 50, 60];
    const fit = fitHeatTransfer({ timeS, airC: timeS.map(() => 100), metalC: timeS.map((t) => 20 + t), thicknessMm: 1 });
    expect(fit.heatTransferCoefficientWPerM2K).toBeCloseTo(35.61574, 4);
    expect(fit.samplesUsed).toBe(5);
  });

  it("leaves out readings where the air leads the metal by 10 K or less", () => {
    // metal 20…95 against air 100: x = 90 − … only readings with x > 10 count (metal below 90 °C)
    const timeS = [0, 10, 20, 30, 40, 50, 60, 70, 80, 90];
    const metalC = [20, 30, 40, 50, 60, 70, 80, 90, 94, 96];
    const fit = fitHeatTransfer({ timeS, airC: timeS.map(() => 100), metalC, thicknessMm: 1 });
    // interior readings 1–8 have x = 70, 60, 50, 40, 30, 20, 10, 6: the last two are left out
    expect(fit.samplesUsed).toBe(6);
  });
});

describe("simulateLumped", () => {
  // source: Çengel, Heat Transfer, ch. 4, eq. (4-4): (T − T_air)/(T₀ − T_air) = e^(−t/τ)
  //   air 200 °C, T₀ 20 °C, τ 100 s: T(100 s) = 200 − 180 × 0.36787944 = 133.78170 °C; T(300 s) = 200 − 180 × 0.04978707 = 191.03833 °C
  it.each([
    [100, 133.7817],
    [300, 191.03833],
  ])("constant air: T(%d s) = %d °C", (t, expected) => {
    const timeS = Array.from({ length: 31 }, (_, i) => i * 10);
    const out = simulateLumped({ timeS, airC: timeS.map(() => 200), startC: 20, timeConstantS: 100 });
    expect(out[timeS.indexOf(t)]).toBeCloseTo(expected, 4);
  });

  it("agrees with a fine RK4 integration of a ramping air within 0.001 K", () => {
    // 2 mm plate at 30 W/m²K: τ = ρ c L_c / h = 3846500 × 0.001 / 30 = 128.2167 s
    const p = syntheticProfile({ durationS: 1200, sampleS: 20, airC: rampAir(20, 220, 400), startC: 20, probes: [{ label: "p", thicknessMm: 2, hWPerM2K: 30 }] });
    const out = simulateLumped({ timeS: p.timeS, airC: p.airC, startC: 20, timeConstantS: (RHO_C * 0.001) / 30 });
    out.forEach((v, i) => expect(Math.abs(v - p.probes[0].tempsC[i])).toBeLessThan(0.001));
  });
});

describe("curves that cannot be fitted", () => {
  const timeS = Array.from({ length: 20 }, (_, i) => i * 10);
  it.each<[string, number[], number[], string]>([
    ["the part never lags the air by more than 10 K", timeS.map(() => 200), timeS.map(() => 195), "Only 0 readings"],
    ["the part cools while the air is hotter (swapped columns?)", timeS.map(() => 200), timeS.map((t) => 150 - t / 10), "no positive heat-transfer coefficient"],
  ])("%s", (_n, airC, metalC, message) => {
    expect(() => fitHeatTransfer({ timeS, airC, metalC, thicknessMm: 3 })).toThrow(DomainError);
    expect(() => fitHeatTransfer({ timeS, airC, metalC, thicknessMm: 3 })).toThrow(message);
  });

  it.each<[string, () => unknown, string]>([
    ["zero thickness", () => fitHeatTransfer({ timeS, airC: timeS, metalC: timeS, thicknessMm: 0 }), "thicknessMm"],
    ["a short air list", () => fitHeatTransfer({ timeS, airC: [1], metalC: timeS, thicknessMm: 1 }), "airC"],
    ["a negative time constant", () => simulateLumped({ timeS, airC: timeS, startC: 20, timeConstantS: -1 }), "timeConstantS"],
  ])("refuses %s", (_n, run, field) => {
    try {
      run();
      expect.unreachable();
    } catch (e) {
      expect((e as DomainError).field).toBe(field);
    }
  });

  it("warns when the section is too thick for one lumped temperature (Bi ≥ 0.1, Çengel ch. 4)", () => {
    // 60 mm at 200 W/m²K: Bi = h L_c / k = 200 × 0.030 / 50 = 0.12
    const p = syntheticProfile({ durationS: 7200, sampleS: 20, airC: rampAir(20, 400, 60), startC: 20, probes: [{ label: "slab", thicknessMm: 60, hWPerM2K: 200 }] });
    const fit = fitHeatTransfer({ timeS: p.timeS, airC: p.airC, metalC: p.probes[0].tempsC, thicknessMm: 60 });
    expect(fit.biotNumber).toBeCloseTo(0.12, 2);
    expect(fit.warnings.join(" ")).toContain("Biot number");
  });
});
