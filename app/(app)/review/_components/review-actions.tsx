"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { runsApi } from "@/lib/contracts/endpoints/runs";
import type { RunStatus } from "@/lib/domain/runs/fold";

interface Step {
  id: string;
  number: number;
  checked: boolean;
  boughtOff: boolean;
  inspectionPoint: boolean;
  /** Its reading is out of limits (or not understood): offered first to do again. */
  outOfLimits: boolean;
}

/**
 * Buy off inspection points, return with a comment naming the steps to do again, or sign off after
 * a confirmation with the instructor's password. Each answer comes from the server; a control that
 * cannot be used says why beside it.
 */
export function ReviewActions({
  runId,
  status,
  steps,
  who,
}: {
  runId: string;
  status: RunStatus;
  steps: Step[];
  /** "Jonas Weber's run of Wheel bearing inspection (version 3)": what the confirmation names. */
  who: string;
}) {
  const router = useRouter();
  const [comment, setComment] = useState("");
  const [reopen, setReopen] = useState<Set<string>>(() => new Set(steps.filter((s) => s.outOfLimits).map((s) => s.id)));
  const [confirming, setConfirming] = useState(false);
  const [password, setPassword] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  if (status === "signed_off") return null;
  const handedIn = status === "submitted";
  const send = async (action: () => Promise<unknown>, done: string) => {
    setBusy(true);
    setMessage(null);
    try {
      await action();
      setMessage({ ok: true, text: done });
      setComment("");
      setPassword("");
      setConfirming(false);
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." });
    } finally {
      setBusy(false);
    }
  };
  const toggle = (id: string) =>
    setReopen((old) => {
      const next = new Set(old);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const points = steps.filter((s) => s.inspectionPoint);
  const reopenList = steps.filter((s) => reopen.has(s.id)).map((s) => s.number);
  return (
    <section aria-label="Review actions" className="panel flex flex-col gap-3">
      <h2>Your decision</h2>
      {points.length ? (
        <div className="flex flex-wrap items-center gap-2">
          {points.map((p) =>
            p.boughtOff ? (
              <span key={p.id} className="badge bg-ok-pale text-ok">
                Step {p.number} bought off
              </span>
            ) : (
              <button
                key={p.id}
                type="button"
                className="btn btn-secondary"
                disabled={busy || !p.checked}
                title={p.checked ? undefined : "The student has not marked this step done yet."}
                onClick={() =>
                  void send(() => call(runsApi.buyOff, { params: { id: runId }, body: { stepId: p.id } }), `Step ${p.number} bought off.`)
                }
              >
                {p.checked ? `Buy off step ${p.number}` : `Step ${p.number}: not done yet`}
              </button>
            ),
          )}
        </div>
      ) : null}
      <label htmlFor="review-comment" className="label">
        Comment for the student (needed to send the run back)
      </label>
      <textarea
        id="review-comment"
        className="input min-h-24"
        value={comment}
        maxLength={2000}
        onChange={(e) => setComment(e.target.value)}
      />
      <fieldset className="flex flex-col gap-1">
        <legend className="label">Steps to do again if you send it back (bought-off ones are reopened too)</legend>
        <div className="flex flex-wrap gap-2">
          {steps.map((s) => (
            <label key={s.id} className="flex min-h-11 items-center gap-2 rounded border border-line px-3">
              <input type="checkbox" className="h-5 w-5" checked={reopen.has(s.id)} onChange={() => toggle(s.id)} />
              Step {s.number}
              {s.outOfLimits ? <span className="font-semibold text-danger">out of limits</span> : null}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <button type="button" className="btn btn-primary" disabled={busy || !handedIn} onClick={() => setConfirming(true)}>
          Sign off…
        </button>
        <button
          type="button"
          className="btn btn-danger"
          disabled={busy || !handedIn || !comment.trim()}
          onClick={() =>
            void send(
              () => call(runsApi.returnRun, { params: { id: runId }, body: { comment, reopenStepIds: [...reopen] } }),
              reopenList.length
                ? `Sent back for rework: step${reopenList.length > 1 ? "s" : ""} ${reopenList.join(", ")} to do again.`
                : "Sent back for rework.",
            )
          }
        >
          Send back for rework
        </button>
      </div>
      {!handedIn ? (
        <p className="hint">
          The student has not handed this run in yet: you can buy off inspection points now, and sign off or send it back once it is handed
          in.
        </p>
      ) : !comment.trim() ? (
        <p className="hint">To send it back, write what the student should fix.</p>
      ) : null}
      {confirming ? (
        <form
          aria-label="Confirm the sign-off"
          className="flex flex-col gap-3 rounded-md border-4 border-deck bg-paper p-4"
          onSubmit={(e) => {
            e.preventDefault();
            void send(() => call(runsApi.signOff, { params: { id: runId }, body: { comment, password } }), "Signed off.");
          }}
        >
          <p className="font-semibold">Sign off {who}? The sign-off is a permanent record: it cannot be changed or removed afterwards.</p>
          <label htmlFor="sign-off-password" className="label">
            Your password, to confirm it is you
          </label>
          <input
            id="sign-off-password"
            type="password"
            autoComplete="current-password"
            className="input max-w-sm"
            value={password}
            autoFocus
            onChange={(e) => setPassword(e.target.value)}
          />
          <div className="flex flex-wrap gap-2">
            <button type="submit" className="btn btn-primary" disabled={busy || !password}>
              Sign off now
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setConfirming(false)}>
              Not yet
            </button>
          </div>
        </form>
      ) : null}
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "notice-ok" : "notice-error"}>
          {message.text}
        </p>
      ) : null}
    </section>
  );
}
