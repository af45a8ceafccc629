"use client";
import { cureHeatUp } from "@/lib/coating-math/cure";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { CURE_INPUT, cureInputIssues, resultBlame } from "@/lib/coating-math/calc-inputs";
import type { CureResult } from "@/app/api/calc/cure/route";
import { CalculatorSection, HowComputed, NumberField, Results, SafetyNote, type ResultRow } from "./calculator-parts";
import { formatShown, unitText } from "./display-units";
import { runCalculator } from "./run-calculator";
import { useUnitFields, type FieldSpec } from "./use-unit-fields";

const specs = {
  thicknessMm: { kind: "lengthMm", initial: { metric: 3, us: 0.125 } },
  airTempC: { kind: "temperatureC", initial: { metric: 220, us: 430 } },
  startTempC: { kind: "temperatureC", initial: { metric: 20, us: 70 } },
  targetMetalTempC: { kind: "temperatureC", initial: { metric: 200, us: 390 } },
  holdMin: { kind: "timeMin", initial: { metric: 10, us: 10 } },
  heatTransferCoefficientWPerM2K: { kind: "heatTransferWPerM2K", initial: { metric: 30, us: 5.3 } },
  ovenDwellMin: { kind: "timeMin" },
  densityKgPerM3: { kind: "densityKgPerM3", initial: { metric: 7850, us: 490 } },
  specificHeatJPerKgK: { kind: "specificHeatJPerKgK", initial: { metric: 490, us: 0.117 } },
  thermalConductivityWPerMK: { kind: "conductivityWPerMK", initial: { metric: 50, us: 28.9 } },
} satisfies Record<string, FieldSpec>;

const custom = {
  targetMetalTempC: "Enter a target below the oven air temperature: the metal approaches the air temperature but never reaches it.",
};

export function CureCalculator({ system }: { system: UnitSystem }) {
  const { fields, values, setText } = useUnitFields(specs, system);
  const { result, errors } = runCalculator({
    rules: CURE_INPUT,
    specs,
    system,
    values,
    check: cureInputIssues,
    custom,
    compute: (input): CureResult => cureHeatUp(input),
    blame: resultBlame.cure,
  });
  const rows: ResultRow[] | null = result && [
    { label: "Metal heat-up", value: formatShown("timeMin", result.heatUpMin, system, 3), testId: "cure-heatup" },
    { label: "Heat-up + hold", value: formatShown("timeMin", result.totalMin, system, 3), testId: "cure-total" },
    { label: "Time constant", value: formatShown("timeMin", result.timeConstantMin, system, 3), note: "63 % of the way to air temperature" },
    { label: "Biot number", value: formatShown("ratio", result.biotNumber, system, 2), note: "the model holds below 0.1" },
    ...(result.dwellMarginMin !== undefined
      ? [
          {
            label: "Dwell margin",
            value: formatShown("timeMin", result.dwellMarginMin, system, 3),
            tone: result.dwellMarginMin < 0 ? ("fail" as const) : ("pass" as const),
            note: result.dwellMarginMin < 0 ? "under-cure: the oven dwell is too short" : "the oven dwell covers heat-up and hold",
            testId: "cure-margin",
          },
        ]
      : []),
  ];
  const f = (name: keyof typeof specs, label: string, extra?: { hint?: string; optional?: boolean; wide?: boolean }) => (
    <NumberField
      label={label}
      unit={unitText(specs[name].kind, system)}
      text={fields[name].text}
      error={errors[name]}
      hint={extra?.hint}
      optional={extra?.optional}
      onChange={(t) => setText(name, t)}
      testId={`cure-${name}`}
      wide={extra?.wide}
    />
  );
  return (
    <CalculatorSection
      id="cure"
      title="Cure and metal heat-up"
      intro="Powder and e-coat cure on metal temperature × time, not air temperature: how long the part takes to get there, plus the hold."
      inputs={
        <>
          {f("heatTransferCoefficientWPerM2K", "Oven heat transfer coefficient", { wide: true, hint: "Convection cure ovens about 20–60 W/(m²·K), 3.5–10.6 Btu/(h·ft²·°F) (from memory)." })}
          {f("thicknessMm", "Equivalent metal thickness", { hint: "A plate's thickness; half a round bar's diameter (2·V/A)." })}
          {f("holdMin", "Hold at cure temperature")}
          {f("airTempC", "Oven air temperature")}
          {f("startTempC", "Metal temperature at the oven entry")}
          {f("targetMetalTempC", "Cure metal temperature", { hint: "From the coating's cure schedule." })}
          {f("ovenDwellMin", "Oven dwell available", { optional: true, hint: "From the line calculator." })}
          <details className="sm:col-span-2">
            <summary className="cursor-pointer text-sm text-ink-soft">Metal properties (steel preset)</summary>
            <div className="mt-3 grid gap-3 sm:grid-cols-2">
              {f("densityKgPerM3", "Density")}
              {f("specificHeatJPerKgK", "Specific heat", { hint: "Steel about 490 J/(kg·K) near 200 °C." })}
              {f("thermalConductivityWPerMK", "Thermal conductivity", { hint: "Steel about 45–60 W/(m·K)." })}
            </div>
          </details>
        </>
      }
      results={
        <>
          <Results rows={rows} waiting="Correct the marked fields to see the cure time." />
          {result?.warnings.map((w) => (
            <p key={w} className="mt-2 rounded-md bg-caution-light px-3 py-2 text-sm text-ink" role="note">
              {w}
            </p>
          ))}
          <HowComputed>
            lumped heat-up t = ρ c (thickness ÷ 2) ÷ h × ln((T<sub>air</sub> − T<sub>start</sub>) ÷ (T<sub>air</sub> −
            T<sub>cure</sub>)), valid while the Biot number h (thickness ÷ 2) ÷ k stays below 0.1 (Çengel, <i>Heat Transfer</i>,
            ch. 4); cure is metal temperature × time (Process Heating, “Ensuring Adequate Curing of Paint and Powder Coatings”).
            Confirm with an oven temperature recorder on real parts.
          </HowComputed>
        </>
      }
      after={
        <SafetyNote title="Oven safety">
          <p>
            Keep the oven&apos;s purge, exhaust and combustion safeguards working so vapours stay below 25 % of the lower explosive
            limit (NFPA 86); do not bypass interlocks to save time.
          </p>
          <p>Parts, racks and hooks leave the oven near cure temperature: wear heat-resistant gloves and let them cool before handling.</p>
        </SafetyNote>
      }
    />
  );
}
