import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { readClockCell, readCsvTable, readNumberCell } from "@/lib/profiles/csv-table";
import { mapProfile, suggestMapping, toCelsius, type ColumnMapping } from "@/lib/profiles/mapping";
import { DomainError } from "@/lib/coating-math/errors";
import { demoProfile, toCsv } from "./synthetic-profile";

const mapping = (over: Partial<ColumnMapping> = {}): ColumnMapping => ({
  timeColumn: "Elapsed (s)",
  timeFormat: "seconds",
  temperatureUnit: "C",
  airColumn: "Air",
  probes: [
    { column: "Thin", label: "Bracket", thicknessMm: 1.5 },
    { column: "Thick", label: "", thicknessMm: 8 },
  ],
  ...over,
});

/** A small hand-written logger file: 12 readings every 30 s; the part probes warm by 60 K and more. */
function smallCsv(edit: (rows: string[][]) => void = () => {}, header = ["Elapsed (s)", "Air", "Thin", "Thick"]): string {
  const rows = Array.from({ length: 12 }, (_, i) => [String(i * 30), String(25 + 15 * i), String(22 + 10 * i), String(21 + 5 * i + 1)]);
  edit(rows);
  return [header, ...rows].map((r) => r.join(",")).join("\n");
}

describe("readCsvTable", () => {
  it("skips the logger's own lines above the header and numbers rows as the file's lines", () => {
    const csv = "Logger,SN 40217\nInterval,10 s\n\nTime (s),Air,P1\n0,20,20\n10,40,25\n";
    const t = readCsvTable(csv);
    expect(t.header).toEqual(["Time (s)", "Air", "P1"]);
    // line 4 is the header (line 3 is blank); the readings are lines 5 and 6
    expect(t.headerLine).toBe(4);
    expect(t.skippedLines).toBe(2);
    expect(t.rows.map((r) => r.line)).toEqual([5, 6]);
  });

  it("reads semicolon files with decimal commas, a byte-order mark and a trailing delimiter", () => {
    const t = readCsvTable("\uFEFFZeit;Luft;T2;\n0;20,5;19,75;\n10;40,25;21;\n");
    expect(t.delimiter).toBe(";");
    expect(t.decimalComma).toBe(true);
    expect(t.header).toEqual(["Zeit", "Luft", "T2", "Column 4"]);
    expect(readNumberCell(t.rows[0].cells[1], t.decimalComma)).toBe(20.5);
  });

  it("names duplicate and empty headers uniquely", () => {
    expect(readCsvTable("Time,T,T,\n0,1,2,3\n1,2,3,4\n").header).toEqual(["Time", "T", "T (2)", "Column 4"]);
  });

  it.each([
    ["", "empty"],
    ["   \n\n", "empty"],
    ["Time,Air\nstart,hot\n", "No row of the file holds readings"],
  ])("refuses %j: %s", (csv, message) => {
    expect(() => readCsvTable(csv)).toThrow(DomainError);
    expect(() => readCsvTable(csv)).toThrow(message);
  });
});

describe("cells", () => {
  // hand working: h·3600 + m·60 + s
  it.each([
    ["08:15:30", 8 * 3600 + 15 * 60 + 30],
    ["8:05", 8 * 3600 + 5 * 60],
    ["23:59:59.5", 86_399.5],
    ["00:00:00", 0],
    // source: the JavaScript Date.UTC reference for the calendar day
    ["2026-12-02 08:00:00", Date.UTC(2026, 11, 2) / 1000 + 8 * 3600],
    ["2026-12-02T00:00:10", Date.UTC(2026, 11, 2) / 1000 + 10],
  ])("clock %s = %d s", (text, seconds) => {
    expect(readClockCell(text)).toBe(seconds);
  });

  it.each(["24:00:00", "12:60", "12:30:75", "noon", "12.30", ""])("%j is not a clock time", (text) => {
    expect(readClockCell(text)).toBeNaN();
  });

  it.each([
    ["12.5", false, 12.5],
    ["-3", false, -3],
    ["1e2", false, 100],
    ["12,5", true, 12.5],
    ["12,5", false, Number.NaN],
    ["abc", false, Number.NaN],
    ["", false, Number.NaN],
  ])("number %j (decimal comma %s) = %d", (text, comma, value) => {
    expect(readNumberCell(text, comma)).toEqual(value);
  });

  // source: NIST SP 811 — t/°C = (t/°F − 32) / 1.8
  it.each([
    [32, 0],
    [212, 100],
    [392, 200],
    [-40, -40],
  ])("%d °F = %d °C", (f, c) => {
    expect(toCelsius(f, "F")).toBeCloseTo(c, 9);
  });
});

describe("suggestMapping", () => {
  it("finds the time, the air probe and the part probes of a typical logger file", () => {
    const t = readCsvTable(toCsv(demoProfile()));
    expect(suggestMapping(t)).toEqual({
      timeColumn: "Elapsed (s)",
      timeFormat: "seconds",
      temperatureUnit: "C",
      airColumn: "T1 Air (°C)",
      probes: [
        { column: "T2 (°C)", label: "T2 (°C)", thicknessMm: null },
        { column: "T3 (°C)", label: "T3 (°C)", thicknessMm: null },
      ],
    });
  });

  it.each([
    [{ timeFormat: "clock" as const }, "Time", "clock"],
    [{ timeFormat: "minutes" as const }, "Elapsed (min)", "minutes"],
  ])("recognises %j times", (opts, column, format) => {
    const m = suggestMapping(readCsvTable(toCsv(demoProfile(), opts)));
    expect(m.timeColumn).toBe(column);
    expect(m.timeFormat).toBe(format);
  });

  it("recognises °F from the header", () => {
    expect(suggestMapping(readCsvTable(toCsv(demoProfile(), { unit: "F" }))).temperatureUnit).toBe("F");
  });

  it("leaves the time and the air unmapped when no column looks like them", () => {
    const m = suggestMapping(readCsvTable("P1,P2,P3\n20,21,22\n30,31,32\n"));
    expect(m.timeColumn).toBeNull();
    expect(m.airColumn).toBeNull();
    expect(m.probes.map((p) => p.column)).toEqual(["P1", "P2", "P3"]);
  });
});

describe("mapProfile reads a valid file", () => {
  it("gives seconds from the first reading and °C; an empty label takes the column's name", () => {
    const { series, problems } = mapProfile(readCsvTable(smallCsv()), mapping());
    expect(problems).toEqual([]);
    expect(series!.timeS.slice(0, 3)).toEqual([0, 30, 60]);
    expect(series!.airC[11]).toBe(25 + 15 * 11);
    expect(series!.probes.map((p) => [p.label, p.thicknessMm])).toEqual([["Bracket", 1.5], ["Thick", 8]]);
  });

  it("reads the same series from seconds, minutes and clock times", () => {
    const p = demoProfile();
    const read = (timeFormat: "seconds" | "minutes" | "clock") => {
      const t = readCsvTable(toCsv(p, { timeFormat }));
      const m = { ...suggestMapping(t), probes: suggestMapping(t).probes.map((q) => ({ ...q, thicknessMm: 2 })) };
      return mapProfile(t, m).series!;
    };
    const seconds = read("seconds");
    for (const other of [read("minutes"), read("clock")]) {
      // minutes are written to 6 decimals: within 0.0001 s
      other.timeS.forEach((t, i) => expect(t).toBeCloseTo(seconds.timeS[i], 3));
      expect(other.probes[1].tempsC).toEqual(seconds.probes[1].tempsC);
    }
  });

  it("carries clock times over midnight", () => {
    const p = demoProfile();
    // starts at 23:50:00; 26 min later it is 00:16:00 the next day
    const t = readCsvTable(toCsv(p, { timeFormat: "clock", startClockS: 23 * 3600 + 50 * 60 }));
    const m = suggestMapping(t);
    const { series, problems } = mapProfile(t, { ...m, probes: m.probes.map((q) => ({ ...q, thicknessMm: 2 })) });
    expect(problems).toEqual([]);
    expect(series!.timeS[series!.timeS.length - 1]).toBe(26 * 60);
  });

  it("converts °F readings to the same °C series (property: any plausible temperature)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 300, noNaN: true }), { minLength: 12, maxLength: 30 }), (temps) => {
        const ramp = temps.map((_, i) => 20 + 25 * i);
        const csvOf = (unit: "C" | "F") => {
          // source: NIST SP 811, t/°F = 1.8 · t/°C + 32
          const f = (c: number) => (unit === "F" ? 1.8 * c + 32 : c);
          return ["s,Air,P", ...temps.map((c, i) => `${i},${f(ramp[i])},${f(c)}`)].join("\n");
        };
        const m = (unit: "C" | "F"): ColumnMapping => ({ timeColumn: "s", timeFormat: "seconds", temperatureUnit: unit, airColumn: "Air", probes: [{ column: "P", label: "", thicknessMm: 3 }] });
        const c = mapProfile(readCsvTable(csvOf("C")), m("C"));
        const f = mapProfile(readCsvTable(csvOf("F")), m("F"));
        expect(f.problems.map((p) => p.field)).toEqual(c.problems.map((p) => p.field));
        if (c.series && f.series) f.series.probes[0].tempsC.forEach((v, i) => expect(v).toBeCloseTo(c.series!.probes[0].tempsC[i], 9));
      }),
      { numRuns: 50 },
    );
  });
});

describe("mapProfile explains bad input with row and column, and gives no series", () => {
  it.each<[string, boolean, Partial<ColumnMapping>, (rows: string[][]) => void, { field: string; row?: number; column?: string; text: string }]>([
    ["no time column", true, { timeColumn: null }, () => {}, { field: "mapping.timeColumn", text: "No time column" }],
    ["a time column the file does not have", false, { timeColumn: "Time" }, () => {}, { field: "mapping.timeColumn", column: "Time", text: 'no column named "Time"' }],
    // rows: the header is line 1, so reading k (0-based) is line k + 2
    ["times out of order", false, {}, (r) => { r[5][0] = "100"; }, { field: "csv", row: 7, column: "Elapsed (s)", text: "is earlier than row 6" }],
    ["a repeated time", false, {}, (r) => { r[4][0] = "90"; }, { field: "csv", row: 6, column: "Elapsed (s)", text: "repeats the time of row 5" }],
    ["text in a temperature column", false, {}, (r) => { r[8][2] = "ERR"; }, { field: "csv", row: 10, column: "Thin", text: '"ERR" is not a number' }],
    ["an empty temperature cell", false, {}, (r) => { r[3][3] = ""; }, { field: "csv", row: 5, column: "Thick", text: "the temperature is missing" }],
    ["an open-thermocouple code", false, {}, (r) => { r[2][1] = "-999"; }, { field: "csv", row: 4, column: "Air", text: "outside -50…700 °C" }],
    ["text in the time column", false, {}, (r) => { r[1][0] = "soon"; }, { field: "csv", row: 3, column: "Elapsed (s)", text: '"soon" is not a number of seconds' }],
    ["a probe that never warms up", false, {}, (r) => r.forEach((row) => { row[3] = "22.5"; }), { field: "mapping.probes.1.column", column: "Thick", text: "rises only 0 K" }],
    ["no air probe", false, { airColumn: null }, () => {}, { field: "mapping.airColumn", text: "No air probe" }],
    ["the air probe mapped as a part probe too", false, { probes: [{ column: "Air", label: "", thicknessMm: 2 }] }, () => {}, { field: "mapping.probes.0.column", column: "Air", text: "already mapped as the air probe" }],
    ["no part probe", false, { probes: [] }, () => {}, { field: "mapping.probes", text: "at least one probe" }],
    ["a probe without a thickness", false, { probes: [{ column: "Thin", label: "Bracket", thicknessMm: null }] }, () => {}, { field: "mapping.probes.0.thicknessMm", column: "Thin", text: 'under probe "Bracket"' }],
    ["too few readings", false, {}, (r) => r.splice(5), { field: "csv", text: "needs at least 10" }],
  ])("%s", (_name, withoutTime, over, edit, expected) => {
    // without a time column: only the three temperature columns
    const csv = withoutTime ? smallCsv(edit).split("\n").map((l) => l.split(",").slice(1).join(",")).join("\n") : smallCsv(edit);
    const { series, problems } = mapProfile(readCsvTable(csv), mapping(over));
    expect(series).toBeNull();
    const hit = problems.find((p) => p.field === expected.field && p.message.includes(expected.text));
    expect(hit, JSON.stringify(problems, null, 1)).toBeDefined();
    if (expected.row !== undefined) expect(hit!.row).toBe(expected.row);
    if (expected.column !== undefined) expect(hit!.column).toBe(expected.column);
  });

  it("lists every bad cell, not just the first", () => {
    const { problems } = mapProfile(
      readCsvTable(smallCsv((r) => { r[2][2] = "x"; r[9][3] = "y"; })),
      mapping(),
    );
    expect(problems.map((p) => [p.row, p.column])).toEqual([[4, "Thin"], [11, "Thick"]]);
  });

  it("caps a flood of bad cells at 100 listed and counts the rest", () => {
    const rows = ["s,Air,P", ...Array.from({ length: 150 }, (_, i) => `${i},${20 + i},oops`)];
    const { problems } = mapProfile(readCsvTable(rows.join("\n")), { timeColumn: "s", timeFormat: "seconds", temperatureUnit: "C", airColumn: "Air", probes: [{ column: "P", label: "", thicknessMm: 2 }] });
    expect(problems).toHaveLength(101);
    expect(problems[100].message).toBe("…and 50 more bad cells not listed.");
  });
});
