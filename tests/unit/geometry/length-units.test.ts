import { describe, expect, it } from "vitest";
import { M2_PER_MM2, M3_PER_MM3, MM_PER_INCH, MM_PER_M, unitFactors } from "@/lib/geometry/length-units";

// source: NIST SP 811 — 1 in = 0.0254 m exactly; SI prefix milli = 1e-3
describe("mathjs unit factors match NIST SP 811", () => {
  it.each([
    ["mm per inch", MM_PER_INCH, 25.4],
    ["mm per m", MM_PER_M, 1000],
    ["m² per mm²", M2_PER_MM2, 1e-6],
    ["m³ per mm³", M3_PER_MM3, 1e-9],
    ["m² per in²", unitFactors("in").m2PerUnit2, 6.4516e-4],
    ["m³ per in³", unitFactors("in").m3PerUnit3, 1.6387064e-5],
    ["mm per mm", unitFactors("mm").mmPerUnit, 1],
  ])("%s", (_name, actual, expected) => {
    expect(Math.abs(actual - expected)).toBeLessThanOrEqual(1e-12 * expected);
  });
});
