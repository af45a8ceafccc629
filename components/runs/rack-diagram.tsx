// The racking plan drawn flat for paper: the carrier window from the front (along travel × up)
// and from the side (across × up), every part as its box. Plain SVG, so it prints anywhere.

import type { UnitSystem } from "@/lib/coating-math/display-units";
import type { RackPlacement } from "@/lib/rack/types";
import { q } from "./format";

interface Props {
  windowMm: { widthMm: number; heightMm: number; depthMm: number };
  placements: readonly RackPlacement[];
  unitSystem: UnitSystem;
  /** drawn height of each view in CSS pixels (the width follows the window's proportions) */
  heightPx?: number;
}

/** Boxes seen along one axis: each distinct rectangle once (parts behind others hide). */
function projected(placements: readonly RackPlacement[], axis: 0 | 2): { x: number; y: number; w: number; h: number }[] {
  const seen = new Map<string, { x: number; y: number; w: number; h: number }>();
  for (const p of placements) {
    const r = { x: p.minMm[axis], y: p.minMm[1], w: p.sizeMm[axis], h: p.sizeMm[1] };
    const key = [r.x, r.y, r.w, r.h].map((v) => v.toFixed(3)).join("|");
    if (!seen.has(key)) seen.set(key, r);
  }
  return [...seen.values()];
}

function View({ title, widthMm, heightMm, boxes, unitSystem, heightPx, caption }: {
  title: string;
  widthMm: number;
  heightMm: number;
  boxes: { x: number; y: number; w: number; h: number }[];
  unitSystem: UnitSystem;
  heightPx: number;
  caption: string;
}) {
  // margins for the dimension labels, in mm of the drawing
  const pad = Math.max(widthMm, heightMm) * 0.08;
  const vbW = widthMm + pad * 2;
  const vbH = heightMm + pad * 2;
  const font = Math.max(widthMm, heightMm) * 0.045;
  const stroke = Math.max(widthMm, heightMm) * 0.004;
  return (
    <figure className="rack-diagram-view m-0">
      <svg
        role="img"
        aria-label={`${title}: ${caption}`}
        viewBox={`0 0 ${vbW} ${vbH}`}
        height={heightPx}
        width={(heightPx * vbW) / vbH}
        className="max-w-full"
      >
        {/* SVG y runs down; the window's y runs up from its floor */}
        <g transform={`translate(${pad} ${pad + heightMm}) scale(1 -1)`}>
          <rect x={0} y={0} width={widthMm} height={heightMm} fill="none" stroke="#000" strokeWidth={stroke * 1.6} strokeDasharray={`${stroke * 6} ${stroke * 3}`} />
          {boxes.map((b, i) => (
            <rect key={i} x={b.x} y={b.y} width={b.w} height={b.h} fill="#d9d9d9" stroke="#000" strokeWidth={stroke} />
          ))}
        </g>
        <text x={pad + widthMm / 2} y={pad + heightMm + font * 1.3} fontSize={font} textAnchor="middle" fill="#000">
          {q("lengthMm", widthMm, unitSystem, 4)}
        </text>
        <text
          x={pad - font * 0.5}
          y={pad + heightMm / 2}
          fontSize={font}
          textAnchor="middle"
          fill="#000"
          transform={`rotate(-90 ${pad - font * 0.5} ${pad + heightMm / 2})`}
        >
          {q("lengthMm", heightMm, unitSystem, 4)}
        </text>
      </svg>
      <figcaption className="text-xs">{title}</figcaption>
    </figure>
  );
}

export function RackDiagram({ windowMm, placements, unitSystem, heightPx = 220 }: Props) {
  const front = projected(placements, 0);
  const side = projected(placements, 2);
  return (
    <div className="flex flex-wrap items-end gap-6" data-testid="rack-diagram">
      <View
        title="Front: along travel × up"
        widthMm={windowMm.widthMm}
        heightMm={windowMm.heightMm}
        boxes={front}
        unitSystem={unitSystem}
        heightPx={heightPx}
        caption={`${front.length} part outlines in the window`}
      />
      <View
        title="Side: across × up"
        widthMm={windowMm.depthMm}
        heightMm={windowMm.heightMm}
        boxes={side}
        unitSystem={unitSystem}
        heightPx={heightPx}
        caption={`${side.length} part outlines in the window`}
      />
    </div>
  );
}
