/** Shown on every screen: Hangarleaf supports training, it does not replace the sources that govern the work. */
export function SafetyNotice({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      aria-label="Training use notice"
      className={`border-l-[6px] border-amber bg-amber-pale text-ink ${compact ? "px-3 py-2 text-sm" : "px-4 py-3"}`}
    >
      <strong>Training use.</strong> The manufacturer&apos;s current data, your instructor, local rules and licensed practice come first,
      before anything shown here.
    </aside>
  );
}
