"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { toolsApi } from "@/lib/contracts/endpoints/tools";
import type { ToolHoldDto } from "@/lib/contracts/tools";

/**
 * Missing-tool holds as an instructor sees them, each with its decision: found (back in the tool
 * room), or lost with a note (the tool goes out of service). Times come formatted from the server.
 */
export function ToolHolds({ holds, canClear, openedAt }: { holds: ToolHoldDto[]; canClear: boolean; openedAt: Record<string, string> }) {
  // Said here, not inside the cleared hold: the refreshed list no longer has it.
  const [said, setSaid] = useState<string | null>(null);
  return (
    <>
      <FormResult result={said ? { ok: true, message: said } : null} />
      {holds.length ? null : <p>No tool lent to your students is missing.</p>}
      <ul className="flex flex-col gap-3">
        {holds.map((h) => (
          <li key={h.id} className="rounded-md border-4 border-danger bg-danger-pale px-4 py-3">
            <p className="text-lg font-bold">
              {h.tool.number} {h.tool.description} is missing
            </p>
            <p>
              Lent to {h.userName}
              {h.runTitle ? ` for "${h.runTitle}"` : " for the day"}; not counted back in ({openedAt[h.id]}, {h.openedByName}).{" "}
              {h.runTitle ? "That run" : "Their open runs"} cannot be handed in until the hold is cleared.
            </p>
            {canClear ? <ClearHold hold={h} onCleared={setSaid} /> : null}
          </li>
        ))}
      </ul>
    </>
  );
}

function ClearHold({ hold, onCleared }: { hold: ToolHoldDto; onCleared: (message: string) => void }) {
  const router = useRouter();
  const [outcome, setOutcome] = useState<"found" | "lost" | "">("");
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const noteId = `hold-note-${hold.id}`;
  return (
    <form
      className="mt-2 flex flex-col gap-2"
      aria-label={`Clear the hold on ${hold.tool.number}`}
      onSubmit={async (e) => {
        e.preventDefault();
        if (!outcome) return setResult({ ok: false, message: "Say whether the tool was found or is lost." });
        if (outcome === "lost" && !note.trim())
          return setResult({ ok: false, message: "Say what was done about the lost tool (where it was searched for, who was told)." });
        setBusy(true);
        try {
          await call(toolsApi.clearHold, { params: { id: hold.id }, body: { outcome, note } });
          onCleared(
            `${hold.tool.number}: ${outcome === "lost" ? "cleared, the tool is marked lost and out of service." : "cleared, the tool was found."} ${hold.userName} can hand the run in.`,
          );
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "Not cleared: try again." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <fieldset className="flex flex-wrap gap-4">
        <legend className="font-semibold">What became of it?</legend>
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="radio"
            name={`outcome-${hold.id}`}
            className="h-6 w-6"
            checked={outcome === "found"}
            onChange={() => setOutcome("found")}
          />
          Found, back in the tool room
        </label>
        <label className="flex min-h-11 items-center gap-2">
          <input
            type="radio"
            name={`outcome-${hold.id}`}
            className="h-6 w-6"
            checked={outcome === "lost"}
            onChange={() => setOutcome("lost")}
          />
          Lost
        </label>
      </fieldset>
      <label htmlFor={noteId} className="label">
        Note {outcome === "lost" ? "(needed: where it was searched for, who was told)" : "(optional)"}
      </label>
      <input id={noteId} className="input" value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} />
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        Clear the hold
      </button>
      <FormResult result={result} />
    </form>
  );
}
