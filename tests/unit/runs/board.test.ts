import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { cureKey, proposeOrder, scheduleBoard, type BoardRunInput } from "../../../lib/runs/board";

const WHITE = "#f1efe8";
const RED = "#9e2f2a";
const GREEN = "#3f6b47";
const ZINC = "#8d9092";
const QUARRY = "#7a7f80";

describe("day board schedule", () => {
  // Hand-made shift of 480 min, colour change 20 min (common practice, no source: the next run
  // loads when the previous one's last carrier is loaded; a change of booth colour leaves a gap).
  const runs: BoardRunInput[] = [
    { id: 1, loadingMin: 50, lineTimeMin: 125, boothColours: [WHITE] },
    { id: 2, loadingMin: 30, lineTimeMin: 105, boothColours: [WHITE] },
    // e-coat only: does not touch the booth, so white is still in it afterwards
    { id: 3, loadingMin: 10, lineTimeMin: 85, boothColours: [] },
    { id: 4, loadingMin: 40, lineTimeMin: 115, boothColours: [RED] },
  ];

  it("starts each run when the last one is loaded, with a colour change only where the colour differs", () => {
    const s = scheduleBoard(runs, { colourChangeMin: 20, shiftMin: 480 });
    // run 1: 0 → 125; run 2: starts at 50, ends 155; run 3: starts at 80, ends 165;
    // run 4: white → red, starts at 90 + 20 = 110, ends 225.
    expect(s.slots.map((x) => [x.id, x.startMin, x.endMin, x.colourChangeBeforeMin])).toEqual([
      [1, 0, 125, 0],
      [2, 50, 155, 0],
      [3, 80, 165, 0],
      [4, 110, 225, 20],
    ]);
    expect(s.colourChanges).toEqual([{ afterRunId: 2, beforeRunId: 4, fromHex: WHITE, toHex: RED, minutes: 20 }]);
    expect(s.filledMin).toBe(225);
    expect(s.leftMin).toBe(255);
    expect(s.fits).toBe(true);
  });

  it("flags the runs that end past the shift", () => {
    const s = scheduleBoard(runs, { colourChangeMin: 20, shiftMin: 160 });
    expect(s.slots.map((x) => x.fits)).toEqual([true, true, false, false]);
    expect(s.slots.map((x) => x.overflowMin)).toEqual([0, 0, 5, 65]);
    expect(s.leftMin).toBe(-65);
    expect(s.fits).toBe(false);
  });

  it("a run that ends exactly at the end of the shift fits (\"no more than\", float tolerance)", () => {
    const s = scheduleBoard([{ id: 1, loadingMin: 0.1 * 3, lineTimeMin: 480.00000000000006, boothColours: [] }], { colourChangeMin: 0, shiftMin: 480 });
    expect(s.slots[0].fits).toBe(true);
  });

  it("property: the shift fills at least the longest run and the colour changes", () => {
    const run = fc.record({ loadingMin: fc.double({ min: 0, max: 200, noNaN: true }), extra: fc.double({ min: 0, max: 200, noNaN: true }), colour: fc.constantFrom(WHITE, RED, GREEN) });
    fc.assert(
      fc.property(fc.array(run, { minLength: 1, maxLength: 8 }), (rs) => {
        const input = rs.map((r, i) => ({ id: i + 1, loadingMin: r.loadingMin, lineTimeMin: r.loadingMin + r.extra, boothColours: [r.colour] }));
        const s = scheduleBoard(input, { colourChangeMin: 15, shiftMin: 480 });
        const loading = input.reduce((a, r) => a + r.loadingMin, 0);
        expect(s.filledMin).toBeGreaterThanOrEqual(Math.max(...input.map((r) => r.lineTimeMin)) - 1e-9);
        expect(s.filledMin).toBeGreaterThanOrEqual(loading + 15 * s.colourChanges.length - 1e-9);
        for (let i = 1; i < s.slots.length; i++) expect(s.slots[i].startMin).toBeGreaterThanOrEqual(s.slots[i - 1].startMin);
      }),
    );
  });
});

describe("proposed order", () => {
  const polyester = cureKey([{ metalTempC: 200, holdMin: 10 }, { metalTempC: 190, holdMin: 12 }]);
  const zincRich = cureKey([{ metalTempC: 180, holdMin: 15 }, { metalTempC: 200, holdMin: 10 }]);

  it("writes a schedule's points by temperature", () => {
    expect(polyester).toBe("190 °C 12 min · 200 °C 10 min");
  });

  it("a hand-made day of five runs: grouped by cure schedule, light to dark, the lightest group first", () => {
    // Luminance by hand (WCAG 2.1 formula): white 0.863, zinc grey 0.277, quarry grey 0.209,
    // green 0.120, red 0.095. Polyester group holds white → first: white, green, red; then the
    // zinc-rich group: zinc grey, quarry grey.
    const day = [
      { id: 13, cureKey: polyester, swatchHex: RED },
      { id: 14, cureKey: zincRich, swatchHex: QUARRY },
      { id: 15, cureKey: zincRich, swatchHex: ZINC },
      { id: 16, cureKey: polyester, swatchHex: WHITE },
      { id: 17, cureKey: polyester, swatchHex: GREEN },
    ];
    expect(proposeOrder(day)).toEqual([16, 17, 13, 15, 14]);
  });

  it("keeps the current order among runs of the same colour and schedule", () => {
    const day = [
      { id: 3, cureKey: polyester, swatchHex: GREEN },
      { id: 1, cureKey: polyester, swatchHex: GREEN },
      { id: 2, cureKey: polyester, swatchHex: WHITE },
    ];
    expect(proposeOrder(day)).toEqual([2, 3, 1]);
  });

  it("property: the proposal is a permutation and never has more colour changes than groups allow", () => {
    const run = fc.record({ key: fc.constantFrom("a", "b", "c"), hex: fc.constantFrom(WHITE, RED, GREEN, ZINC, QUARRY) });
    fc.assert(
      fc.property(fc.array(run, { maxLength: 12 }), (rs) => {
        const day = rs.map((r, i) => ({ id: i + 1, cureKey: r.key, swatchHex: r.hex }));
        const ids = proposeOrder(day);
        expect([...ids].sort((a, b) => a - b)).toEqual(day.map((r) => r.id));
        // each schedule's runs are contiguous
        const keys = ids.map((id) => day[id - 1].cureKey);
        const runsOfKeys = keys.filter((k, i) => i === 0 || k !== keys[i - 1]).length;
        expect(runsOfKeys).toBe(new Set(keys).size);
      }),
    );
  });
});
