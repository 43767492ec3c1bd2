"use client";

import { useEffect, type Dispatch, type SetStateAction } from "react";

/**
 * One step at a time: the arrow keys and Page Up / Page Down move between steps, except while
 * the student types in a field.
 */
export function useStepKeys({ enabled, count, setIndex }: { enabled: boolean; count: number; setIndex: Dispatch<SetStateAction<number>> }) {
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      if (!enabled || target?.closest("input, textarea, select, [contenteditable]")) return;
      if (e.key === "ArrowRight" || e.key === "PageDown") setIndex((i) => Math.min(count - 1, i + 1));
      if (e.key === "ArrowLeft" || e.key === "PageUp") setIndex((i) => Math.max(0, i - 1));
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [enabled, count, setIndex]);
}
