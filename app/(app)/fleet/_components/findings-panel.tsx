"use client";

import { useState } from "react";
import { FormResult } from "@/components/form-result";
import type { FindingDto } from "@/lib/contracts/fleet";
import { DecideFindingForm } from "./fleet-forms";

/**
 * Open findings, each with the instructor's decision when they may decide. The message of a
 * decision is kept here, above the list: the finding itself leaves the list when the page refreshes.
 */
export function FindingsPanel({
  findings,
  decide,
  zoneTimes,
}: {
  findings: FindingDto[];
  decide: boolean;
  zoneTimes: Record<string, string>;
}) {
  const [done, setDone] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      <FormResult result={done ? { ok: true, message: done } : null} />
      {findings.length ? (
        <ul className="flex flex-col gap-3">
          {findings.map((f) => (
            <li key={f.id} className="notice-todo flex flex-col gap-2">
              <p className="text-lg">{f.text}</p>
              <p className="text-sm font-normal">
                {f.assetIdentifier} · by {f.reportedByName} · {zoneTimes[f.id]}
                {f.runTitle ? ` · during ${f.runTitle}${f.stepNumber ? `, step ${f.stepNumber}` : ""}` : ""}
              </p>
              {decide ? (
                <details>
                  <summary className="inline-flex min-h-11 cursor-pointer items-center font-bold">Decide and close…</summary>
                  <DecideFindingForm findingId={f.id} onDone={(m) => setDone(`${f.assetIdentifier}: ${m}`)} />
                </details>
              ) : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="hint">No open findings.</p>
      )}
    </div>
  );
}
