import { formatQuantity, formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";

interface Props {
  count: number;
  spaceCount?: number;
  totalKg: number;
  maxLoadKg: number;
  /** Placed part boxes over the window's volume, in %. */
  fillPercent: number;
  unitSystem: UnitSystem;
  drawnAs: "mesh" | "boxes";
  trianglesPerPart: number | null;
  overBudget: boolean;
  meshTriangles: number;
  budgetTriangles: number;
}

const whole = (n: number) => Math.round(n).toLocaleString("en-US");

/** Count, load and fill beside the 3D view; no three.js in here. */
export function RackSummary(p: Props) {
  const kg = (v: number) => formatQuantity("massKg", v, p.unitSystem);
  const loadPercent = p.maxLoadKg > 0 ? (p.totalKg / p.maxLoadKg) * 100 : 0;
  return (
    <aside className="card text-sm" aria-labelledby="rack-summary-h" data-testid="rack-summary">
      <h3 id="rack-summary-h" className="font-semibold">On this carrier</h3>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1.5">
        <dt className="text-ink-soft">Parts</dt>
        <dd className="num" data-testid="summary-count">
          {whole(p.count)}
          {p.spaceCount !== undefined && p.spaceCount > p.count && (
            <span className="text-ink-faint"> (space for {whole(p.spaceCount)})</span>
          )}
        </dd>
        <dt className="text-ink-soft">Load</dt>
        <dd className="num">
          {kg(p.totalKg)} of {kg(p.maxLoadKg)}
          <span className="text-ink-faint"> ({formatSignificant(loadPercent, 3)} %)</span>
        </dd>
        <dt className="text-ink-soft">Volume fill</dt>
        <dd className="num">
          {formatSignificant(p.fillPercent, 3)} %<span className="text-ink-faint"> of the window (part boxes)</span>
        </dd>
        <dt className="text-ink-soft">Drawn as</dt>
        <dd>
          {p.drawnAs === "mesh"
            ? `the part's mesh (${whole(p.trianglesPerPart ?? 0)} triangles each)`
            : p.trianglesPerPart === null
              ? "boxes (no mesh for this part)"
              : "boxes standing in for the mesh"}
        </dd>
      </dl>
      {p.overBudget && (
        <p className="mt-2 rounded bg-caution-light px-2 py-1 text-caution" data-testid="budget-note">
          {whole(p.count)} parts × {whole(p.trianglesPerPart ?? 0)} triangles = {whole(p.meshTriangles)} triangles, over the{" "}
          {whole(p.budgetTriangles)} this view draws at once, so each part is shown as its box.
        </p>
      )}
    </aside>
  );
}
