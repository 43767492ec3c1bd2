export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-4">
      <span className="sr-only">Loading…</span>
      <div className="h-9 w-64 animate-pulse rounded bg-line" />
      <div className="h-40 animate-pulse rounded bg-line/60" />
    </div>
  );
}
