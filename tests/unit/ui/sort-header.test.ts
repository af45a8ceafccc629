import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { sortRows } from "@/components/ui/sort-header";

// The parts and users tables sort with sortRows (they used a table library before).
// common practice, no source: natural order for codes, numbers by value, ties keep their order.
type Row = { number: string; massKg: number; at: number };
const value = (r: Row, key: "number" | "massKg") => r[key];

describe("sortRows", () => {
  it.each([
    { desc: false, expected: ["BC-9", "bc-10", "BC-100", "BC-1000"] },
    { desc: true, expected: ["BC-1000", "BC-100", "bc-10", "BC-9"] },
  ])("part numbers in natural order, ignoring case (desc: $desc)", ({ desc, expected }) => {
    const rows = ["BC-100", "BC-9", "BC-1000", "bc-10"].map((number, at) => ({ number, massKg: 0, at }));
    expect(sortRows(rows, { key: "number", desc }, value).map((r) => r.number)).toEqual(expected);
  });

  it("numbers by value, not as text; equal values keep their order either way", () => {
    const rows: Row[] = [
      { number: "a", massKg: 15.3, at: 0 },
      { number: "b", massKg: 5.53, at: 1 },
      { number: "c", massKg: 15.3, at: 2 },
      { number: "d", massKg: 100, at: 3 },
    ];
    expect(sortRows(rows, { key: "massKg", desc: false }, value).map((r) => r.number)).toEqual(["b", "a", "c", "d"]);
    expect(sortRows(rows, { key: "massKg", desc: true }, value).map((r) => r.number)).toEqual(["d", "a", "c", "b"]);
  });

  it("is a permutation in order, and leaves its input alone (fast-check)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { maxLength: 40 }), fc.boolean(), (masses, desc) => {
        const rows = masses.map((massKg, at) => ({ number: String(at), massKg, at }));
        const copy = rows.map((r) => ({ ...r }));
        const sorted = sortRows(rows, { key: "massKg", desc }, value);
        expect(rows).toEqual(copy);
        expect([...sorted].sort((a, b) => a.at - b.at)).toEqual(rows);
        for (let i = 1; i < sorted.length; i++) {
          const [p, q] = [sorted[i - 1], sorted[i]];
          expect(desc ? p.massKg >= q.massKg : p.massKg <= q.massKg).toBe(true);
          if (p.massKg === q.massKg) expect(p.at).toBeLessThan(q.at);
        }
      }),
    );
  });
});
