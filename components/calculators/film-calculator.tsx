"use client";
import { useId, useRef, useState } from "react";
import { isAbove, isBelow } from "@/lib/coating-math/compare";
import { DomainError, isInRange } from "@/lib/coating-math/errors";
import {
  evaluateFilm,
  pa2SamplingPlan,
  PA2_SPOT_HIGH_FRACTION,
  PA2_SPOT_LOW_FRACTION,
  PA2_SPOTS_PER_AREA,
  ISO19840_LOW_FRACTION,
} from "@/lib/coating-math/film";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import {
  FILM_NOMINAL_INPUT,
  FILM_SPEC_INPUT,
  filmInputIssues,
  finiteResult,
  POWDER_INPUT,
  resultBlame,
  type FilmReadingsInput,
} from "@/lib/coating-math/calc-inputs";
import type { FilmResult } from "@/app/api/calc/film/route";
import { CalculatorSection, HowComputed, NumberField, Results, type ResultRow } from "./calculator-parts";
import { formatShown, unitText } from "./display-units";
import { convertReadingsText, parseReadings, rowsToText, toAreas, type SpotReadings } from "./film-readings";
import { fieldMessages, rangeText, useUnitFields, type FieldSpec } from "./use-unit-fields";

type Rule = "sspc-pa2" | "iso19840";

const specs = {
  specMinUm: { kind: "filmUm", initial: { metric: 60, us: 2.5 } },
  specMaxUm: { kind: "filmUm", initial: { metric: 90, us: 3.5 } },
  nominalUm: { kind: "filmUm", initial: { metric: 60, us: 2.5 } },
  surfaceAreaM2: { kind: "areaM2" },
} satisfies Record<string, FieldSpec>;
type SpecName = keyof typeof specs;

const pa2Rules = FILM_SPEC_INPUT;
const isoRules = { ...FILM_SPEC_INPUT, ...FILM_NOMINAL_INPUT };

const custom: Partial<Record<SpecName, string>> = {
  specMinUm: "Enter a minimum no larger than the maximum.",
  nominalUm: "Enter a nominal thickness no larger than the specified maximum.",
};

/** "152.4 µm" in the lib's sentences → the user's film unit. */
function localizeUm(sentence: string, system: UnitSystem): string {
  if (system === "metric") return sentence;
  return sentence.replace(/(\d+(?:\.\d+)?) µm/g, (_m, n: string) => formatShown("filmUm", Number(n), system, 3));
}

interface Evaluation {
  result: FilmResult | null;
  errors: Partial<Record<SpecName, string>>;
  readingErrors: string[];
  areas: SpotReadings[][];
}

function evaluate(rule: Rule, values: Record<SpecName, number | string | undefined>, text: string, system: UnitSystem): Evaluation {
  const parsed = parseReadings(text, system);
  const areas = toAreas(parsed, PA2_SPOTS_PER_AREA);
  const flat = areas.flat();
  const readingErrors = parsed.bad.map((b) => `Line ${b.line}, cell ${b.cell}: “${b.text}” ${b.why}.`);
  const input: FilmReadingsInput =
    rule === "sspc-pa2"
      ? { rule, specMinUm: values.specMinUm, specMaxUm: values.specMaxUm, areas: areas.map((a) => a.map((s) => s.readingsUm)) }
      : {
          rule,
          specMinUm: values.specMinUm,
          specMaxUm: values.specMaxUm,
          nominalUm: values.nominalUm,
          readingsUm: flat.flatMap((s) => s.readingsUm),
        };
  const issues = filmInputIssues(input);
  let errors: Partial<Record<SpecName, string>> = {};
  if (issues.length > 0) {
    errors = fieldMessages<SpecName>(issues, { rules: rule === "sspc-pa2" ? pa2Rules : isoRules, specs, system, values, custom });
    // A bad cell already explains a short spot; listing both would say the same thing twice.
    for (const issue of parsed.bad.length > 0 ? [] : issues) {
      const [top, a, s] = issue.path;
      if (top === "areas" && typeof a === "number" && typeof s === "number") {
        const spot = areas[a]?.[s];
        readingErrors.push(`Area ${a + 1}, spot ${s + 1}${spot ? ` (line ${spot.line})` : ""}: ${issue.message}.`);
      } else if (top === "areas" || top === "readingsUm") {
        if (flat.length === 0) continue; // the empty state says what to do
        readingErrors.push(`Readings: ${issue.message}.`);
      }
    }
  }
  if (issues.length > 0 || readingErrors.length > 0) return { result: null, errors, readingErrors, areas };
  try {
    // Every number was checked above, so the input is complete.
    const result: FilmResult = finiteResult(evaluateFilm(input as Parameters<typeof evaluateFilm>[0]), resultBlame.film);
    return { result, errors, readingErrors, areas };
  } catch (e) {
    if (e instanceof DomainError) return { result: null, errors, readingErrors: [e.message], areas };
    throw e;
  }
}

const PLACEHOLDER: Record<Rule, Record<UnitSystem, string>> = {
  "sspc-pa2": {
    metric: "One spot per line, its readings side by side:\n78\t85\t80\n74\t81\t83\n\n(a blank line starts the next area)",
    us: "One spot per line, its readings side by side:\n3.1\t3.4\t3.2\n2.9\t3.2\t3.3\n\n(a blank line starts the next area)",
  },
  iso19840: {
    metric: "All readings, one per line or side by side:\n78 85 80 74 81 83",
    us: "All readings, one per line or side by side:\n3.1 3.4 3.2 2.9 3.2 3.3",
  },
};

export function FilmCalculator({ system }: { system: UnitSystem }) {
  const [rule, setRule] = useState<Rule>("sspc-pa2");
  const { fields, values, setText } = useUnitFields(specs, system);
  // The readings as last typed, in the units they were typed in; other units are shown converted,
  // so flipping back and forth gives back exactly what was typed.
  const [readings, setReadings] = useState({ system, text: "" });
  const [fileNote, setFileNote] = useState<string | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const textId = useId();
  const current = { system, text: convertReadingsText(readings.text, readings.system, system) };
  const { result, errors, readingErrors, areas } = evaluate(rule, values, current.text, system);
  const hasReadings = areas.length > 0;
  const film = (um: number) => formatShown("filmUm", um, system, 3);

  const specMin = typeof values.specMinUm === "number" ? values.specMinUm : null;
  const specMax = typeof values.specMaxUm === "number" ? values.specMaxUm : null;
  const spotStatus = (um: number): string | null => {
    if (specMin !== null && isBelow(um, PA2_SPOT_LOW_FRACTION * specMin)) return `below 80 % of the minimum (${film(PA2_SPOT_LOW_FRACTION * specMin)})`;
    if (specMax !== null && isAbove(um, PA2_SPOT_HIGH_FRACTION * specMax)) return `above 120 % of the maximum (${film(PA2_SPOT_HIGH_FRACTION * specMax)})`;
    return null;
  };

  const surfaceRange = POWDER_INPUT.areaM2.range;
  const surfaceText = fields.surfaceAreaM2.text.trim();
  const surfaceError =
    surfaceText !== "" && !isInRange(values.surfaceAreaM2, surfaceRange)
      ? `${typeof values.surfaceAreaM2 === "string" ? `“${surfaceText}” is not a number: enter` : "Enter"} ${rangeText(surfaceRange, "areaM2", system)}.`
      : undefined;
  const plan = surfaceText !== "" && !surfaceError ? pa2SamplingPlan(values.surfaceAreaM2 as number) : null;

  const summary: ResultRow[] | null =
    result &&
    (result.rule === "sspc-pa2"
      ? [
          { label: "Verdict", value: result.pass ? "Pass" : "Fail", tone: result.pass ? "pass" : "fail", testId: "film-verdict" },
          { label: "Areas", value: String(result.areasUm.length) },
          { label: "Spots", value: String(result.spotsUm.flat().length) },
          { label: "Lowest spot", value: film(Math.min(...result.spotsUm.flat())) },
          { label: "Highest spot", value: film(Math.max(...result.spotsUm.flat())) },
        ]
      : [
          { label: "Verdict", value: result.pass ? "Pass" : "Fail", tone: result.pass ? "pass" : "fail", testId: "film-verdict" },
          { label: "Mean", value: film(result.meanUm), testId: "film-mean" },
          { label: "Readings below nominal", value: formatShown("percent", result.fractionBelowNominal, system, 3) },
          { label: "Readings", value: String(result.readingCount) },
        ]);

  const f = (name: SpecName, label: string, hint?: string, optional?: boolean) => (
    <NumberField
      label={label}
      unit={unitText(specs[name].kind, system)}
      text={fields[name].text}
      error={name === "surfaceAreaM2" ? surfaceError : errors[name]}
      hint={hint}
      optional={optional}
      onChange={(t) => setText(name, t)}
      testId={`film-${name}`}
    />
  );

  return (
    <CalculatorSection
      id="film"
      title="Film thickness acceptance"
      intro="Check dry film thickness readings against the specification by SSPC-PA 2 or ISO 19840. Paste them from a spreadsheet or load a CSV file."
      inputs={
        <>
          <fieldset className="sm:col-span-2">
            <legend className="label">Acceptance rule</legend>
            <div className="flex flex-wrap gap-4 text-sm">
              <label className="inline-flex items-center gap-2">
                <input type="radio" name="film-rule" checked={rule === "sspc-pa2"} onChange={() => setRule("sspc-pa2")} /> SSPC-PA 2 (spots and areas)
              </label>
              <label className="inline-flex items-center gap-2">
                <input type="radio" name="film-rule" checked={rule === "iso19840"} onChange={() => setRule("iso19840")} /> ISO 19840 (80–20 rule)
              </label>
            </div>
          </fieldset>
          {f("specMinUm", "Specified minimum")}
          {f("specMaxUm", "Specified maximum")}
          {rule === "iso19840" && f("nominalUm", "Nominal thickness")}
          {rule === "sspc-pa2" && f("surfaceAreaM2", "Surface area to check", "Shows how many areas, spots and readings PA 2 asks for.", true)}
          <div className="sm:col-span-2">
            <label htmlFor={textId} className="label">
              Gauge readings <span className="font-normal text-ink-faint">({unitText("filmUm", system)})</span>
            </label>
            <textarea
              id={textId}
              className="field num min-h-40 font-mono"
              value={current.text}
              placeholder={PLACEHOLDER[rule][system]}
              spellCheck={false}
              aria-invalid={readingErrors.length > 0 ? true : undefined}
              aria-describedby={`${textId}-help${readingErrors.length ? ` ${textId}-err` : ""}`}
              data-testid="film-readings"
              onChange={(e) => setReadings({ system, text: e.target.value })}
            />
            <p id={`${textId}-help`} className="mt-1 text-xs text-ink-faint">
              {rule === "sspc-pa2"
                ? "One spot per line, at least 3 readings each, separated by tabs, commas or spaces. A blank line starts the next area; without blank lines every 5 spots make an area."
                : "Any layout: every number is one reading."}{" "}
              A first row of titles is skipped.
            </p>
            {readingErrors.length > 0 && (
              <ul id={`${textId}-err`} className="field-error list-disc pl-5" data-testid="film-bad-cells">
                {readingErrors.slice(0, 12).map((m) => <li key={m}>{m}</li>)}
                {readingErrors.length > 12 && <li>… and {readingErrors.length - 12} more.</li>}
              </ul>
            )}
            <div className="mt-2 flex flex-wrap items-center gap-3">
              <button type="button" className="btn-quiet" onClick={() => fileRef.current?.click()}>Load a CSV file…</button>
              <input
                ref={fileRef}
                type="file"
                accept=".csv,.txt,text/csv,text/plain"
                className="sr-only"
                aria-label="CSV file to load"
                data-testid="film-file"
                onChange={(e) => {
                  const file = e.target.files?.[0];
                  if (!file) return;
                  // papaparse is fetched only when a file is chosen: it stays out of the page's first load.
                  import("papaparse")
                    .then(({ default: Papa }) =>
                      Papa.parse<unknown[]>(file, {
                        skipEmptyLines: false,
                        complete: (out) => {
                          setReadings({ system, text: rowsToText(out.data) });
                          setFileNote(`Loaded ${file.name}: ${out.data.length} rows.`);
                        },
                        error: (err) => setFileNote(`Could not read ${file.name}: ${err.message}`),
                      }),
                    )
                    .catch(() => setFileNote(`Could not read ${file.name}: the CSV reader did not load. Try again.`));
                  e.target.value = "";
                }}
              />
              {hasReadings || current.text ? (
                <button type="button" className="btn-quiet" onClick={() => { setReadings({ system, text: "" }); setFileNote(null); }}>
                  Clear readings
                </button>
              ) : null}
              {fileNote && <span className="text-xs text-ink-soft" aria-live="polite">{fileNote}</span>}
            </div>
          </div>
        </>
      }
      results={
        <>
          <Results
            rows={summary}
            title="Acceptance"
            waiting={
              !hasReadings && readingErrors.length === 0
                ? "Paste gauge readings or load a CSV file to check them."
                : "Correct the marked fields and readings to see the verdict."
            }
          />
          {plan && (
            <p className="mt-2 text-sm text-ink-soft" data-testid="film-plan">
              SSPC-PA 2 for {formatShown("areaM2", values.surfaceAreaM2 as number, system, 4)}: measure{" "}
              <span className="num">{plan.areaCount}</span> area{plan.areaCount === 1 ? "" : "s"}, <span className="num">{plan.spotCount}</span> spots,
              at least <span className="num">{plan.minReadingCount}</span> readings (counted in ft², as the standard is written).
            </p>
          )}
          {result && result.reasons.length > 0 && (
            <div className="mt-3">
              <h4 className="text-sm font-semibold text-oxide">Why it fails</h4>
              <ul className="mt-1 list-disc space-y-1 pl-5 text-sm" data-testid="film-reasons">
                {result.reasons.map((r) => <li key={r}>{localizeUm(r, system)}</li>)}
              </ul>
            </div>
          )}
          {result && result.warnings.length > 0 && (
            <ul className="mt-2 space-y-1 text-sm text-caution">
              {result.warnings.map((w) => <li key={w}>{localizeUm(w, system)}</li>)}
            </ul>
          )}
          {result?.rule === "sspc-pa2" && (
            <div className="mt-3 max-h-80 overflow-auto rounded-md border border-plate-line bg-white">
              <table className="w-full text-sm">
                <caption className="sr-only">Spot and area measurements</caption>
                <thead className="sticky top-0 bg-plate-sunk text-left text-xs text-ink-soft">
                  <tr>
                    <th scope="col" className="px-2 py-1">Area</th>
                    <th scope="col" className="px-2 py-1">Spot</th>
                    <th scope="col" className="px-2 py-1 text-right">Mean</th>
                    <th scope="col" className="px-2 py-1">Check</th>
                  </tr>
                </thead>
                <tbody>
                  {result.spotsUm.map((spots, i) =>
                    spots.map((um, j) => {
                      const status = spotStatus(um);
                      return (
                        <tr key={`${i}-${j}`} className={status ? "bg-oxide-light" : j === 0 && i > 0 ? "border-t border-plate-line" : undefined}>
                          <td className="num px-2 py-1">{j === 0 ? `${i + 1} (mean ${film(result.areasUm[i])})` : ""}</td>
                          <td className="num px-2 py-1">{j + 1} <span className="text-xs text-ink-faint">line {areas[i]?.[j]?.line}</span></td>
                          <td className="num px-2 py-1 text-right">{film(um)}</td>
                          <td className={`px-2 py-1 ${status ? "font-medium text-oxide" : "text-ink-faint"}`}>{status ?? "ok"}</td>
                        </tr>
                      );
                    }),
                  )}
                </tbody>
              </table>
            </div>
          )}
          <HowComputed>
            {rule === "sspc-pa2" ? (
              <>
                SSPC-PA 2: spot = mean of ≥ 3 gauge readings; area = mean of 5 spots; at the default restriction level every area
                mean lies within the specified range and no spot is below {Math.round(PA2_SPOT_LOW_FRACTION * 100)} % of the minimum or
                above {Math.round(PA2_SPOT_HIGH_FRACTION * 100)} % of the maximum (spec 8–12 mil → spots 6.4–14.4 mil). Gauges per
                ASTM D7091.
              </>
            ) : (
              <>
                ISO 19840: mean ≥ nominal; every reading ≥ {Math.round(ISO19840_LOW_FRACTION * 100)} % of nominal; readings between 80 %
                and 100 % of nominal no more than 20 % of all; every reading ≤ the specified maximum. Gauges per ISO 2360 / ASTM D7091.
              </>
            )}
          </HowComputed>
        </>
      }
    />
  );
}

