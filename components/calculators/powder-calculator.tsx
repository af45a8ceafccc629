"use client";
import { powderEstimate } from "@/lib/coating-math/powder";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { POWDER_INPUT, resultBlame } from "@/lib/coating-math/calc-inputs";
import type { PowderResult } from "@/app/api/calc/powder/route";
import { CalculatorSection, HowComputed, NumberField, Results, SafetyNote, type ResultRow } from "./calculator-parts";
import { formatShown, unitText } from "./display-units";
import { formatMoney, runCalculator } from "./run-calculator";
import { useUnitFields, type FieldSpec } from "./use-unit-fields";

const specs = {
  areaM2: { kind: "areaM2", initial: { metric: 1.2, us: 13 } },
  filmUm: { kind: "filmUm", initial: { metric: 70, us: 2.5 } },
  specificGravity: { kind: "ratio", initial: { metric: 1.6, us: 1.6 } },
  firstPassEfficiency: { kind: "percent", initial: { metric: 60, us: 60 } },
  reclaimEfficiency: { kind: "percent", initial: { metric: 0, us: 0 } },
  parts: { kind: "count", initial: { metric: 100, us: 100 } },
  pricePerKg: { kind: "pricePerKg" },
} satisfies Record<string, FieldSpec>;

export function PowderCalculator({ system, currency }: { system: UnitSystem; currency: string }) {
  const { fields, values, setText } = useUnitFields(specs, system);
  const { result, errors } = runCalculator({
    rules: POWDER_INPUT,
    specs,
    system,
    values,
    compute: (input): PowderResult => powderEstimate(input),
    blame: resultBlame.powder,
  });
  const parts = typeof values.parts === "number" ? values.parts : 1;
  const rows: ResultRow[] | null = result && [
    { label: "Theoretical coverage", value: formatShown("coverageM2PerKg", result.theoreticalCoverageM2PerKg, system), testId: "powder-theoretical" },
    { label: "Material utilisation", value: formatShown("percent", result.materialUtilization, system, 3), testId: "powder-utilization", note: "first pass plus reclaimed powder resprayed" },
    { label: "Practical coverage", value: formatShown("coverageM2PerKg", result.practicalCoverageM2PerKg, system), testId: "powder-practical" },
    { label: parts === 1 ? "Powder for 1 part" : `Powder for ${parts} parts`, value: formatShown("massKg", result.powderKg, system), testId: "powder-total" },
    { label: "Powder per part", value: formatShown("massKg", result.powderKgPerPart, system), testId: "powder-per-part" },
    ...(result.costTotal !== undefined ? [{ label: "Powder cost", value: formatMoney(result.costTotal, currency), testId: "powder-cost" }] : []),
  ];
  const f = (name: keyof typeof specs, label: string, extra?: { hint?: string; optional?: boolean; unit?: string }) => (
    <NumberField
      label={label}
      unit={extra?.unit ?? unitText(specs[name].kind, system)}
      text={fields[name].text}
      error={errors[name]}
      hint={extra?.hint}
      optional={extra?.optional}
      onChange={(t) => setText(name, t)}
      testId={`powder-${name}`}
    />
  );
  return (
    <CalculatorSection
      id="powder"
      title="Powder use"
      intro="How far a kilogram of powder goes at your film build, and how much a run needs once transfer efficiency and reclaim are counted."
      inputs={
        <>
          {f("areaM2", "Coated area per part")}
          {f("filmUm", "Film build")}
          {f("specificGravity", "Specific gravity", { hint: "From the powder's data sheet (ASTM D5965); most are 1.2–1.8." })}
          {f("firstPassEfficiency", "First-pass transfer efficiency", { hint: "Powder on the parts ÷ powder sprayed, by weight; often 40–60 %." })}
          {f("reclaimEfficiency", "Overspray reclaimed", { hint: "0 % when overspray goes to waste." })}
          {f("parts", "Parts")}
          {f("pricePerKg", "Powder price", { optional: true, unit: `${currency}/${unitText("massKg", system)}` })}
        </>
      }
      results={
        <>
          <Results rows={rows} waiting="Correct the marked fields to see the powder needed." />
          <HowComputed>
            theoretical coverage = 1000 ÷ (SG × film µm) m²/kg, the same as 192.3 ÷ (SG × film mil) ft²/lb (Products Finishing,
            “Coverage of Powder”); utilisation with reclaim = FPE ÷ (1 − reclaim × (1 − FPE)), derived, no published source;
            transfer efficiency by weight (Products Finishing, “What Impacts Transfer Efficiency?”); powder = area × parts ÷
            practical coverage.
          </HowComputed>
        </>
      }
      after={
        <SafetyNote title="Powder booth safety">
          <p>
            Airborne powder is a combustible dust. Keep booth exhaust, flame detection and interlocks working, clean up with
            approved vacuums rather than compressed air, and keep a dust hazard analysis current (NFPA 652, NFPA 654).
          </p>
          <p>
            Ground parts, hooks, racks and guns: a part that is not grounded can spark. Keep hooks clean so part-to-ground
            resistance stays at 1 MΩ or less (NFPA 33, NFPA 70 Art. 516, OSHA 1910.107).
          </p>
        </SafetyNote>
      }
    />
  );
}
