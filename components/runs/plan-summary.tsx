// A run's computed plan: carriers, line time, material and cost, and each coat's numbers.

import type { UnitSystem } from "@/lib/coating-math/display-units";
import type { RunPlan } from "@/lib/runs/plan-run";
import { duration, money, percent, plural, q } from "./format";
import { Swatch } from "./status-badge";

interface Props {
  plan: RunPlan;
  unitSystem: UnitSystem;
  currency: string;
  /** a heading level for the coats table */
  compact?: boolean;
}

export function containerText(n: number, kind: "box" | "drum", sizeKg: number, system: UnitSystem): string {
  return `${plural(n, kind, kind === "box" ? "boxes" : "drums")} of ${q("massKg", sizeKg, system, 4)}`;
}

export function PlanFacts({ plan, unitSystem: sys, currency }: Props) {
  const word = plan.lineKind === "conveyor" ? "carrier" : "rack";
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm sm:grid-cols-4" data-testid="plan-facts">
      <div>
        <dt className="text-ink-soft">Parts per {word}</dt>
        <dd className="num text-lg font-semibold" data-testid="parts-per-carrier">{plan.racking.partsPerCarrier}</dd>
        <dd className="text-xs text-ink-faint">
          {plan.racking.overridden
            ? `set by hand (planner: ${plan.racking.plannedPerCarrier})`
            : plan.racking.savedPlanId !== null
              ? `from saved racking plan ${plan.racking.savedPlanId}, limited by ${plan.racking.limitedBy}`
              : `limited by ${plan.racking.limitedBy}`}
        </dd>
      </div>
      <div>
        <dt className="text-ink-soft">{plan.lineKind === "conveyor" ? "Carriers" : "Racks"}</dt>
        <dd className="num text-lg font-semibold" data-testid="carriers">{plan.carriers.toLocaleString("en-US")}</dd>
        <dd className="text-xs text-ink-faint">
          {plan.loads !== null ? `${plural(plan.loads, "oven load")} per coat` : plan.passes > 1 ? `${plan.passes} passes through the line` : "one pass"}
        </dd>
      </div>
      <div>
        <dt className="text-ink-soft">Line time</dt>
        <dd className="num text-lg font-semibold" data-testid="line-time">{duration(plan.lineTimeMin)}</dd>
        <dd className="text-xs text-ink-faint">
          {plan.lineSpeedMPerMin !== null ? `at ${q("speedMPerMin", plan.lineSpeedMPerMin, sys)}; first on to last off` : "oven cycles back to back"}
        </dd>
      </div>
      <div>
        <dt className="text-ink-soft">Material</dt>
        <dd className="num text-lg font-semibold" data-testid="material">{q("massKg", plan.materialKg, sys)}</dd>
        <dd className="text-xs text-ink-faint">all coats</dd>
      </div>
      <div>
        <dt className="text-ink-soft">Cost per part</dt>
        <dd className="num text-lg font-semibold" data-testid="cost-per-part">{money(plan.cost.totalPerPart, currency)}</dd>
        <dd className="text-xs text-ink-faint">
          material {money(plan.cost.materialCostPerPart, currency)} + line {money(plan.cost.lineCostPerPart, currency)}
        </dd>
      </div>
      <div>
        <dt className="text-ink-soft">Run cost</dt>
        <dd className="num text-lg font-semibold">{money(plan.cost.runTotal, currency)}</dd>
        <dd className="text-xs text-ink-faint">{plural(plan.quantity, "part")}</dd>
      </div>
      <div>
        <dt className="text-ink-soft">Load per {word}</dt>
        <dd className="num text-lg font-semibold">{q("massKg", plan.racking.loadKg, sys)}</dd>
        <dd className="text-xs text-ink-faint">limit {q("massKg", plan.racking.maxLoadKg, sys)}</dd>
      </div>
      <div>
        <dt className="text-ink-soft">Cure</dt>
        <dd className={`text-lg font-semibold ${plan.cures ? "text-pass" : "text-oxide"}`} data-testid="cures">{plan.cures ? "Every coat cures" : "Does not cure"}</dd>
      </div>
    </dl>
  );
}

/** "utilisation: measured 65 % (3 runs) · nominal 55 %" when the plan uses the measured figure. */
export function utilisationText(c: RunPlan["coats"][number]): string {
  const nominal = c.nominalUtilization !== null ? `nominal ${percent(c.nominalUtilization)}` : "";
  if (c.utilizationUsed !== "measured" || c.measuredUtilization === null) return nominal && `utilisation: ${nominal}`;
  const runs = c.measuredRuns !== null ? ` (${plural(c.measuredRuns, "run")})` : "";
  return `utilisation: measured ${percent(c.measuredUtilization)}${runs}${nominal && ` · ${nominal}`}`;
}

export function CoatsTable({ plan, unitSystem: sys, currency }: Props) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[44rem] text-left text-sm" data-testid="coats-table">
        <caption className="sr-only">Coats in order with their numbers</caption>
        <thead className="text-ink-soft">
          <tr>
            <th className="py-1 pr-3 font-medium">Coat</th>
            <th className="py-1 pr-3 font-medium">Film</th>
            <th className="py-1 pr-3 font-medium">Coated area</th>
            <th className="py-1 pr-3 font-medium">Material</th>
            <th className="py-1 pr-3 font-medium">To draw from stock</th>
            <th className="py-1 pr-3 font-medium">Oven</th>
            <th className="py-1 pr-3 font-medium">Cure margin</th>
          </tr>
        </thead>
        <tbody>
          {plan.coats.map((c) => (
            <tr key={c.position} className="border-t border-plate-line align-top" data-testid={`coat-row-${c.position}`}>
              <td className="py-1.5 pr-3">
                <span className="flex items-center gap-1.5">
                  <Swatch hex={c.swatchHex} label={c.colourName} />
                  <span className="font-medium">{c.position + 1}. {c.code}</span>
                </span>
                <span className="block text-xs text-ink-faint">
                  {c.kind === "e-coat" ? "E-coat" : "Powder"} · {c.colourName}
                  {c.kind === "powder" && c.firstPassEfficiency !== null && ` · FPE ${percent(c.firstPassEfficiency)}, reclaim ${percent(c.reclaimEfficiency ?? 0)}`}
                  {c.pass > 1 && ` · pass ${c.pass}`}
                </span>
              </td>
              <td className="py-1.5 pr-3 num">{q("filmUm", c.filmUm, sys)}</td>
              <td className="py-1.5 pr-3 num">
                {q("areaM2", c.areaM2, sys)}
                <span className="block text-xs text-ink-faint">{q("areaM2", c.areaPerPartM2, sys)} per part</span>
              </td>
              <td className="py-1.5 pr-3 num" data-testid={`coat-material-${c.position}`}>
                {q("massKg", c.materialKg, sys)}
                <span className="block text-xs text-ink-faint">{money(c.materialCost, currency)}</span>
                {c.kind === "powder" && <span className="block text-xs text-ink-faint" data-testid={`coat-utilisation-${c.position}`}>{utilisationText(c)}</span>}
              </td>
              <td className="py-1.5 pr-3 num">{containerText(c.containers, c.containerKind, c.containerKg, sys)}</td>
              <td className="py-1.5 pr-3">
                {c.cure.ovenName}
                <span className="block text-xs text-ink-faint num">
                  {q("temperatureC", c.cure.airTempC, sys, 4)} air
                  {c.cure.dwellMin !== null && `, ${duration(c.cure.dwellMin)} ${plan.lineKind === "conveyor" ? "dwell" : "heat-up + hold"}`}
                </span>
              </td>
              <td className={`py-1.5 pr-3 num ${c.cure.pass ? "text-pass" : "text-oxide font-medium"}`}>
                {c.cure.marginMin !== null ? `${c.cure.marginMin >= 0 ? "+" : "−"}${duration(Math.abs(c.cure.marginMin))}` : c.cure.pass ? (c.cure.cycleMin !== null ? "cycle set to cure" : "cures") : "does not cure"}
                {c.cure.requiredMin !== null && <span className="block text-xs text-ink-faint">needs {duration(c.cure.requiredMin)}</span>}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function Warnings({ warnings }: { warnings: readonly string[] }) {
  if (!warnings.length) return null;
  return (
    <div role="status" className="rounded-md border border-caution-edge bg-caution-light p-3 text-sm" data-testid="plan-warnings">
      <p className="font-medium">Look at {warnings.length === 1 ? "this" : "these"} before you run it:</p>
      <ul className="mt-1 list-disc space-y-0.5 pl-5">
        {warnings.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
    </div>
  );
}
