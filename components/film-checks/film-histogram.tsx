// Plain-SVG histogram of gauge readings with the spec band shaded (no chart library on first load).
import { histogram } from "@/lib/film-checks/readings";
import { toDisplay, type UnitSystem } from "@/lib/coating-math/display-units";

interface Props {
  valuesUm: number[];
  specMinUm: number;
  specMaxUm: number;
  unitSystem: UnitSystem;
  title: string;
}

const W = 420;
const H = 160;
const PAD = { l: 30, r: 10, t: 10, b: 30 };

export function FilmHistogram({ valuesUm, specMinUm, specMaxUm, unitSystem, title }: Props) {
  const bins = histogram(valuesUm, specMinUm, specMaxUm);
  if (!bins.length) return <p className="text-sm text-ink-faint">No readings to chart.</p>;
  const lo = bins[0].fromUm;
  const hi = bins[bins.length - 1].toUm;
  const top = Math.max(...bins.map((b) => b.count));
  const x = (um: number) => PAD.l + ((um - lo) / (hi - lo)) * (W - PAD.l - PAD.r);
  const y = (n: number) => H - PAD.b - (n / top) * (H - PAD.t - PAD.b);
  const show = (um: number) => {
    const d = toDisplay("filmUm", um, unitSystem);
    return `${Number(d.value.toFixed(unitSystem === "us" ? 2 : 0))}`;
  };
  const unit = toDisplay("filmUm", 1, unitSystem).unit;
  return (
    <figure>
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={title} className="w-full max-w-md" data-testid="film-histogram">
        <rect x={x(specMinUm)} y={PAD.t} width={Math.max(0, x(specMaxUm) - x(specMinUm))} height={H - PAD.t - PAD.b} className="fill-pass-light" />
        {bins.map((b, i) => (
          <rect
            key={i}
            x={x(b.fromUm) + 1}
            y={y(b.count)}
            width={Math.max(0, x(b.toUm) - x(b.fromUm) - 2)}
            height={H - PAD.b - y(b.count)}
            className={b.toUm <= specMinUm || b.fromUm >= specMaxUm ? "fill-oxide" : "fill-phosphate"}
          >
            <title>{`${show(b.fromUm)}–${show(b.toUm)} ${unit}: ${b.count}`}</title>
          </rect>
        ))}
        <line x1={PAD.l} x2={W - PAD.r} y1={H - PAD.b} y2={H - PAD.b} className="stroke-ink-faint" />
        {[specMinUm, specMaxUm].map((s) => (
          <g key={s}>
            <line x1={x(s)} x2={x(s)} y1={PAD.t} y2={H - PAD.b} className="stroke-pass" strokeDasharray="4 3" />
            <text x={x(s)} y={H - PAD.b + 14} textAnchor="middle" className="fill-ink-soft text-[10px]">{show(s)}</text>
          </g>
        ))}
        <text x={PAD.l} y={H - 4} className="fill-ink-faint text-[10px]">{show(lo)}</text>
        <text x={W - PAD.r} y={H - 4} textAnchor="end" className="fill-ink-faint text-[10px]">{`${show(hi)} ${unit}`}</text>
        <text x={4} y={PAD.t + 8} className="fill-ink-faint text-[10px]">{top}</text>
      </svg>
      <figcaption className="text-xs text-ink-faint">{title}. Green band: the spec; dashed lines: its limits.</figcaption>
    </figure>
  );
}
