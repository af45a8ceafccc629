// The film-check change log in words: who, when, and each field's old → new value. The server
// writes the words in the reader's units, so this only lays them out.

import type { LogView } from "@/lib/server/film-checks";

export function when(s: number): string {
  return new Date(s * 1000).toISOString().slice(0, 16).replace("T", " ") + " UTC";
}

export function ChangeLogList({ entries, empty }: { entries: LogView[]; empty: string }) {
  if (entries.length === 0) return <p className="text-sm text-ink-faint">{empty}</p>;
  return (
    <ol className="space-y-2 text-sm" data-testid="change-log">
      {entries.map((l) => (
        <li key={l.id} className="border-l-2 border-plate-line pl-2">
          <p>
            <span className="font-medium">{l.userName ?? "Unknown user"}</span>
            <span className="text-ink-faint">{` · ${when(l.at)} · `}</span>
            {l.summary}
          </p>
          {l.changes.length > 0 && (
            <ul className="mt-0.5 space-y-0.5 pl-4">
              {l.changes.map((c, i) => (
                <li key={i}>
                  <span className="text-ink-soft">{c.field}:</span> <span className="num">{c.from}</span>
                  <span aria-hidden="true"> → </span>
                  <span className="sr-only"> changed to </span>
                  <span className="num font-medium">{c.to}</span>
                </li>
              ))}
            </ul>
          )}
        </li>
      ))}
    </ol>
  );
}
