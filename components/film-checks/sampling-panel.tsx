// How many SSPC-PA 2 areas and spots the run's coated surface needs (the run sheet's own plan)
// and how many each coat has recorded so far.

import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { PA2_SPOTS_PER_AREA } from "@/lib/coating-math/film";
import type { CoatSpec, RunFilmChecks } from "@/lib/server/film-checks";

interface Props {
  sampling: RunFilmChecks["sampling"];
  coats: CoatSpec[];
  unitSystem: UnitSystem;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

export function SamplingPanel({ sampling, coats, unitSystem: sys }: Props) {
  return (
    <section className="card space-y-2" aria-labelledby="sampling-h" data-testid="sampling-panel">
      <h2 id="sampling-h" className="text-lg font-semibold">Sampling plan (SSPC-PA 2)</h2>
      {sampling.unavailable ? (
        <p className="text-sm text-caution">{sampling.unavailable}</p>
      ) : sampling.coats.length === 0 ? (
        <p className="text-sm text-ink-faint">This run has no coats to check.</p>
      ) : (
        <>
          <table className="w-full text-left text-sm">
            <thead className="text-ink-soft">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">Coat</th>
                <th scope="col" className="py-1 pr-3 font-medium">Coated surface</th>
                <th scope="col" className="py-1 pr-3 font-medium">Needed</th>
                <th scope="col" className="py-1 pr-3 font-medium">Recorded so far</th>
                <th scope="col" className="py-1 font-medium">Still to measure</th>
              </tr>
            </thead>
            <tbody>
              {sampling.coats.map((s) => {
                const coat = coats.find((c) => c.coatIndex === s.coatIndex);
                const areasLeft = Math.max(0, s.areaCount - s.completeAreas);
                const done = areasLeft === 0;
                return (
                  <tr key={s.coatIndex} className="border-t border-plate-line align-top" data-testid={`sampling-coat-${s.coatIndex + 1}`}>
                    <th scope="row" className="py-1.5 pr-3 font-medium">{`${s.coatIndex + 1}. ${coat?.coatingCode ?? ""}`}</th>
                    <td className="num py-1.5 pr-3">{formatQuantity("areaM2", s.surfaceAreaM2, sys, 4)}</td>
                    <td className="py-1.5 pr-3">
                      {`${plural(s.areaCount, "area")}, ${plural(s.spotCount, "spot")}, at least ${plural(s.minReadingCount, "reading")}`}
                    </td>
                    <td className="py-1.5 pr-3">
                      {`${plural(s.recordedAreas, "area")} (${s.completeAreas} complete), ${plural(s.recordedSpots, "spot")}, ${plural(s.recordedReadings, "reading")}`}
                    </td>
                    <td className={`py-1.5 font-medium ${done ? "text-pass" : "text-caution"}`}>
                      {done ? "Complete" : `${plural(areasLeft, "area")} (${plural(areasLeft * PA2_SPOTS_PER_AREA, "spot")})`}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <p className="text-xs text-ink-faint">
            Areas follow the coated surface of all parts of the run, as on the run sheet. SSPC-PA 2 writes the rule in ft²: under 300 ft² one area per
            100 ft² or part; 300–1000 ft² three; above that three plus one per further 1000 ft² or part. An area is 5 spots; a spot is the average of at
            least 3 gauge readings. A complete area has all 5 spots of at least 3 readings. ISO 19840 checks add to the readings only.
          </p>
        </>
      )}
    </section>
  );
}
