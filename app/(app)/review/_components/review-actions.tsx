"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { runsApi } from "@/lib/contracts/endpoints/runs";
import type { RunStatus } from "@/lib/domain/runs/fold";

interface Point {
  id: string;
  number: number;
  checked: boolean;
  boughtOff: boolean;
}

/** Buy off inspection points, return with a comment, or sign off. Each answer comes from the server. */
export function ReviewActions({ runId, status, inspectionPoints }: { runId: string; status: RunStatus; inspectionPoints: Point[] }) {
  const router = useRouter();
  const [comment, setComment] = useState("");
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  if (status === "signed_off") return null;
  const send = async (action: () => Promise<unknown>, done: string) => {
    setBusy(true);
    setMessage(null);
    try {
      await action();
      setMessage({ ok: true, text: done });
      setComment("");
      router.refresh();
    } catch (error) {
      setMessage({ ok: false, text: error instanceof ApiError ? error.message : "That did not work." });
    } finally {
      setBusy(false);
    }
  };
  return (
    <section aria-label="Review actions" className="panel flex flex-col gap-3">
      <h2>Your decision</h2>
      {inspectionPoints.length ? (
        <div className="flex flex-wrap gap-2">
          {inspectionPoints.map((p) =>
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
        Comment for the student (needed to return the run)
      </label>
      <textarea
        id="review-comment"
        className="input min-h-24"
        value={comment}
        maxLength={2000}
        onChange={(e) => setComment(e.target.value)}
      />
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          className="btn btn-primary"
          disabled={busy || status !== "submitted"}
          onClick={() => void send(() => call(runsApi.signOff, { params: { id: runId }, body: { comment } }), "Signed off.")}
        >
          Sign off
        </button>
        <button
          type="button"
          className="btn btn-danger"
          disabled={busy || status !== "submitted" || !comment.trim()}
          onClick={() => void send(() => call(runsApi.returnRun, { params: { id: runId }, body: { comment } }), "Returned to the student.")}
        >
          Return with comment
        </button>
      </div>
      {status !== "submitted" ? (
        <p className="hint">
          The student has not handed this run in yet: you can buy off inspection points, and sign off once it is handed in.
        </p>
      ) : null}
      {message ? (
        <p role={message.ok ? "status" : "alert"} className={message.ok ? "notice-ok" : "notice-error"}>
          {message.text}
        </p>
      ) : null}
    </section>
  );
}
