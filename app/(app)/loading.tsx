export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="animate-pulse text-ink-faint">
      Loading…
    </div>
  );
}
