"use client";
import { useId } from "react";

/** A number box with its unit beside it; the error is announced and tied to it. */
export function NumberField({
  label,
  unit,
  text,
  error,
  hint,
  optional,
  onChange,
  testId,
  wide,
}: {
  /** spans both input columns (long unit labels) */
  wide?: boolean;
  label: string;
  unit: string;
  text: string;
  error?: string;
  hint?: string;
  optional?: boolean;
  onChange: (text: string) => void;
  testId?: string;
}) {
  const id = useId();
  const described = [hint ? `${id}-hint` : null, error ? `${id}-err` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className={wide ? "sm:col-span-2" : undefined}>
      <label htmlFor={id} className="label">
        {label}
        {unit && <span className="font-normal text-ink-faint"> ({unit})</span>}
        {optional && <span className="font-normal text-ink-faint"> · optional</span>}
      </label>
      <div className="flex items-stretch">
        <input
          id={id}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          className={`field num ${unit ? "rounded-r-none" : ""}`}
          value={text}
          aria-invalid={error ? true : undefined}
          aria-describedby={described}
          data-testid={testId}
          onChange={(e) => onChange(e.target.value)}
        />
        {unit && (
          <span aria-hidden="true" className="inline-flex min-w-14 items-center justify-center whitespace-nowrap rounded-r-md border border-l-0 border-plate-line bg-plate-sunk px-2 text-sm text-ink-soft">
            {unit}
          </span>
        )}
      </div>
      {hint && !error && <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">{hint}</p>}
      {error && <p id={`${id}-err`} className="field-error">{error}</p>}
    </div>
  );
}

export interface ResultRow {
  label: string;
  /** already formatted with its unit */
  value: string;
  testId?: string;
  tone?: "pass" | "fail";
  note?: string;
}

/** The results of one calculator, or what is missing before there can be any. */
export function Results({ rows, waiting, title = "Result" }: { rows: ResultRow[] | null; waiting: string; title?: string }) {
  return (
    <div aria-live="polite">
      <h3 className="mb-2 text-sm font-semibold uppercase tracking-wide text-ink-soft">{title}</h3>
      {rows ? (
        <dl className="divide-y divide-plate-line rounded-md border border-plate-line bg-white">
          {rows.map((r) => (
            <div key={r.label} className="flex items-baseline justify-between gap-4 px-3 py-2">
              <dt className="text-sm text-ink-soft">
                {r.label}
                {r.note && <span className="block text-xs text-ink-faint">{r.note}</span>}
              </dt>
              <dd
                className={`num whitespace-nowrap text-right font-semibold ${r.tone === "fail" ? "text-oxide" : r.tone === "pass" ? "text-pass" : "text-ink"}`}
                data-testid={r.testId}
              >
                {r.value}
              </dd>
            </div>
          ))}
        </dl>
      ) : (
        <p className="rounded-md border border-dashed border-plate-line px-3 py-4 text-sm text-ink-faint">{waiting}</p>
      )}
    </div>
  );
}

/** One line naming the formula and where it is published. */
export function HowComputed({ children }: { children: React.ReactNode }) {
  return (
    <p className="mt-3 text-xs leading-relaxed text-ink-soft">
      <span className="font-semibold">How this is computed: </span>
      {children}
    </p>
  );
}

/** Plain-words caution where the work can hurt someone; always defers to local rules. */
export function SafetyNote({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <aside className="mt-4 rounded-md border border-caution-edge bg-caution-light px-3 py-2 text-sm text-ink" aria-label={title}>
      <p className="font-semibold text-caution">⚠ {title}</p>
      <div className="mt-1 space-y-1">{children}</div>
      <p className="mt-1 text-xs text-ink-soft">
        These notes do not replace your local codes, the plant&apos;s own procedures or licensed practice; they come first.
      </p>
    </aside>
  );
}

/** A calculator's card: heading, inputs on the left, results on the right on wide screens. */
export function CalculatorSection({
  id,
  title,
  intro,
  inputs,
  results,
  after,
}: {
  id: string;
  title: string;
  intro: string;
  inputs: React.ReactNode;
  results: React.ReactNode;
  after?: React.ReactNode;
}) {
  return (
    <section id={id} className="card scroll-mt-4" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>{title}</h2>
      <p className="mt-1 text-sm text-ink-soft">{intro}</p>
      <div className="mt-4 grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)]">
        <div className="grid content-start gap-3 sm:grid-cols-2">{inputs}</div>
        <div>{results}</div>
      </div>
      {after}
    </section>
  );
}
