import { describe, expect, it } from "vitest";
import { suggestUnit } from "@/lib/geometry/unit-hint";

describe("suggestUnit", () => {
  it.each([
    // 5 mm read as mm looks like a 5-inch part: 5 x 25.4 = 127 mm (1 in = 25.4 mm, NIST SP 811)
    [{ x: 5, y: 3, z: 2 }, "mm", /only 5 mm.*inches it is 127 mm/],
    // 3 m read as inches: as mm it would be 3000 / 25.4 = 118.1 mm
    [{ x: 3000, y: 500, z: 100 }, "in", /3 m at its largest.*millimetres it is 118 mm/],
  ] as const)("%o as %s suggests the other unit", (bbox, unit, message) => {
    const hint = suggestUnit(bbox, unit);
    expect(hint).toMatch(message);
    expect(hint).toMatch(/check the unit\.$/);
  });

  it.each([
    [{ x: 120, y: 40, z: 10 }, "mm"],
    [{ x: 10, y: 1, z: 1 }, "mm"],
    [{ x: 5, y: 3, z: 2 }, "in"],
    [{ x: 2000, y: 1, z: 1 }, "in"],
    [{ x: 0, y: 0, z: 0 }, "mm"],
  ] as const)("%o as %s is plausible: no hint", (bbox, unit) => {
    expect(suggestUnit(bbox, unit)).toBeNull();
  });
});
