"use client";

export type StepMode = "one" | "all";

/** One step at a time or the whole list, and how many steps are done. */
export function StepModeToggle({
  mode,
  onMode,
  done,
  total,
}: {
  mode: StepMode;
  onMode: (mode: StepMode) => void;
  done: number;
  total: number;
}) {
  return (
    <div className="flex flex-wrap items-center gap-2" role="group" aria-label="How to show the steps">
      <button
        type="button"
        className={`btn ${mode === "one" ? "btn-primary" : "btn-secondary"}`}
        aria-pressed={mode === "one"}
        onClick={() => onMode("one")}
      >
        One step at a time
      </button>
      <button
        type="button"
        className={`btn ${mode === "all" ? "btn-primary" : "btn-secondary"}`}
        aria-pressed={mode === "all"}
        onClick={() => onMode("all")}
      >
        All steps
      </button>
      <span className="ml-auto text-ink-soft">
        {done} of {total} steps done
      </span>
    </div>
  );
}

/** Previous / next under the one step shown. */
export function StepPager({ index, total, onIndex }: { index: number; total: number; onIndex: (update: (n: number) => number) => void }) {
  return (
    <nav aria-label="Steps" className="flex items-center gap-3">
      <button
        type="button"
        className="btn btn-secondary min-w-40 text-lg"
        disabled={index === 0}
        onClick={() => onIndex((n) => Math.max(0, n - 1))}
      >
        ← Previous step
      </button>
      <span className="mx-auto font-semibold">
        Step {Math.min(index, total - 1) + 1} of {total}
      </span>
      <button
        type="button"
        className="btn btn-primary min-w-40 text-lg"
        disabled={index >= total - 1}
        onClick={() => onIndex((n) => Math.min(total - 1, n + 1))}
      >
        Next step →
      </button>
    </nav>
  );
}
