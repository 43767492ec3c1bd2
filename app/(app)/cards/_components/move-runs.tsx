"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { StatusBadge } from "@/components/status-badge";
import { ApiError, call } from "@/lib/client/api";
import type { RunToMoveDto } from "@/lib/contracts/runs";
import { runsApi } from "@/lib/contracts/endpoints/runs";

const steps = (numbers: number[]) => (numbers.length === 1 ? `step ${numbers[0]}` : `steps ${numbers.join(", ")}`);

/** What a move does to one run, in the instructor's words. */
function effect(r: RunToMoveDto): string {
  const parts = [
    r.restartSteps.length ? `${steps(r.restartSteps)} changed: done again` : "no step changed",
    r.addedSteps.length ? `${steps(r.addedSteps)} new` : "",
    r.removedSteps ? `${r.removedSteps} step${r.removedSteps > 1 ? "s" : ""} no longer on the card` : "",
    `${r.keptSteps} kept`,
  ];
  return parts.filter(Boolean).join(" · ");
}

/**
 * Open runs still on an older version of the card, after a recheck: the instructor picks the
 * students whose work moves to the newest version, seeing first what each move restarts.
 */
export function MoveRuns({ cardId, target, runs }: { cardId: string; target: number; runs: RunToMoveDto[] }) {
  const router = useRouter();
  const [chosen, setChosen] = useState<Set<string>>(() => new Set());
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  // Once every run has moved the list goes, but what the move did stays said.
  if (!runs.length)
    return message ? (
      <p role={message.ok ? "status" : "alert"} className={message.ok ? "notice-ok" : "notice-error"}>
        {message.text}
      </p>
    ) : null;
  const toggle = (id: string) =>
    setChosen((old) => {
      const next = new Set(old);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const move = async () => {
    setBusy(true);
    setMessage(null);
    try {
      const answer = await call(runsApi.moveRuns, { params: { id: cardId }, body: { runIds: [...chosen] } });
      setMessage({ ok: true, text: `${answer.moved.length} run${answer.moved.length > 1 ? "s" : ""} moved to version ${answer.version}.` });
      setChosen(new Set());
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." });
    } finally {
      setBusy(false);
    }
  };
  return (
    <section aria-labelledby="move-runs" className="panel flex flex-col gap-3 border-4 border-deck">
      <h2 id="move-runs">Open work on earlier versions</h2>
      <p>
        These students still work from an earlier version of this card. Move their runs to version {target}: work on steps that did not
        change is kept, steps that changed are done again.
      </p>
      <ul className="flex flex-col gap-2">
        {runs.map((r) => (
          <li key={r.runId}>
            <label className="flex min-h-12 flex-wrap items-center gap-3 rounded border border-line px-3 py-2">
              <input type="checkbox" className="h-6 w-6" checked={chosen.has(r.runId)} onChange={() => toggle(r.runId)} />
              <span className="font-semibold">{r.studentName}</span>
              <span>version {r.versionNumber}</span>
              <StatusBadge kind="run" status={r.status} />
              <span className="text-ink-soft">{effect(r)}</span>
            </label>
          </li>
        ))}
      </ul>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn btn-secondary" onClick={() => setChosen(new Set(runs.map((r) => r.runId)))}>
          Choose all
        </button>
        <button type="button" className="btn btn-primary" disabled={busy || chosen.size === 0} onClick={() => void move()}>
          Move {chosen.size || ""} to version {target}
        </button>
      </div>
      {chosen.size === 0 ? <p className="hint">Tick the students whose work should move.</p> : null}
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "notice-ok" : "notice-error"}>
          {message.text}
        </p>
      ) : null}
    </section>
  );
}
