import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { describeFilmCheckLog, filmCheckChanges, filmText, MAX_READING_LINES, type LogContext, type StoredFilmCheck } from "@/lib/film-checks/change-log";

const ctx = (system: "metric" | "us" = "metric"): LogContext => ({
  system,
  coatLabel: (i) => `coat ${i + 1} (${["EC-200", "PP-430"][i] ?? "?"})`,
  gaugeName: (id) => (id === 1 ? "Gauge 1" : id === 2 ? "Gauge 2" : null),
});

const spot = (v: number) => [v, v, v];
const stored = (patch: Partial<StoredFilmCheck> = {}): StoredFilmCheck => ({
  coat_position: 1,
  rule: "sspc-pa2",
  spec_min_um: null,
  spec_max_um: null,
  nominal_um: null,
  gauge_id: 1,
  readings_json: JSON.stringify([[70, 70, 70, 70, 70].map(spot)]),
  notes: "",
  ...patch,
});

describe("filmText", () => {
  it.each([
    // common practice, no source: µm to one decimal
    { um: 62.04, system: "metric" as const, text: "62 µm" },
    { um: 20.87, system: "metric" as const, text: "20.9 µm" },
    // source: NIST SP 811 — 1 mil = 25.4 µm exactly: 50.8 µm = 2 mil, 63.5 µm = 2.5 mil, 21 µm = 0.8268 mil
    { um: 50.8, system: "us" as const, text: "2 mil" },
    { um: 63.5, system: "us" as const, text: "2.5 mil" },
    { um: 21, system: "us" as const, text: "0.83 mil" },
  ])("$um µm in $system → $text", ({ um, system, text }) => {
    expect(filmText(um, system)).toBe(text);
  });
});

describe("filmCheckChanges", () => {
  it("names the one reading that changed, by area, spot and reading", () => {
    const after = [[70, 70, 70, 70, 70].map(spot)];
    after[0][3][1] = 45;
    expect(filmCheckChanges(stored(), stored({ readings_json: JSON.stringify(after) }), ctx())).toEqual([
      { field: "area 1, spot 4, reading 2", from: "70 µm", to: "45 µm" },
    ]);
  });

  it("numbers ISO 19840 readings in a flat list, in mil for a US reader", () => {
    // source: NIST SP 811 — 60 µm = 2.36 mil, 76.2 µm = 3 mil
    const before = stored({ rule: "iso19840", readings_json: JSON.stringify([60, 60, 60]) });
    const after = stored({ rule: "iso19840", readings_json: JSON.stringify([60, 76.2, 60]) });
    expect(filmCheckChanges(before, after, ctx("us"))).toEqual([{ field: "reading 2", from: "2.36 mil", to: "3 mil" }]);
  });

  it("gives counts and means when the shape changes", () => {
    // 5 spots of 70 µm → one more spot of 40 µm: 18 readings, mean (15 × 70 + 3 × 40) / 18 = 1170 / 18 = 65 µm
    const after = [[...[70, 70, 70, 70, 70].map(spot), spot(40)]];
    expect(filmCheckChanges(stored(), stored({ readings_json: JSON.stringify(after) }), ctx())).toEqual([
      { field: "readings", from: "15 readings, mean 70 µm", to: "18 readings, mean 65 µm" },
    ]);
  });

  it(`collapses more than ${MAX_READING_LINES} changed readings into one line`, () => {
    // every reading +1 µm: 15 changed; mean 70 → 71
    const after = [[71, 71, 71, 71, 71].map(spot)];
    expect(filmCheckChanges(stored(), stored({ readings_json: JSON.stringify(after) }), ctx())).toEqual([
      { field: "readings (15 changed)", from: "15 readings, mean 70 µm", to: "15 readings, mean 71 µm" },
    ]);
  });

  it("says what the spec, gauge and notes were and became, in order", () => {
    const changes = filmCheckChanges(stored(), stored({ spec_min_um: 50, spec_max_um: 75, gauge_id: 7, notes: "Re-read" }), ctx());
    expect(changes).toEqual([
      { field: "spec minimum", from: "the coating's", to: "50 µm" },
      { field: "spec maximum", from: "the coating's", to: "75 µm" },
      { field: "gauge", from: "Gauge 1", to: "gauge 7 (deleted)" },
      { field: "notes", from: "none", to: "“Re-read”" },
    ]);
  });

  it("finds nothing to say between two equal versions (invariant)", () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.array(fc.integer({ min: 0, max: 5000 }), { minLength: 3, maxLength: 4 }), { minLength: 1, maxLength: 5 }), { minLength: 1, maxLength: 3 }), (areas) => {
        const v = stored({ readings_json: JSON.stringify(areas) });
        expect(filmCheckChanges(v, { ...v }, ctx())).toEqual([]);
      }),
    );
  });

  it("lists exactly the readings that differ when the shape stays (invariant)", () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 500 }), { minLength: 3, maxLength: 30 }), fc.integer({ min: 0, max: 29 }), (values, at) => {
        const i = at % values.length;
        const after = values.slice();
        after[i] = values[i] + 1;
        const changes = filmCheckChanges(stored({ rule: "iso19840", readings_json: JSON.stringify(values) }), stored({ rule: "iso19840", readings_json: JSON.stringify(after) }), ctx());
        expect(changes).toEqual([{ field: `reading ${i + 1}`, from: `${values[i]} µm`, to: `${values[i] + 1} µm` }]);
      }),
    );
  });
});

describe("describeFilmCheckLog", () => {
  it("reads a creation, an edit and a deletion as sentences", () => {
    expect(describeFilmCheckLog("create", null, stored(), ctx()).summary).toBe("Recorded coat 2 (PP-430), SSPC-PA 2: 15 readings, mean 70 µm.");
    expect(describeFilmCheckLog("update", stored(), stored({ notes: "x" }), ctx()).summary).toBe("Edited coat 2 (PP-430), SSPC-PA 2.");
    expect(describeFilmCheckLog("delete", stored(), null, ctx()).summary).toBe("Deleted coat 2 (PP-430), SSPC-PA 2 (15 readings, mean 70 µm).");
  });

  it("reads an early record that kept only the readings array", () => {
    // 20, 21, 22 → mean 21
    expect(describeFilmCheckLog("create", null, [[[20, 21, 22]]], ctx()).summary).toBe("Recorded a film check: 3 readings, mean 21 µm.");
  });
});
