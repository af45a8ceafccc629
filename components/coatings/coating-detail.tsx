"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingView } from "@/lib/server/coatings";
import { interpolateCureSchedule } from "@/lib/coating-math/cure-schedule";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { CHEMISTRY_LABELS } from "@/lib/coatings/chemistries";
import { TextField } from "@/components/ui/text-field";
import { money, parse, show, toShown, unitOf } from "@/components/lines/unit-draft";
import { browserOnly } from "@/components/ui/browser-only";
import { LotStatusMark, StockMarks, Swatch } from "./stock-marks";

// The editor loads when someone opens it: it stays out of the coating page's first load.
const CoatingEditor = browserOnly(
  () => import("./coating-editor").then((m) => m.CoatingEditor),
  <p role="status" className="text-sm text-ink-soft">Loading the editor…</p>,
);

// Receiving a lot and archiving are the purchaser's tools: their code loads on its own, so the
// page's first load is the same for everyone who only reads it.
const ReceiveLotForm = browserOnly(() => import("./coating-actions").then((m) => m.ReceiveLotForm), null);
const ArchivePanel = browserOnly(() => import("./coating-actions").then((m) => m.ArchiveCoating), null);

interface Props {
  id: number;
  unitSystem: UnitSystem;
  currency: string;
  canEdit: boolean;
}

/** One coating: its data, cure schedule, stock by lot; the purchaser edits it and receives lots. */
export function CoatingDetail({ id, unitSystem: sys, currency, canEdit }: Props) {
  const router = useRouter();
  const { data, error, isLoading, mutate } = useSWR<{ coating: CoatingView }>(`/api/coatings/${id}`);
  const [editing, setEditing] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  if (isLoading) return <p role="status">Loading the coating…</p>;
  if (error) {
    return (
      <p role="alert" className="text-oxide">
        {error instanceof FetchError && error.status === 404 ? "There is no such coating." : `Could not load the coating: ${error.message}`}{" "}
        <Link className="underline" href="/coatings">Back to the library</Link>
      </p>
    );
  }
  const c = data!.coating;

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <Swatch hex={c.swatchHex} label={c.colourName} />
        <h1>
          {c.code} · {c.name}
        </h1>
        {c.archived && <span className="rounded bg-plate-sunk px-2 py-0.5 text-sm">Archived</span>}
        <StockMarks coating={c} />
        {canEdit && !editing && (
          <button className="btn-quiet ml-auto" onClick={() => setEditing(true)}>Edit coating</button>
        )}
      </div>
      <p aria-live="polite" className={notice ? "text-sm text-ink-soft" : "sr-only"}>{notice}</p>

      {editing ? (
        <section className="card">
          <CoatingEditor
            initial={c}
            unitSystem={sys}
            currency={currency}
            onCancel={() => setEditing(false)}
            onSaved={async (saved) => {
              setEditing(false);
              setNotice(`${saved.code} saved.`);
              await mutate({ coating: saved }, { revalidate: false });
            }}
          />
        </section>
      ) : (
        <div className="grid gap-4 lg:grid-cols-2">
          <section className="card" aria-labelledby="facts-h">
            <h2 id="facts-h">Material</h2>
            <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-ink-soft">Kind</dt>
              <dd>{c.kind === "powder" ? "Powder" : "E-coat paint"}</dd>
              <dt className="text-ink-soft">Chemistry</dt>
              <dd>{CHEMISTRY_LABELS[c.chemistry]}</dd>
              <dt className="text-ink-soft">Colour</dt>
              <dd>
                {c.colourName} <span className="text-ink-faint">{c.swatchHex}</span>
              </dd>
              {c.kind === "powder" ? (
                <>
                  <dt className="text-ink-soft">Specific gravity</dt>
                  <dd className="num">{c.specificGravity}</dd>
                </>
              ) : (
                <>
                  <dt className="text-ink-soft">Volume solids (as supplied)</dt>
                  <dd className="num">{formatSignificant((c.volumeSolidsFraction ?? 0) * 100, 3)} %</dd>
                  <dt className="text-ink-soft">Weight solids (as supplied)</dt>
                  <dd className="num">{formatSignificant((c.weightSolidsFraction ?? 0) * 100, 3)} %</dd>
                  <dt className="text-ink-soft">Deposited film density</dt>
                  <dd className="num">{c.filmDensityGPerCm3} g/cm³</dd>
                </>
              )}
              <dt className="text-ink-soft">Film build</dt>
              <dd className="num">
                {show("filmUm", c.filmMinUm, sys)} – {show("filmUm", c.filmMaxUm, sys)}
              </dd>
              <dt className="text-ink-soft">Price</dt>
              <dd className="num">
                {money(toShown("pricePerKg", c.pricePerKg, sys), currency)} per {unitOf("pricePerKg", sys)}
              </dd>
              <dt className="text-ink-soft">Container</dt>
              <dd className="num">
                {c.containerKind} of {show("massKg", c.containerKg, sys, 4)}
              </dd>
              <dt className="text-ink-soft">Supplier</dt>
              <dd>
                {c.supplierName} · <a className="underline" href={`mailto:${c.supplierEmail}`}>{c.supplierEmail}</a>
              </dd>
              <dt className="text-ink-soft">Lead time · shelf life</dt>
              <dd className="num">
                {c.leadTimeDays} days · {c.shelfLifeMonths} months
              </dd>
              <dt className="text-ink-soft">Reorder point</dt>
              <dd className="num">{show("massKg", c.reorderPointKg, sys, 4)}</dd>
            </dl>
          </section>
          <CureSchedulePanel coating={c} unitSystem={sys} />
        </div>
      )}

      <section className="card space-y-3" aria-labelledby="lots-h">
        <div className="flex flex-wrap items-baseline gap-3">
          <h2 id="lots-h">Stock by lot</h2>
          <p className="num text-sm text-ink-soft">
            Usable {show("massKg", c.usableStockKg, sys, 4)}
            {c.expiredStockKg > 0 && <> · expired {show("massKg", c.expiredStockKg, sys, 4)} (do not use; dispose of per the SDS and local rules)</>}
          </p>
        </div>
        {c.lots.length === 0 ? (
          <p className="text-sm text-ink-soft">No lots in stock.</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-plate-line">
                <th scope="col" className="py-2 pr-3 font-medium">Lot</th>
                <th scope="col" className="py-2 pr-3 font-medium">Received</th>
                <th scope="col" className="py-2 pr-3 font-medium">Expires</th>
                <th scope="col" className="py-2 pr-3 font-medium">On hand</th>
                <th scope="col" className="py-2 pr-3 font-medium">Status</th>
              </tr>
            </thead>
            <tbody>
              {c.lots.map((l) => (
                <tr key={l.id} className="border-b border-plate-line/60">
                  <td className="py-2 pr-3 font-medium">{l.lotNumber}</td>
                  <td className="num py-2 pr-3">{l.receivedDate}</td>
                  <td className="num py-2 pr-3">
                    {l.expiryDate}
                    {l.status !== "empty" && <span className="ml-1 text-xs text-ink-faint">({l.daysToExpiry > 0 ? `in ${l.daysToExpiry} days` : `${-l.daysToExpiry} days ago`})</span>}
                  </td>
                  <td className="num py-2 pr-3">{show("massKg", l.kgOnHand, sys, 4)}</td>
                  <td className="py-2 pr-3"><LotStatusMark status={l.status} /></td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
        {canEdit && <ReceiveLotForm coating={c} unitSystem={sys} onReceived={async (saved, lot) => { setNotice(`Lot ${lot} received.`); await mutate({ coating: saved }, { revalidate: false }); }} />}
      </section>

      {canEdit && c.archived && (
        <section className="card" aria-labelledby="restore-h">
          <h2 id="restore-h">Archived</h2>
          <p className="text-sm text-ink-soft">This coating is archived: it is not offered for new work.</p>
          <button
            className="btn-quiet mt-2"
            onClick={async () => {
              try {
                const res = await sendJson<{ coating: CoatingView }>(`/api/coatings/${c.id}`, "PUT", { ...coatingInput(c), archived: false });
                setNotice(`${c.code} restored to the library.`);
                await mutate(res, { revalidate: false });
              } catch (e) {
                setNotice(e instanceof Error ? e.message : "Not restored.");
              }
            }}
          >
            Restore to the library
          </button>
        </section>
      )}
      {canEdit && !c.archived && (
        <ArchivePanel
          coating={c}
          onArchived={() => {
            router.push("/coatings");
          }}
        />
      )}
    </div>
  );
}

function CureSchedulePanel({ coating: c, unitSystem: sys }: { coating: CoatingView; unitSystem: UnitSystem }) {
  const [temp, setTemp] = useState("");
  let answer: string | null = null;
  const t = parse("temperatureC", temp, sys);
  if (t !== undefined) {
    if (Number.isNaN(t)) answer = "Enter a temperature as a number.";
    else {
      try {
        answer = `Hold ${formatSignificant(interpolateCureSchedule(c.cureSchedule, t), 3)} min at ${show("temperatureC", t, sys)} metal temperature.`;
      } catch {
        // outside the published points the schedule says nothing: refuse rather than extrapolate
        const temps = c.cureSchedule.map((p) => p.metalTempC);
        answer = `${show("temperatureC", t, sys, 4)} is outside the schedule (${show("temperatureC", Math.min(...temps), sys, 4)} to ${show("temperatureC", Math.max(...temps), sys, 4)}); the data sheet gives no hold there.`;
      }
    }
  }
  return (
    <section className="card" aria-labelledby="cure-h">
      <h2 id="cure-h">Cure schedule</h2>
      <p className="text-sm text-ink-soft">Metal (part) temperature, not air temperature.</p>
      <table className="mt-2 text-sm">
        <thead>
          <tr className="border-b border-plate-line">
            <th scope="col" className="py-1 pr-6 text-left font-medium">Metal temperature</th>
            <th scope="col" className="py-1 text-left font-medium">Hold</th>
          </tr>
        </thead>
        <tbody>
          {c.cureSchedule.map((p) => (
            <tr key={p.metalTempC} className="border-b border-plate-line/60">
              <td className="num py-1 pr-6">{show("temperatureC", p.metalTempC, sys, 4)}</td>
              <td className="num py-1">{formatSignificant(p.holdMin, 3)} min</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="mt-3 max-w-xs">
        <TextField label={`Hold at a metal temperature (${unitOf("temperatureC", sys)})`} name="holdAt" inputMode="decimal" value={temp} onChange={setTemp} />
      </div>
      <p aria-live="polite" className="mt-1 text-sm" data-testid="hold-answer">{answer}</p>
    </section>
  );
}

/** The editable part of a coating, as PUT takes it. */
function coatingInput(c: CoatingView) {
  return {
    code: c.code,
    name: c.name,
    kind: c.kind,
    chemistry: c.chemistry,
    colourName: c.colourName,
    swatchHex: c.swatchHex,
    specificGravity: c.specificGravity,
    volumeSolidsFraction: c.volumeSolidsFraction,
    weightSolidsFraction: c.weightSolidsFraction,
    filmDensityGPerCm3: c.filmDensityGPerCm3,
    filmMinUm: c.filmMinUm,
    filmMaxUm: c.filmMaxUm,
    cureSchedule: c.cureSchedule,
    pricePerKg: c.pricePerKg,
    containerKind: c.containerKind,
    containerKg: c.containerKg,
    supplierName: c.supplierName,
    supplierEmail: c.supplierEmail,
    leadTimeDays: c.leadTimeDays,
    shelfLifeMonths: c.shelfLifeMonths,
    reorderPointKg: c.reorderPointKg,
  };
}
