"use client";
import { ecoatEstimate } from "@/lib/coating-math/ecoat";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { ECOAT_INPUT, resultBlame } from "@/lib/coating-math/calc-inputs";
import type { EcoatResult } from "@/app/api/calc/ecoat/route";
import { CalculatorSection, HowComputed, NumberField, Results, SafetyNote, type ResultRow } from "./calculator-parts";
import { formatShown, unitText } from "./display-units";
import { runCalculator } from "./run-calculator";
import { useUnitFields, type FieldSpec } from "./use-unit-fields";

const specs = {
  areaM2: { kind: "areaM2", initial: { metric: 1.2, us: 13 } },
  filmUm: { kind: "filmUm", initial: { metric: 20, us: 0.8 } },
  filmDensityGPerCm3: { kind: "densityGPerCm3", initial: { metric: 1.4, us: 11.7 } },
  coulombicYieldMgPerC: { kind: "yieldMgPerC", initial: { metric: 30, us: 30 } },
  parts: { kind: "count", initial: { metric: 100, us: 100 } },
  partsPerHour: { kind: "count", initial: { metric: 240, us: 240 } },
} satisfies Record<string, FieldSpec>;

export function EcoatCalculator({ system }: { system: UnitSystem }) {
  const { fields, values, setText } = useUnitFields(specs, system);
  const { result, errors } = runCalculator({
    rules: ECOAT_INPUT,
    specs,
    system,
    values,
    compute: (input): EcoatResult => ecoatEstimate(input),
    blame: resultBlame.ecoat,
  });
  const parts = typeof values.parts === "number" ? values.parts : 1;
  const rows: ResultRow[] | null = result && [
    { label: parts === 1 ? "Film solids deposited, 1 part" : `Film solids deposited, ${parts} parts`, value: formatShown("massKg", result.depositedSolidsKg, system), testId: "ecoat-solids" },
    { label: "Film solids per part", value: formatShown("massKg", result.depositedSolidsKgPerPart, system) },
    { label: parts === 1 ? "Charge, 1 part" : `Charge, ${parts} parts`, value: formatShown("chargeC", result.chargeC, system), testId: "ecoat-charge" },
    { label: "Charge per coated area", value: formatShown("chargePerAreaCPerM2", result.chargePerAreaCPerM2, system) },
    ...(result.averageCurrentA !== undefined
      ? [{ label: "Average rectifier current", value: formatShown("currentA", result.averageCurrentA, system), testId: "ecoat-current", note: "for deposition only, at the parts rate" }]
      : []),
    ...(result.solidsKgPerHour !== undefined
      ? [{ label: "Solids deposited per hour", value: formatShown("massRateKgPerH", result.solidsKgPerHour, system) }]
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
      testId={`ecoat-${name}`}
    />
  );
  return (
    <CalculatorSection
      id="ecoat"
      title="E-coat deposition"
      intro="Film solids a run takes out of the tank, the charge that deposits them and the average current the rectifier must supply."
      inputs={
        <>
          {f("areaM2", "Coated area per part")}
          {f("filmUm", "Dry film thickness", { hint: "Low-film epoxy e-coats 15–22 µm (0.6–0.9 mil), medium 25–35 µm." })}
          {f("filmDensityGPerCm3", "Cured film density", { hint: "Ask the paint supplier; about 1.3–1.5 g/cm³ (from memory)." })}
          {f("coulombicYieldMgPerC", "Coulombic yield", { hint: "Film mass per coulomb; about 30 mg/C for cathodic epoxy (from memory)." })}
          {f("parts", "Parts")}
          {f("partsPerHour", "Parts per hour", { optional: true, hint: "Gives the average current." })}
        </>
      }
      results={
        <>
          <Results rows={rows} waiting="Correct the marked fields to see the deposition figures." />
          <HowComputed>
            solids = film density × DFT × area; charge = solids ÷ coulombic yield; average current = charge per part × parts per
            hour ÷ 3600 s — derived from the definition of coulombic yield (film thickness options: Products Finishing,
            “Electrocoating Q&amp;A: Film Thickness Options”). Typical yield and density are weakly sourced: use your supplier&apos;s
            figures.
          </HowComputed>
        </>
      }
      after={
        <SafetyNote title="E-coat tank safety">
          <p>
            The tank, parts, racks and conveyor in the coating zone are live with high-voltage DC (90–500 V) while the rectifier
            runs. Never reach into the tank or touch parts in that zone; keep guards and interlocks in place.
          </p>
          <p>
            Before any work on the tank, anodes or rectifier, lock out and verify zero energy (OSHA 29 CFR 1910.147, NFPA 70E).
          </p>
        </SafetyNote>
      }
    />
  );
}
