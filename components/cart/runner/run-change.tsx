"use client";

import { useEffect, useState } from "react";
import type { CartAsset } from "@/lib/client/cart/store";
import { assetKindWords, type AssetKind } from "@/lib/domain/fleet/fleet";

interface Change {
  action: string;
  assetId: string;
  parentId: string;
  position: string;
  appliedAt: string | null;
}

/**
 * The part this run removes from or installs on the aircraft (an engine change: one of each). It
 * is written on the assets when the instructor signs the run off, so nobody types it twice. Needs
 * the network: the server checks it against where the parts are now.
 */
export function RunChange({
  runId,
  aircraft,
  fleet,
  online,
  locked,
}: {
  runId: string;
  aircraft: CartAsset;
  fleet: CartAsset[];
  online: boolean;
  locked: boolean;
}) {
  const [changes, setChanges] = useState<Change[]>([]);
  const [action, setAction] = useState<"remove" | "install">("remove");
  const [part, setPart] = useState("");
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  useEffect(() => {
    if (!online) return;
    void fetch(`/api/runs/${runId}/assets`, { cache: "no-store" })
      .then(async (r) => (r.ok ? setChanges(((await r.json()) as { changes: Change[] }).changes) : undefined))
      .catch(() => undefined);
  }, [runId, online]);
  const parts = fleet.filter((a) => a.id !== aircraft.id && a.kind !== "aircraft");
  const name = (id: string) => fleet.find((a) => a.id === id)?.identifier ?? "a part";
  const send = async (next: { action: string; assetId: string; parentId: string; position: string }[]) => {
    const response = await fetch(`/api/runs/${runId}/assets`, {
      method: "PUT",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ assetIds: [aircraft.id], changes: next }),
    });
    const answer = (await response.json().catch(() => null)) as { changes?: Change[]; error?: { message?: string } } | null;
    if (!response.ok) return setMessage({ ok: false, text: answer?.error?.message ?? "That did not work." });
    setChanges(answer?.changes ?? []);
    setMessage({ ok: true, text: "Saved: it is written on the aircraft's record when your instructor signs the run off." });
  };
  return (
    <details className="flex flex-col gap-2">
      <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold">
        This run removes or installs a part{changes.length ? ` (${changes.length})` : ""}…
      </summary>
      {changes.length ? (
        <ul className="ml-5 list-disc">
          {changes.map((c) => (
            <li key={`${c.action}:${c.assetId}`}>
              {c.action === "remove"
                ? `Removes ${name(c.assetId)} from ${name(c.parentId)}`
                : `Installs ${name(c.assetId)} on ${name(c.parentId)}`}
              {c.appliedAt ? " (recorded)" : " (recorded at sign-off)"}
            </li>
          ))}
        </ul>
      ) : null}
      {!online ? <p className="hint">Naming a part change needs the network: the server checks where the parts are.</p> : null}
      {online && !locked ? (
        <div className="flex flex-wrap items-end gap-3">
          <label className="field">
            <span className="label">The run</span>
            <select className="input" value={action} onChange={(e) => setAction(e.target.value as "remove" | "install")}>
              <option value="remove">removes from {aircraft.identifier}</option>
              <option value="install">installs on {aircraft.identifier}</option>
            </select>
          </label>
          <label className="field min-w-56">
            <span className="label">Part</span>
            <select className="input" value={part} onChange={(e) => setPart(e.target.value)}>
              <option value="">Choose…</option>
              {parts.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.identifier} · {assetKindWords[a.kind as AssetKind] ?? a.kind} {a.model}
                </option>
              ))}
            </select>
          </label>
          <button
            type="button"
            className="btn btn-secondary"
            disabled={!part}
            onClick={() =>
              void send([
                ...changes
                  .filter((c) => !c.appliedAt)
                  .map(({ action: a, assetId, parentId, position }) => ({ action: a, assetId, parentId, position })),
                { action, assetId: part, parentId: aircraft.id, position: "" },
              ])
            }
          >
            Add to the run
          </button>
          {changes.some((c) => !c.appliedAt) ? (
            <button type="button" className="btn btn-secondary" onClick={() => void send([])}>
              Clear
            </button>
          ) : null}
        </div>
      ) : null}
      {message ? (
        <p className={message.ok ? "notice-ok" : "notice-error"} role="status">
          {message.text}
        </p>
      ) : null}
    </details>
  );
}
