"use client";

/** Handing the run in: only once every step is done and no inspection point waits. */
export function HandIn({ waitingIndex, allDone, onHandIn }: { waitingIndex: number; allDone: boolean; onHandIn: () => void }) {
  return (
    <section aria-label="Hand in" className="panel flex flex-col gap-2">
      <h2 className="text-xl font-bold">Hand in</h2>
      {waitingIndex >= 0 ? (
        <p>Step {waitingIndex + 1} is an inspection point: your instructor buys it off before you go on.</p>
      ) : allDone ? (
        <p>Every step is done. Hand the run in for your instructor&apos;s inspection and sign-off.</p>
      ) : (
        <p>Finish every step to hand the run in.</p>
      )}
      <button type="button" className="btn btn-primary self-start text-lg" disabled={!allDone || waitingIndex >= 0} onClick={onHandIn}>
        Hand in for inspection
      </button>
    </section>
  );
}
