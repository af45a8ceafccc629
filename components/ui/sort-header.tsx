// Sortable columns for the small tables (parts, users): a header button and a stable sort.
// A table library cost ~14 kB (gzip) of first-load JavaScript for what these lines do.

export interface SortState<K extends string> {
  key: K;
  desc: boolean;
}

// Natural order for text ("BC-9" before "BC-10"), ignoring case and accents.
const collator = new Intl.Collator("en", { numeric: true, sensitivity: "base" });

/** `rows` sorted by `sort.key`; numbers by value, text in natural order; ties keep their order. */
export function sortRows<T, K extends string>(rows: readonly T[], sort: SortState<K>, value: (row: T, key: K) => string | number): T[] {
  return rows
    .map((row, index) => ({ row, index, v: value(row, sort.key) }))
    .sort((a, b) => {
      const c = typeof a.v === "number" && typeof b.v === "number" ? a.v - b.v : collator.compare(String(a.v), String(b.v));
      return (sort.desc ? -c : c) || a.index - b.index;
    })
    .map((x) => x.row);
}

/**
 * A column header that sorts by `column`: first click ascending (descending for `numeric`
 * columns, largest first), next click the other way.
 */
export function SortHeader<K extends string>({
  label,
  column,
  sort,
  onSort,
  numeric = false,
}: {
  label: string;
  column: K;
  sort: SortState<K>;
  onSort: (next: SortState<K>) => void;
  numeric?: boolean;
}) {
  const active = sort.key === column;
  return (
    <th scope="col" className="py-2 pr-3 font-medium" aria-sort={active ? (sort.desc ? "descending" : "ascending") : undefined}>
      <button type="button" className="flex items-center gap-1" onClick={() => onSort({ key: column, desc: active ? !sort.desc : numeric })}>
        {label}
        <span aria-hidden>{active ? (sort.desc ? "▼" : "▲") : "↕"}</span>
      </button>
    </th>
  );
}
