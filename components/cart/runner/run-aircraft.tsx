"use client";

import { useEffect, useState } from "react";
import type { CartAsset, CartData } from "@/lib/client/cart/store";
import type { RunEvent } from "@/lib/domain/runs/fold";
import { assetKindWords, type AssetKind } from "@/lib/domain/fleet/fleet";
import { RunChange } from "./run-change";
import type { Act } from "./use-run";

/**
 * What the run works on and what was found on it. The aircraft is named on the run (an
 * `asset.named` event, offline too); the cart's own aircraft is offered first. A finding is written
 * up here, at the step being done, and goes to the instructor with the run's work. An asset out of
 * service is a WARNING before anything is done.
 */
export function RunAircraft({
  data,
  runId,
  events,
  act,
  stepId,
  stepNumber,
  locked,
  online,
}: {
  data: CartData;
  runId: string;
  events: readonly RunEvent[];
  act: Act;
  stepId: string | null;
  stepNumber: number | null;
  locked: boolean;
  online: boolean;
}) {
  const [fleet, setFleet] = useState<CartAsset[]>([]);
  const [choice, setChoice] = useState("");
  const [changing, setChanging] = useState(false);
  const [writing, setWriting] = useState(false);
  const [text, setText] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  useEffect(() => {
    const load = () =>
      void Promise.all([data.fleet(), data.aircraft()]).then(([assets, mine]) => {
        setFleet(assets);
        setChoice((c) => c || mine || "");
      });
    load();
    return data.onChange(load);
  }, [data]);

  const namedIds = events.filter((e) => e.type === "asset.named").at(-1)?.payload?.assetIds;
  const namedId = Array.isArray(namedIds) && typeof namedIds[0] === "string" ? namedIds[0] : null;
  const named = fleet.find((a) => a.id === namedId) ?? null;
  const filedHere = events.filter((e) => e.type === "finding.filed").length;
  if (!fleet.length && !named) return null;

  const picker = (
    <div className="flex flex-wrap items-end gap-3">
      <label className="field min-w-64 flex-1">
        <span className="label">Aircraft or part worked on</span>
        <select className="input text-lg" value={choice} onChange={(e) => setChoice(e.target.value)}>
          <option value="">Choose…</option>
          {fleet.map((a) => (
            <option key={a.id} value={a.id}>
              {a.identifier} · {assetKindWords[a.kind as AssetKind] ?? a.kind} {a.model}
            </option>
          ))}
        </select>
      </label>
      <button
        type="button"
        className="btn btn-primary text-lg"
        disabled={!choice}
        onClick={() => {
          void act("asset.named", { payload: { assetIds: [choice] } }).then(() => {
            setChanging(false);
            void data.saveAircraft(choice);
          });
        }}
      >
        Work on this one
      </button>
    </div>
  );

  return (
    <section aria-label="Aircraft worked on" className="panel flex flex-col gap-3">
      {named && !changing ? (
        <div className="flex flex-wrap items-center gap-3">
          <p className="mr-auto text-lg">
            Working on <span className="font-mono font-bold">{named.identifier}</span> ({named.model})
            {named.openFindingCount ? (
              <span className="font-semibold text-danger">
                {" "}
                · {named.openFindingCount} open finding{named.openFindingCount === 1 ? "" : "s"} on it
              </span>
            ) : null}
          </p>
          {!locked ? (
            <button type="button" className="btn btn-secondary" onClick={() => setChanging(true)}>
              Change
            </button>
          ) : null}
        </div>
      ) : !locked ? (
        picker
      ) : null}
      {(named ?? fleet.find((a) => a.id === choice))?.status === "out_of_service" ? (
        <p className="notice-error" role="alert">
          WARNING: {(named ?? fleet.find((a) => a.id === choice))!.identifier} is out of service:{" "}
          {(named ?? fleet.find((a) => a.id === choice))!.statusReason}. Do not start work on it unless your instructor says so.
        </p>
      ) : null}
      {message ? (
        <p className="notice-ok" role="status">
          {message}
        </p>
      ) : null}
      {named && named.kind === "aircraft" ? (
        <RunChange runId={runId} aircraft={named} fleet={fleet} online={online} locked={locked} />
      ) : null}
      {named && !writing ? (
        <button type="button" className="btn btn-secondary self-start" onClick={() => setWriting(true)}>
          Write up a finding{filedHere ? ` (${filedHere} filed on this run)` : ""}
        </button>
      ) : null}
      {named && writing ? (
        <form
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (!text.trim()) return;
            void act("finding.filed", { stepId, payload: { assetId: named.id, text: text.trim() } }).then(() => {
              setMessage(
                `Written up on ${named.identifier}${stepNumber ? ` at step ${stepNumber}` : ""}. Your instructor decides what happens${online ? "" : "; it is sent when the network is back"}.`,
              );
              setText("");
              setWriting(false);
            });
          }}
        >
          <label htmlFor="finding-text" className="label">
            What did you find on {named.identifier}? Where, what it looks like, how big.
          </label>
          <textarea
            id="finding-text"
            className="input min-h-28 text-lg"
            value={text}
            maxLength={2000}
            onChange={(e) => setText(e.target.value)}
          />
          <div className="flex gap-3">
            <button type="submit" className="btn btn-primary text-lg" disabled={!text.trim()}>
              File the finding
            </button>
            <button type="button" className="btn btn-secondary" onClick={() => setWriting(false)}>
              Not now
            </button>
          </div>
        </form>
      ) : null}
    </section>
  );
}
