"use client";
import { lineThroughput } from "@/lib/coating-math/line";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { LINE_INPUT, resultBlame } from "@/lib/coating-math/calc-inputs";
import type { LineResult } from "@/app/api/calc/line/route";
import { CalculatorSection, HowComputed, NumberField, Results, type ResultRow } from "./calculator-parts";
import { formatShown, unitText } from "./display-units";
import { runCalculator } from "./run-calculator";
import { useUnitFields, type FieldSpec } from "./use-unit-fields";

const specs = {
  lineSpeedMPerMin: { kind: "speedMPerMin", initial: { metric: 3, us: 10 } },
  carrierPitchM: { kind: "pitchM", initial: { metric: 600, us: 24 } },
  partsPerCarrier: { kind: "count", initial: { metric: 4, us: 4 } },
  ovenPathLengthM: { kind: "lengthM", initial: { metric: 60, us: 200 } },
  requiredDwellMin: { kind: "timeMin", initial: { metric: 15, us: 15 } },
  loadedFraction: { kind: "percent", initial: { metric: 100, us: 100 } },
} satisfies Record<string, FieldSpec>;

export function LineCalculator({ system }: { system: UnitSystem }) {
  const { fields, values, setText } = useUnitFields(specs, system);
  const { result, errors } = runCalculator({
    rules: LINE_INPUT,
    specs,
    system,
    values,
    compute: (input): LineResult => lineThroughput(input),
    blame: resultBlame.line,
  });
  const rows: ResultRow[] | null = result && [
    { label: "Carriers per hour", value: formatShown("count", result.carriersPerHour, system), testId: "line-carriers" },
    { label: "Parts per hour", value: formatShown("count", result.partsPerHour, system), testId: "line-parts" },
    { label: "Oven dwell", value: formatShown("timeMin", result.ovenDwellMin, system), testId: "line-dwell" },
    ...(result.maxLineSpeedForDwellMPerMin !== undefined
      ? [{ label: "Fastest line speed for the cure", value: formatShown("speedMPerMin", result.maxLineSpeedForDwellMPerMin, system) }]
      : []),
    ...(result.dwellMarginMin !== undefined
      ? [
          {
            label: "Dwell margin",
            value: formatShown("timeMin", result.dwellMarginMin, system, 3),
            tone: result.dwellMarginMin < 0 ? ("fail" as const) : ("pass" as const),
            note: result.dwellMarginMin < 0 ? "too short: slow the line or lengthen the oven path" : "oven dwell covers the cure",
            testId: "line-margin",
          },
        ]
      : []),
  ];
  const f = (name: keyof typeof specs, label: string, extra?: { hint?: string; optional?: boolean }) => (
    <NumberField
      label={label}
      unit={unitText(specs[name].kind, system)}
      text={fields[name].text}
      error={errors[name]}
      hint={extra?.hint}
      optional={extra?.optional}
      onChange={(t) => setText(name, t)}
      testId={`line-${name}`}
    />
  );
  return (
    <CalculatorSection
      id="line"
      title="Line throughput"
      intro="Carriers and parts per hour on a conveyor line, and whether the oven gives the parts enough time."
      inputs={
        <>
          {f("lineSpeedMPerMin", "Line speed")}
          {f("carrierPitchM", "Carrier pitch", { hint: "Centre-to-centre distance of carriers." })}
          {f("partsPerCarrier", "Parts per carrier")}
          {f("loadedFraction", "Carriers loaded", { hint: "Share of carriers that carry parts." })}
          {f("ovenPathLengthM", "Oven conveyor path")}
          {f("requiredDwellMin", "Cure time needed", { optional: true, hint: "Heat-up + hold; see the cure calculator." })}
        </>
      }
      results={
        <>
          <Results rows={rows} waiting="Correct the marked fields to see the throughput." />
          <HowComputed>
            carriers per hour = line speed × 60 ÷ carrier pitch; oven dwell = oven conveyor path ÷ line speed (10 ft/min at 24 in
            pitch → 300 carriers/h; 200 ft of oven → 20 min); line-speed worked examples in Products Finishing, “Curing Oven
            Basics”.
          </HowComputed>
        </>
      }
    />
  );
}
