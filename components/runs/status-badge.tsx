import { RUN_STATUS_LABELS, type RunStatus } from "@/lib/runs/status";

const STYLE: Record<RunStatus, string> = {
  draft: "bg-plate-sunk text-ink-soft",
  planned: "bg-phosphate-light text-phosphate-dark",
  "in-progress": "bg-caution-light text-caution",
  done: "bg-pass-light text-pass",
  cancelled: "bg-oxide-light text-oxide line-through",
};

export function StatusBadge({ status }: { status: RunStatus }) {
  return (
    <span data-status={status} className={`inline-block rounded px-2 py-0.5 text-xs font-medium whitespace-nowrap ${STYLE[status]}`}>
      {RUN_STATUS_LABELS[status]}
    </span>
  );
}

/** A coating's colour swatch with its name for screen readers. */
export function Swatch({ hex, label, size = "h-3.5 w-3.5" }: { hex: string; label: string; size?: string }) {
  return <span role="img" aria-label={label} title={label} className={`inline-block shrink-0 rounded-sm border border-ink/30 align-[-2px] ${size}`} style={{ backgroundColor: hex }} />;
}
