"use client";
// The day board of one line: each shift's runs in order, colour changes between them, how much of
// the shift they fill, runs that end past it. Supervisors reorder by dragging, with the move
// buttons, or with Alt+↑ / Alt+↓ on a focused row; the order is saved at once. "Propose an order"
// groups runs by cure schedule and goes light to dark.

import Link from "next/link";
import { useEffect, useRef, useState } from "react";
import useSWR from "swr";
import { FetchError, fetcher, sendJson } from "@/lib/fetcher";
import type { LinesList } from "@/app/api/lines/route";
import type { BoardOne } from "@/app/api/runs/board/route";
import type { ProposalOne } from "@/app/api/runs/board/propose/route";
import type { BoardShiftView, BoardView } from "@/lib/server/runs";
import { addDays, dayLabel, duration, localToday } from "@/components/runs/format";
import { StatusBadge, Swatch } from "@/components/runs/status-badge";

/** Minutes into the shift as h:mm. */
function clock(min: number): string {
  const m = Math.round(min);
  return `${Math.floor(m / 60)}:${String(m % 60).padStart(2, "0")}`;
}

/**
 * The shift as a bar: each run's loading (the line's entrance busy with its carriers), the booth's
 * colour changes between runs, and the last carriers' trip to the unload; the mark is the shift's end.
 */
function FillBar({ shift }: { shift: BoardShiftView }) {
  const total = Math.max(shift.shiftMin, shift.filledMin, 1);
  const pct = (v: number) => `${(100 * v) / total}%`;
  const lastLoadEnd = shift.runs.reduce((a, r) => Math.max(a, r.slot.startMin + r.loadingMin), 0);
  return (
    <div>
      <div className="relative h-5 overflow-hidden rounded border border-plate-line bg-white" aria-hidden="true" data-testid={`shift-${shift.shift}-bar`}>
        {shift.runs.map((r, i) => (
          <div
            key={r.id}
            className={`absolute top-0 h-full border-r border-white ${!r.slot.fits ? "bg-oxide" : i % 2 ? "bg-phosphate" : "bg-phosphate-dark"}`}
            style={{ left: pct(r.slot.startMin), width: pct(r.loadingMin) }}
            title={`${r.part.number}: loading ${clock(r.slot.startMin)}–${clock(r.slot.startMin + r.loadingMin)}`}
          />
        ))}
        {shift.runs
          .filter((r) => r.slot.colourChangeBeforeMin > 0)
          .map((r) => (
            <div
              key={`cc-${r.id}`}
              className="absolute top-0 h-full bg-caution-edge"
              style={{ left: pct(r.slot.startMin - r.slot.colourChangeBeforeMin), width: pct(r.slot.colourChangeBeforeMin) }}
              title={`Colour change, ${duration(r.slot.colourChangeBeforeMin)}`}
            />
          ))}
        {shift.filledMin > lastLoadEnd && (
          <div
            className={`absolute top-0 h-full ${shift.fits ? "bg-phosphate-light" : "bg-oxide-light"}`}
            style={{ left: pct(lastLoadEnd), width: pct(shift.filledMin - lastLoadEnd) }}
            title="The last carriers on their way to the unload"
          />
        )}
        <div className="absolute top-0 h-full border-l-2 border-ink" style={{ left: `calc(${pct(shift.shiftMin)} - 2px)` }} />
      </div>
      <p className="mt-1 flex flex-wrap gap-x-4 text-xs text-ink-soft">
        <span><span className="mr-1 inline-block h-2.5 w-2.5 bg-phosphate-dark align-middle" />loading</span>
        <span><span className="mr-1 inline-block h-2.5 w-2.5 bg-caution-edge align-middle" />colour change</span>
        <span><span className="mr-1 inline-block h-2.5 w-2.5 border border-plate-line bg-phosphate-light align-middle" />last carriers to the unload</span>
        <span><span className="mr-1 inline-block h-2.5 w-0.5 bg-ink align-middle" />end of shift</span>
      </p>
    </div>
  );
}

interface ShiftProps {
  board: BoardView;
  shift: BoardShiftView;
  canReorder: boolean;
  onOrder: (shift: number, ids: number[], movedId: number) => Promise<void>;
  saving: boolean;
}

function ShiftSection({ board, shift, canReorder, onOrder, saving }: ShiftProps) {
  const [dragId, setDragId] = useState<number | null>(null);
  const [overId, setOverId] = useState<number | null>(null);
  const rows = useRef(new Map<number, HTMLLIElement>());
  const focusAfter = useRef<number | null>(null);
  const ids = shift.runs.map((r) => r.id);

  useEffect(() => {
    if (focusAfter.current !== null) {
      rows.current.get(focusAfter.current)?.focus();
      focusAfter.current = null;
    }
  });

  async function move(id: number, to: number) {
    const from = ids.indexOf(id);
    if (from < 0 || to < 0 || to >= ids.length || from === to) return;
    const next = [...ids];
    next.splice(from, 1);
    next.splice(to, 0, id);
    focusAfter.current = id;
    await onOrder(shift.shift, next, id);
  }

  const changeBefore = new Map(shift.colourChanges.map((c) => [c.beforeRunId, c]));
  const coatName = (hex: string) => shift.runs.flatMap((r) => r.coats).find((c) => c.swatchHex === hex)?.colourName ?? hex;

  return (
    <section className="card space-y-3" aria-labelledby={`shift-${shift.shift}-h`} data-testid={`shift-${shift.shift}`}>
      <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <h2 id={`shift-${shift.shift}-h`}>Shift {shift.shift}</h2>
        <p className="num text-sm" data-testid={`shift-${shift.shift}-fill`}>
          {duration(shift.filledMin)} of {duration(shift.shiftMin)} filled ·{" "}
          {shift.leftMin >= 0 ? (
            <span>{duration(shift.leftMin)} left</span>
          ) : (
            <span className="font-semibold text-oxide">{duration(-shift.leftMin)} past the shift</span>
          )}
          {shift.colourChanges.length > 0 && ` · ${shift.colourChanges.length} colour change${shift.colourChanges.length === 1 ? "" : "s"}`}
        </p>
      </div>
      <FillBar shift={shift} />
      {shift.runs.length === 0 ? (
        <p className="text-sm text-ink-soft">No runs in this shift.</p>
      ) : (
        <ol className="space-y-1.5" aria-label={`Shift ${shift.shift} runs in order`}>
          {shift.runs.map((r, i) => {
            const change = changeBefore.get(r.id);
            return (
              <li
                key={r.id}
                ref={(el) => {
                  if (el) rows.current.set(r.id, el);
                  else rows.current.delete(r.id);
                }}
                tabIndex={0}
                data-run-id={r.id}
                draggable={canReorder && !saving}
                aria-label={`${i + 1} of ${shift.runs.length}: ${r.part.number} × ${r.quantity}${r.slot.fits ? "" : ", does not fit the shift"}`}
                aria-keyshortcuts={canReorder ? "Alt+ArrowUp Alt+ArrowDown" : undefined}
                onKeyDown={(e) => {
                  if (!canReorder || !e.altKey || saving) return;
                  if (e.key === "ArrowUp") {
                    e.preventDefault();
                    void move(r.id, i - 1);
                  } else if (e.key === "ArrowDown") {
                    e.preventDefault();
                    void move(r.id, i + 1);
                  }
                }}
                onDragStart={(e) => {
                  setDragId(r.id);
                  e.dataTransfer.effectAllowed = "move";
                  e.dataTransfer.setData("text/plain", String(r.id));
                }}
                onDragOver={(e) => {
                  if (dragId === null || !ids.includes(dragId)) return;
                  e.preventDefault();
                  e.dataTransfer.dropEffect = "move";
                  setOverId(r.id);
                }}
                onDragLeave={() => setOverId((o) => (o === r.id ? null : o))}
                onDrop={(e) => {
                  e.preventDefault();
                  const id = Number(e.dataTransfer.getData("text/plain")) || dragId;
                  setDragId(null);
                  setOverId(null);
                  if (id) void move(id, i);
                }}
                onDragEnd={() => {
                  setDragId(null);
                  setOverId(null);
                }}
                className={`rounded-md border bg-white p-2 outline-offset-2 ${r.slot.fits ? "border-plate-line" : "border-oxide"} ${overId === r.id ? "ring-2 ring-phosphate" : ""} ${dragId === r.id ? "opacity-50" : ""}`}
              >
                {change && (
                  <p className="mb-1.5 flex items-center gap-1.5 rounded bg-caution-light px-2 py-0.5 text-xs text-caution" data-testid="colour-change">
                    Colour change, {duration(change.minutes)}: <Swatch hex={change.fromHex} label={coatName(change.fromHex)} /> {coatName(change.fromHex)} →{" "}
                    <Swatch hex={change.toHex} label={coatName(change.toHex)} /> {coatName(change.toHex)}
                  </p>
                )}
                <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
                  {canReorder && (
                    <span className="cursor-grab select-none text-ink-faint" aria-hidden="true" title="Drag to reorder">
                      ⠿
                    </span>
                  )}
                  <span className="num w-5 text-right text-ink-faint">{i + 1}</span>
                  <span className="flex gap-0.5">
                    {r.coats.map((c, k) => (
                      <Swatch key={k} hex={c.swatchHex} label={`${c.code} ${c.colourName}`} size="h-4 w-4" />
                    ))}
                  </span>
                  <Link href={`/runs/${r.id}`} className="font-medium text-phosphate-dark underline-offset-2 hover:underline">
                    {r.part.number} × {r.quantity.toLocaleString("en-US")}
                  </Link>
                  <span className="text-sm text-ink-soft">{r.coats.map((c) => c.code).join(" + ")}</span>
                  <span className="num text-sm">
                    {clock(r.slot.startMin)}–{clock(r.slot.endMin)} · {duration(r.lineTimeMin)}
                    {r.carriers !== null && ` · ${r.carriers.toLocaleString("en-US")} ${board.lineKind === "conveyor" ? "carriers" : "racks"}`}
                  </span>
                  <StatusBadge status={r.status} />
                  {!r.slot.fits && (
                    <span className="text-sm font-semibold text-oxide" data-testid="overflow">
                      Past the shift by {duration(r.slot.overflowMin)}
                    </span>
                  )}
                  {r.planError && <span className="text-sm text-oxide">Does not plan: {r.planError.message}</span>}
                  {canReorder && (
                    <span className="ml-auto flex gap-1">
                      <button type="button" className="btn-quiet px-2 py-0.5" disabled={i === 0 || saving} onClick={() => move(r.id, i - 1)} aria-label={`Move ${r.part.number} up`}>
                        ↑
                      </button>
                      <button
                        type="button"
                        className="btn-quiet px-2 py-0.5"
                        disabled={i === shift.runs.length - 1 || saving}
                        onClick={() => move(r.id, i + 1)}
                        aria-label={`Move ${r.part.number} down`}
                      >
                        ↓
                      </button>
                    </span>
                  )}
                </div>
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}

interface Props {
  initialLineId: string;
  initialDate: string;
  canReorder: boolean;
}

export function DayBoard({ initialLineId, initialDate, canReorder }: Props) {
  const [lineId, setLineId] = useState(initialLineId);
  const [date, setDate] = useState(initialDate || localToday());
  const [saving, setSaving] = useState(false);
  const [announce, setAnnounce] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  const [proposal, setProposal] = useState<ProposalOne["proposal"] | null>(null);
  const { data: linesBody, error: linesError } = useSWR<LinesList>("/api/lines");
  const lines = linesBody?.lines.filter((l) => !l.archived) ?? [];
  const chosen = lineId || (lines[0] ? String(lines[0].id) : "");
  const key = chosen && date ? `/api/runs/board?lineId=${chosen}&date=${date}` : null;
  const { data, error, isLoading, mutate } = useSWR<BoardOne, FetchError>(key);

  // Keep the address in step with the picks, so the board can be bookmarked and shared.
  useEffect(() => {
    if (!chosen) return;
    const url = `/board?lineId=${chosen}&date=${date}`;
    if (window.location.pathname + window.location.search !== url) window.history.replaceState(null, "", url);
  }, [chosen, date]);

  async function saveOrder(shift: number, runIds: number[], movedId?: number) {
    if (!data) return;
    setSaving(true);
    setProblem(null);
    const optimistic: BoardOne = {
      board: {
        ...data.board,
        shifts: data.board.shifts.map((s) => (s.shift === shift ? { ...s, runs: runIds.map((id) => s.runs.find((r) => r.id === id)!) } : s)),
      },
    };
    try {
      await mutate(
        async () => sendJson<BoardOne>("/api/runs/board", "PUT", { lineId: Number(chosen), date, shift, runIds }),
        { optimisticData: optimistic, rollbackOnError: true, revalidate: false },
      );
      const moved = movedId === undefined ? null : optimistic.board.shifts.find((s) => s.shift === shift)?.runs.find((r) => r.id === movedId);
      setAnnounce(moved ? `${moved.part.number} moved to position ${runIds.indexOf(movedId!) + 1} of ${runIds.length}; order saved.` : "Order saved.");
    } catch (e) {
      setProblem(e instanceof Error ? e.message : "Could not save the order.");
      await mutate();
    } finally {
      setSaving(false);
    }
  }

  async function propose() {
    setProblem(null);
    try {
      setProposal((await fetcher<ProposalOne>(`/api/runs/board/propose?lineId=${chosen}&date=${date}`)).proposal);
    } catch (e) {
      setProblem(e instanceof Error ? `Could not work out a proposal: ${e.message}` : "Could not work out a proposal.");
    }
  }

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="board-line" className="label">Line</label>
          <select id="board-line" className="field" value={chosen} onChange={(e) => { setLineId(e.target.value); setProposal(null); }}>
            {!lines.length && <option value="">{linesError ? "Could not load the lines" : "Loading lines…"}</option>}
            {lines.map((l) => (
              <option key={l.id} value={l.id}>{l.name}</option>
            ))}
          </select>
        </div>
        <div className="flex items-end gap-1">
          <button type="button" className="btn-quiet" onClick={() => { setDate((d) => addDays(d, -1)); setProposal(null); }} aria-label="Previous day">←</button>
          <div>
            <label htmlFor="board-day" className="label">Day</label>
            <input id="board-day" type="date" className="field" value={date} onChange={(e) => { setDate(e.target.value); setProposal(null); }} />
          </div>
          <button type="button" className="btn-quiet" onClick={() => { setDate((d) => addDays(d, 1)); setProposal(null); }} aria-label="Next day">→</button>
        </div>
        {data && data.board.shifts.some((s) => s.runs.length > 1) && (
          <button type="button" className="btn-quiet ml-auto" onClick={propose}>
            Propose an order
          </button>
        )}
      </div>

      <p className="sr-only" role="status" aria-live="polite">{announce}</p>
      {problem && <p role="alert" className="field-error">{problem}</p>}

      {isLoading ? (
        <p role="status">Loading the board…</p>
      ) : error ? (
        <p role="alert" className="text-oxide">Could not load the board: {error.message}</p>
      ) : !data ? null : (
        <>
          <h2 className="sr-only">{data.board.lineName}, {dayLabel(date)}</h2>
          <p className="text-sm text-ink-soft">
            {data.board.lineName} · {dayLabel(date)} · {data.board.shiftHours} h shifts
            {data.board.colourChangeMin > 0 && ` · booth colour change ${duration(data.board.colourChangeMin)}`}
            {canReorder && " · drag a run, use its arrows, or press Alt+↑ / Alt+↓ on a focused run to reorder"}
          </p>
          {proposal && (
            <section className="card space-y-2 border-phosphate" aria-labelledby="proposal-h" data-testid="proposal">
              <h2 id="proposal-h">Proposed order</h2>
              <p className="text-sm text-ink-soft">Runs with the same cure schedules together (the ovens keep their settings), each group light to dark.</p>
              {proposal.shifts.map((p) => {
                const current = data.board.shifts.find((s) => s.shift === p.shift);
                const same = current && current.runs.map((r) => r.id).join() === p.runIds.join();
                return (
                  <div key={p.shift} className="text-sm">
                    <p className="font-medium">Shift {p.shift}</p>
                    <ol className="ml-5 list-decimal">
                      {p.proposed.runs.map((r) => (
                        <li key={r.id}>
                          <span className="inline-flex items-center gap-1">
                            {r.coats.map((c, k) => (
                              <Swatch key={k} hex={c.swatchHex} label={c.colourName} />
                            ))}
                          </span>{" "}
                          {r.part.number} × {r.quantity} ({r.coats.map((c) => c.code).join(" + ")})
                        </li>
                      ))}
                    </ol>
                    <p className="num mt-1">
                      Fills {duration(p.proposed.filledMin)} with {p.proposed.colourChanges.length} colour change{p.proposed.colourChanges.length === 1 ? "" : "s"}
                      {current && ` (now ${duration(current.filledMin)}, ${current.colourChanges.length})`}.
                    </p>
                    {canReorder && !same && (
                      <button type="button" className="btn-primary mt-1" disabled={saving} onClick={async () => { await saveOrder(p.shift, p.runIds); setProposal(null); }}>
                        Use this order for shift {p.shift}
                      </button>
                    )}
                    {same && <p className="text-ink-soft">The board already runs in this order.</p>}
                  </div>
                );
              })}
              <button type="button" className="btn-quiet" onClick={() => setProposal(null)}>
                Close
              </button>
            </section>
          )}
          {data.board.shifts.map((s) => (
            <ShiftSection key={s.shift} board={data.board} shift={s} canReorder={canReorder} onOrder={saveOrder} saving={saving} />
          ))}
        </>
      )}
    </div>
  );
}
