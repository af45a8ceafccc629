import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { contrastRatio, parseHex, relativeLuminance, sameColour } from "../../../lib/runs/colour";
import { DomainError } from "../../../lib/coating-math/errors";

describe("relative luminance (W3C WCAG 2.1, definition of relative luminance)", () => {
  it.each([
    // the definition's end points and its channel weights 0.2126, 0.7152, 0.0722
    ["#ffffff", 1],
    ["#000000", 0],
    ["#ff0000", 0.2126],
    ["#00ff00", 0.7152],
    ["#0000ff", 0.0722],
    ["#fff", 1],
    // sRGB 128 → ((128/255 + 0.055) / 1.055)^2.4 = 0.21586 (IEC 61966-2-1 transfer curve; hand working)
    ["#808080", 0.21586],
    // 10/255 = 0.0392 is on the linear segment: 0.0392 / 12.92 = 0.003035 (hand working)
    ["#0a0a0a", 0.003035],
  ])("%s → %f", (hex, expected) => {
    expect(relativeLuminance(hex)).toBeCloseTo(expected, 4);
  });

  it.each([
    // WCAG 2.1: black on white is the largest ratio, 21:1
    ["#000000", "#ffffff", 21],
    // #777777 on white is 4.48:1, just below AA's 4.5 (WebAIM contrast checker; commonly cited, from memory)
    ["#777777", "#ffffff", 4.48],
  ])("contrast %s / %s = %f", (a, b, ratio) => {
    expect(contrastRatio(a, b)).toBeCloseTo(ratio, 2);
  });

  it("orders the demo swatches white, grey, green, red, black (hand working)", () => {
    // Chalk White 0.863, Zinc Primer Grey 0.277, Quarry Grey 0.209, Bramble Green 0.120, Rosehip Red 0.095, Forge Black 0.019
    const swatches = ["#9e2f2a", "#23262a", "#f1efe8", "#3f6b47", "#8d9092", "#7a7f80"];
    const sorted = [...swatches].sort((a, b) => relativeLuminance(b) - relativeLuminance(a));
    expect(sorted).toEqual(["#f1efe8", "#8d9092", "#7a7f80", "#3f6b47", "#9e2f2a", "#23262a"]);
    expect(relativeLuminance("#f1efe8")).toBeCloseTo(0.8626, 3);
    expect(relativeLuminance("#9e2f2a")).toBeCloseTo(0.0947, 3);
  });

  it("property: luminance stays in [0, 1] and rises with every channel", () => {
    const channel = fc.integer({ min: 0, max: 254 });
    fc.assert(
      fc.property(channel, channel, channel, fc.integer({ min: 0, max: 2 }), (r, g, b, k) => {
        const hex = (c: number[]) => "#" + c.map((v) => v.toString(16).padStart(2, "0")).join("");
        const rgb = [r, g, b];
        const brighter = [...rgb];
        brighter[k] += 1;
        const l = relativeLuminance(hex(rgb));
        expect(l).toBeGreaterThanOrEqual(0);
        expect(l).toBeLessThanOrEqual(1);
        expect(relativeLuminance(hex(brighter))).toBeGreaterThan(l);
      }),
    );
  });

  it("reads short and long hex, any case; refuses anything else", () => {
    expect(parseHex("#3F6B47")).toEqual([63, 107, 71]);
    expect(sameColour("#ABC", "#aabbcc")).toBe(true);
    expect(() => parseHex("green")).toThrow(DomainError);
  });
});
