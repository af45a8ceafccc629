"use client";
// The planner's answer: the count, what limits it, the reason in the user's units, the planner's
// best beside an orientation set by hand, and the blocks.

import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { codeOfOrientation, codeWords } from "@/lib/rack/orientation-code";
import type { RackPlanResult } from "@/app/api/rack/plan/route";
import type { RackPlanRequest } from "@/lib/validation/rack";
import { reasonText } from "./reason-text";

interface Props {
  plan: RackPlanResult;
  input: RackPlanRequest;
  /** the planner's best when the input forces an orientation (null while it is counted) */
  best: RackPlanResult | null;
  stale: boolean;
  unitSystem: UnitSystem;
}

export function PlanResult({ plan, input, best, stale, unitSystem }: Props) {
  const kg = (v: number) => formatQuantity("massKg", v, unitSystem, 4);
  const words = (o: RackPlanResult["blocks"][number]["orientation"]) => {
    const code = codeOfOrientation(input.part, o);
    return code ? codeWords(code) : "turned";
  };
  return (
    <div className={stale ? "opacity-70" : undefined}>
      <p className="mt-1 flex flex-wrap items-baseline gap-3">
        <span className="num text-4xl font-semibold" data-testid="plan-count">
          {plan.count}
        </span>
        <span className={`rounded px-2 py-0.5 text-sm ${plan.limitedBy === "load" ? "bg-caution-light text-caution" : "bg-phosphate-light text-phosphate-dark"}`}>
          limited by {plan.limitedBy}
        </span>
        <span className="num text-sm text-ink-soft">
          {kg(plan.count * input.part.massKg)} of {kg(input.carrier.maxLoadKg)}
        </span>
      </p>
      <p className="mt-2 text-sm" data-testid="plan-reason">
        {reasonText(plan, input, unitSystem)}
      </p>
      {input.orientation && (
        <p className="mt-1 text-sm" data-testid="best-count">
          Orientation set by hand.{" "}
          {best ? (
            <>
              The planner&apos;s best holds <span className="num font-semibold">{best.count}</span>
              {best.count > plan.count ? `, ${best.count - plan.count} more` : best.count === plan.count ? ", the same" : ""}.
            </>
          ) : (
            "Counting the planner's best for comparison…"
          )}
        </p>
      )}
      {plan.blocks.length > 0 && (
        <ul className="mt-2 space-y-0.5 text-sm">
          {plan.blocks.map((b, i) => (
            <li key={i}>
              <span className="num">{b.grid.join(" × ")}</span> ({b.count} parts): {words(b.orientation)}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
