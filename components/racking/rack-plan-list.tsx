"use client";
// The plan as a plain printable list: the blocks with their grids and spacing, then the tiers
// from the bottom up — what the person hanging parts needs at the rack.

import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { sameLengthMm } from "@/lib/rack/orientations";
import type { RackPlanResult } from "@/app/api/rack/plan/route";
import type { RackPlanRequest } from "@/lib/validation/rack";

type Orientation = RackPlanResult["blocks"][number]["orientation"];

/** "length along travel, height up, width across" for the part's own dimensions. */
export function orientationWords(part: RackPlanRequest["part"], o: Orientation): string {
  const names: [string, number][] = [
    ["length", part.lengthMm],
    ["width", part.widthMm],
    ["height", part.heightMm],
  ];
  const used = new Set<number>();
  const pick = (v: number) => {
    let i = names.findIndex(([, d], k) => !used.has(k) && sameLengthMm(d, v));
    if (i < 0) i = names.findIndex((_, k) => !used.has(k));
    used.add(i);
    return names[i][0];
  };
  return `${pick(o.alongWidthMm)} along travel, ${pick(o.alongHeightMm)} up, ${pick(o.alongDepthMm)} across`;
}

/** Placements grouped by the height of their lower face: one tier per level, lowest first. */
export function tiersOf(placements: RackPlanResult["placements"]): { bottomMm: number; count: number; tallestMm: number }[] {
  const tiers: { bottomMm: number; count: number; tallestMm: number }[] = [];
  for (const p of placements) {
    const y = p.minMm[1];
    const tier = tiers.find((t) => Math.abs(t.bottomMm - y) <= 1e-6 * Math.max(1, Math.abs(y)));
    if (tier) {
      tier.count += 1;
      tier.tallestMm = Math.max(tier.tallestMm, p.sizeMm[1]);
    } else {
      tiers.push({ bottomMm: y, count: 1, tallestMm: p.sizeMm[1] });
    }
  }
  return tiers.sort((a, b) => a.bottomMm - b.bottomMm);
}

interface Props {
  input: RackPlanRequest;
  plan: RackPlanResult;
  unitSystem: UnitSystem;
}

export function RackPlanList({ input, plan, unitSystem }: Props) {
  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);
  const kg = (v: number) => formatQuantity("massKg", v, unitSystem, 4);
  const c = input.clearanceMm;
  const tiers = tiersOf(plan.placements);
  const { part, carrier } = input;
  return (
    <section className="card" aria-labelledby="plan-list-h" data-testid="plan-list">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 id="plan-list-h">The plan as a list</h2>
        <button type="button" className="btn-quiet no-print" onClick={() => window.print()}>
          Print
        </button>
      </div>
      <p className="mt-1 text-sm">
        Part {len(part.lengthMm)} long × {len(part.widthMm)} wide × {len(part.heightMm)} high, {kg(part.massKg)}; window{" "}
        {len(carrier.widthMm)} along travel × {len(carrier.heightMm)} high × {len(carrier.depthMm)} across, load limit{" "}
        {kg(carrier.maxLoadKg)}; clearance {len(c)}; {input.orientations === "upright" ? "upright only" : "any orientation"}.
      </p>
      {plan.count === 0 ? (
        <p className="mt-3 text-sm">Nothing to hang: {plan.reason}</p>
      ) : (
        <>
          <h3 className="mt-4 font-semibold">Blocks</h3>
          <div className="overflow-x-auto">
            <table className="mt-1 w-full text-left text-sm">
              <thead className="text-ink-soft">
                <tr>
                  <th className="py-1 pr-3 font-medium">Block</th>
                  <th className="py-1 pr-3 font-medium">Orientation</th>
                  <th className="py-1 pr-3 font-medium">Grid (along × tiers × across)</th>
                  <th className="py-1 pr-3 font-medium">Parts</th>
                  <th className="py-1 pr-3 font-medium">First part&apos;s corner (x, y, z)</th>
                  <th className="py-1 pr-3 font-medium">Spacing, centre to centre (along / up / across)</th>
                </tr>
              </thead>
              <tbody>
                {plan.blocks.map((b, i) => {
                  const size = [b.orientation.alongWidthMm, b.orientation.alongHeightMm, b.orientation.alongDepthMm];
                  const spacing = size.map((s, a) => (b.grid[a] > 1 ? len(s + c) : "—"));
                  return (
                    <tr key={i} className="border-t border-plate-line align-top">
                      <td className="py-1 pr-3 num">{i === 0 ? "1 (main)" : i + 1}</td>
                      <td className="py-1 pr-3">
                        {orientationWords(part, b.orientation)}
                        <span className="block text-xs text-ink-faint">{size.map(len).join(" × ")}</span>
                      </td>
                      <td className="py-1 pr-3 num">{b.grid.join(" × ")}</td>
                      <td className="py-1 pr-3 num">
                        {b.count}
                        {b.count < b.grid[0] * b.grid[1] * b.grid[2] && (
                          <span className="block text-xs text-ink-faint">of {b.grid[0] * b.grid[1] * b.grid[2]} by space</span>
                        )}
                      </td>
                      <td className="py-1 pr-3 num">{b.originMm.map(len).join(", ")}</td>
                      <td className="py-1 pr-3 num">{spacing.join(" / ")}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          <h3 className="mt-4 font-semibold">Tiers, from the bottom</h3>
          <table className="mt-1 w-full text-left text-sm" data-testid="tier-table">
            <thead className="text-ink-soft">
              <tr>
                <th className="py-1 pr-3 font-medium">Tier</th>
                <th className="py-1 pr-3 font-medium">Lower face above the window floor</th>
                <th className="py-1 pr-3 font-medium">Parts in the tier</th>
                <th className="py-1 pr-3 font-medium">Part height</th>
              </tr>
            </thead>
            <tbody>
              {tiers.map((t, i) => (
                <tr key={i} className="border-t border-plate-line">
                  <td className="py-1 pr-3 num">{i + 1}</td>
                  <td className="py-1 pr-3 num">{len(t.bottomMm)}</td>
                  <td className="py-1 pr-3 num">{t.count}</td>
                  <td className="py-1 pr-3 num">{len(t.tallestMm)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-2 text-xs text-ink-faint">
            x runs along travel from the window&apos;s front lower corner, y up, z across (depth). Clearance is the gap
            between neighbouring parts; spacing is part size plus clearance.
          </p>
        </>
      )}
    </section>
  );
}
