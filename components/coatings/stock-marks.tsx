import type { CoatingView, LotStatus } from "@/lib/server/coatings";

const badge = "inline-flex items-center rounded px-1.5 py-0.5 text-xs font-medium whitespace-nowrap";

/** Low-stock, near-expiry and expired marks of one coating; words, not only colour. */
export function StockMarks({ coating }: { coating: Pick<CoatingView, "lowStock" | "nearExpiry" | "hasExpiredStock" | "usableStockKg"> }) {
  return (
    <span className="inline-flex flex-wrap gap-1">
      {coating.lowStock && (
        <span className={`${badge} bg-oxide-light text-oxide`} data-mark="low-stock">
          {coating.usableStockKg <= 0 ? "Out of stock" : "Low stock"}
        </span>
      )}
      {coating.nearExpiry && <span className={`${badge} bg-caution-light text-caution`} data-mark="near-expiry">Near expiry</span>}
      {coating.hasExpiredStock && <span className={`${badge} bg-oxide-light text-oxide`} data-mark="expired">Expired lot</span>}
    </span>
  );
}

const lotLabels: Record<LotStatus, [string, string]> = {
  ok: ["In date", "bg-pass-light text-pass"],
  "near-expiry": ["Near expiry", "bg-caution-light text-caution"],
  expired: ["Expired", "bg-oxide-light text-oxide"],
  empty: ["Used up", "bg-plate-sunk text-ink-soft"],
};

export function LotStatusMark({ status }: { status: LotStatus }) {
  const [label, cls] = lotLabels[status];
  return <span className={`${badge} ${cls}`}>{label}</span>;
}

export function Swatch({ hex, label }: { hex: string; label: string }) {
  return <span aria-label={`Swatch ${label}`} role="img" className="inline-block h-4 w-4 shrink-0 rounded border border-ink/20 align-middle" style={{ backgroundColor: hex }} />;
}
