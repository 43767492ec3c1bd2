"use client";

import type { ToolHoldDto } from "@/lib/contracts/tools";

/**
 * Handing the run in: only once every step is done, no inspection point waits, and no tool lent
 * for it is missing (the server refuses such a hand-in too, 409).
 */
export function HandIn({
  waitingIndex,
  allDone,
  holds,
  onHandIn,
}: {
  waitingIndex: number;
  allDone: boolean;
  holds: ToolHoldDto[];
  onHandIn: () => void;
}) {
  return (
    <section aria-label="Hand in" className="panel flex flex-col gap-2">
      <h2 className="text-xl font-bold">Hand in</h2>
      {holds.length ? (
        <p className="notice-error" data-testid="tool-hold">
          {holds.map((h) => `${h.tool.number} ${h.tool.description}`).join(", ")} {holds.length === 1 ? "was" : "were"} not counted back in
          at the tool room. Look for {holds.length === 1 ? "it" : "them"} at the aircraft and in the work area: a tool left behind is
          foreign-object damage. Your instructor clears the hold; then you can hand in.
        </p>
      ) : waitingIndex >= 0 ? (
        <p>Step {waitingIndex + 1} is an inspection point: your instructor buys it off before you go on.</p>
      ) : allDone ? (
        <p>Every step is done. Hand the run in for your instructor&apos;s inspection and sign-off.</p>
      ) : (
        <p>Finish every step to hand the run in.</p>
      )}
      <button
        type="button"
        className="btn btn-primary self-start text-lg"
        disabled={!allDone || waitingIndex >= 0 || holds.length > 0}
        onClick={onHandIn}
      >
        Hand in for inspection
      </button>
    </section>
  );
}
