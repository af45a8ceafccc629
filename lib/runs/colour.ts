/**
 * Lightness of a coating's swatch, for ordering a day's runs light to dark: a booth goes from a
 * light colour to a darker one with less cleaning than the other way round (common practice, no
 * source).
 */
import { DomainError } from "../coating-math/errors";

/** "#3f6b47" or "3f6b47" (also the short "#fff") → [r, g, b] in 0–255. */
export function parseHex(hex: string): [number, number, number] {
  const m = /^#?([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(hex.trim());
  if (!m) throw new DomainError("swatchHex", `"${hex}" is not a hex colour like #3f6b47.`);
  const h = m[1].length === 3 ? [...m[1]].map((c) => c + c).join("") : m[1];
  return [0, 2, 4].map((i) => parseInt(h.slice(i, i + 2), 16)) as [number, number, number];
}

/** One sRGB channel (0–255) to linear light. */
function linear(channel8: number): number {
  const c = channel8 / 255;
  // WCAG 2.x, "relative luminance": c ≤ 0.04045 → c / 12.92, else ((c + 0.055) / 1.055)^2.4.
  // (WCAG 2.0/2.1 print 0.03928, from an sRGB draft; no 8-bit value falls between the two.)
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/**
 * Relative luminance, 0 for black to 1 for white — W3C WCAG 2.1, definition "relative luminance":
 * L = 0.2126 R + 0.7152 G + 0.0722 B of the linearised sRGB channels.
 */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHex(hex).map(linear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05), lighter over darker: 1 to 21. */
export function contrastRatio(hexA: string, hexB: string): number {
  const [a, b] = [relativeLuminance(hexA), relativeLuminance(hexB)].sort((x, y) => y - x);
  return (a + 0.05) / (b + 0.05);
}

/** Two swatches are the same colour when their hex codes match, case aside. */
export function sameColour(hexA: string, hexB: string): boolean {
  return parseHex(hexA).every((v, i) => v === parseHex(hexB)[i]);
}
