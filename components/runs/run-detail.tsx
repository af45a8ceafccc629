"use client";
// One run: what it is, its computed plan, the 3D rack, status changes, edit and delete.

import Link from "next/link";
import { useState } from "react";
import { useRouter } from "next/navigation";
import useSWR from "swr";
import { RackViewLazy } from "@/components/three/rack-view-lazy";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { maskingItems } from "@/lib/runs/masking";
import { RUN_STATUS_LABELS, TRANSITION_ACTIONS, type RunStatus } from "@/lib/runs/status";
import type { RunOne } from "@/app/api/runs/[id]/route";
import type { RunPartView } from "@/lib/server/runs";
import { dayLabel } from "./format";
import { CoatsTable, PlanFacts, Warnings } from "./plan-summary";
import { StatusBadge } from "./status-badge";
import { browserOnly } from "@/components/ui/browser-only";

// The edit form loads when someone opens it: it stays out of the run page's first load.
const RunForm = browserOnly(
  () => import("./run-form").then((m) => m.RunForm),
  <p role="status" className="text-sm text-ink-soft">Loading the form…</p>,
);

interface Props {
  id: number;
  parts: RunPartView[];
  unitSystem: UnitSystem;
  currency: string;
  canPlan: boolean;
}

/** Moves that undo work ask first. */
const CONFIRM: Partial<Record<RunStatus, string>> = {
  cancelled: "Cancel this run? A cancelled run stays on record but cannot be planned again.",
};

export function RunDetailView({ id, parts, unitSystem: sys, currency, canPlan }: Props) {
  const router = useRouter();
  const { data, error, isLoading, mutate } = useSWR<RunOne, FetchError>(`/api/runs/${id}`);
  const [editing, setEditing] = useState(false);
  const [asking, setAsking] = useState<RunStatus | "delete" | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  if (isLoading) return <p role="status">Loading the run…</p>;
  if (error) return <p role="alert" className="text-oxide">{error.status === 404 ? "There is no such run." : `Could not load the run: ${error.message}`}</p>;
  if (!data) return null;
  const run = data.run;
  const plan = run.plan;

  async function moveTo(status: RunStatus) {
    setBusy(true);
    setMessage(null);
    try {
      await sendJson(`/api/runs/${id}/status`, "POST", { status });
      await mutate();
      setMessage({ kind: "ok", text: `The run is ${RUN_STATUS_LABELS[status].toLowerCase()}.` });
    } catch (e) {
      setMessage({ kind: "error", text: e instanceof Error ? e.message : "Could not change the status." });
    } finally {
      setBusy(false);
      setAsking(null);
    }
  }

  async function remove() {
    setBusy(true);
    try {
      await sendJson(`/api/runs/${id}`, "DELETE");
      router.push("/runs");
    } catch (e) {
      setMessage({ kind: "error", text: e instanceof Error ? e.message : "Could not delete the run." });
      setBusy(false);
      setAsking(null);
    }
  }

  const ask = (what: RunStatus | "delete") => (what === "delete" || CONFIRM[what] ? setAsking(what) : moveTo(what));

  if (editing) {
    return (
      <section aria-labelledby="edit-h" className="space-y-3">
        <h1 id="edit-h">Edit run {run.id}</h1>
        <RunForm
          parts={parts.some((p) => p.id === run.partId) || !run.part ? parts : [run.part, ...parts]}
          unitSystem={sys}
          currency={currency}
          initial={run}
          onSaved={async () => {
            await mutate();
            setEditing(false);
            setMessage({ kind: "ok", text: "Run saved." });
          }}
          onCancel={() => setEditing(false)}
        />
      </section>
    );
  }

  const masking = maskingItems(run.masking);
  return (
    <div className="space-y-5">
      <div className="flex flex-wrap items-start gap-3">
        <div className="mr-auto">
          <h1>
            Run {run.id}: {run.quantity.toLocaleString("en-US")} × {run.part?.number ?? "?"} <span className="font-normal text-ink-soft">{run.part?.name}</span>
          </h1>
          <p className="mt-1 text-sm text-ink-soft">
            {run.line.name} · {dayLabel(run.date)} · shift {run.shift} · <StatusBadge status={run.status} />
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link className="btn-quiet" href={`/runs/${run.id}/sheet`}>Run sheet</Link>
          <Link className="btn-quiet" href={`/runs/${run.id}/film`}>Film checks</Link>
          {run.status === "done" && <Link className="btn-quiet" href={`/feedback/runs/${run.id}`}>Actual use</Link>}
          <Link className="btn-quiet" href={`/board?lineId=${run.lineId}&date=${run.date}`}>Day board</Link>
        </div>
      </div>

      {canPlan && (
        <div className="flex flex-wrap items-center gap-2" aria-label="Run actions" role="group">
          {run.nextStatuses.map((s) => (
            <button key={s} type="button" className={s === "cancelled" ? "btn-danger" : "btn-primary"} disabled={busy} onClick={() => ask(s)}>
              {TRANSITION_ACTIONS[s]}
            </button>
          ))}
          {run.editable && (
            <button type="button" className="btn-quiet" onClick={() => setEditing(true)} disabled={busy}>
              Edit run
            </button>
          )}
          {run.status === "draft" && (
            <button type="button" className="btn-quiet text-oxide" onClick={() => ask("delete")} disabled={busy}>
              Delete draft
            </button>
          )}
        </div>
      )}
      {asking && (
        <div role="alertdialog" aria-labelledby="confirm-text" className="rounded-md border border-oxide bg-oxide-light p-3 text-sm">
          <p id="confirm-text">{asking === "delete" ? "Delete this draft run? It cannot be undone." : CONFIRM[asking]}</p>
          <div className="mt-2 flex gap-2">
            <button type="button" className="btn-danger" disabled={busy} onClick={() => (asking === "delete" ? remove() : moveTo(asking))}>
              {asking === "delete" ? "Delete" : TRANSITION_ACTIONS[asking]}
            </button>
            <button type="button" className="btn-quiet" onClick={() => setAsking(null)} autoFocus>
              Keep it
            </button>
          </div>
        </div>
      )}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "field-error" : "text-sm text-pass"}>
          {message.text}
        </p>
      )}

      {run.planError && (
        <p role="alert" className="card border-oxide text-oxide">
          This run no longer plans: {run.planError.message}
        </p>
      )}
      {plan && (
        <>
          <section className="card space-y-4" aria-labelledby="plan-h">
            <h2 id="plan-h">The plan</h2>
            {run.planFrozenAt !== null && (
              <p className="text-sm text-ink-soft" data-testid="plan-frozen-note">
                These figures are kept as they stood on{" "}
                {new Date(run.planFrozenAt * 1000).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" })}: later changes to the line,
                coatings, prices or part do not change a run that has started or was cancelled.
              </p>
            )}
            <PlanFacts plan={plan} unitSystem={sys} currency={currency} />
            <Warnings warnings={run.warnings} />
            <CoatsTable plan={plan} unitSystem={sys} currency={currency} />
          </section>
          <section className="card space-y-3" aria-labelledby="rack-h">
            <h2 id="rack-h">Racking</h2>
            <p className="text-sm">{run.rackingReason ?? plan.racking.reason}</p>
            <RackViewLazy
              windowMm={plan.racking.windowMm}
              placements={plan.racking.plan.placements.slice(0, plan.racking.partsPerCarrier)}
              clearanceMm={plan.racking.clearanceMm}
              partMassKg={run.part?.massKg ?? 0}
              maxLoadKg={plan.racking.maxLoadKg}
              spaceCount={plan.racking.spaceCount}
              unitSystem={sys}
            />
          </section>
        </>
      )}
      <section className="card grid gap-4 sm:grid-cols-2" aria-label="Masking and notes">
        <div>
          <h2 className="text-base">Masking</h2>
          {masking.length ? (
            <ul className="mt-1 list-disc pl-5 text-sm">
              {masking.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          ) : (
            <p className="mt-1 text-sm text-ink-faint">No masking listed.</p>
          )}
        </div>
        <div>
          <h2 className="text-base">Notes</h2>
          <p className="mt-1 whitespace-pre-line text-sm">{run.notes || <span className="text-ink-faint">None.</span>}</p>
        </div>
      </section>
    </div>
  );
}
