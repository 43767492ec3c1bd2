"use client";

import { useRouter } from "next/navigation";
import { useMemo, useRef, useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { toolsApi } from "@/lib/contracts/endpoints/tools";
import type { KitDto, ToolDto } from "@/lib/contracts/tools";
import { readCode } from "@/lib/domain/tools/tool-room";

type Item = { kind: "kit"; kit: KitDto } | { kind: "tool"; tool: ToolDto };
export interface Borrower {
  id: string;
  name: string;
  runs: { id: string; title: string }[];
}

const itemNumber = (i: Item) => (i.kind === "kit" ? i.kit.number : i.tool.number);
const itemWords = (i: Item) =>
  i.kind === "kit"
    ? `Kit ${i.kit.number}, ${i.kit.name} (${i.kit.tools.filter((t) => t.status === "in_service").length} tools)`
    : `${i.tool.number}, ${i.tool.description}`;

/** Why this kit or tool cannot go out now; null when it can. The server checks the same under a lock. */
function notLendable(i: Item): string | null {
  const out = i.kind === "kit" ? i.kit.out : i.tool.out;
  if (out) return `${itemNumber(i)} is out to ${out.userName}: count it back in first.`;
  if (i.kind === "tool" && i.tool.status === "out_of_service") return `${i.tool.number} is out of service.`;
  if (i.kind === "tool" && i.tool.calibration === "past") return `${i.tool.number} is past its calibration: record a calibration first.`;
  return null;
}

/**
 * The desk: scan a label (a USB scanner types the number and Enter) or type or pick it, choose the
 * student and, if it is for a run, the run; one button lends it.
 */
export function LendForm({ kits, tools, borrowers }: { kits: KitDto[]; tools: ToolDto[]; borrowers: Borrower[] }) {
  const router = useRouter();
  const scan = useRef<HTMLInputElement>(null);
  const items = useMemo<Item[]>(
    () => [
      ...kits.map((kit) => ({ kind: "kit" as const, kit })),
      ...tools.filter((t) => !t.kitId).map((tool) => ({ kind: "tool" as const, tool })),
    ],
    [kits, tools],
  );
  const [code, setCode] = useState("");
  const [picked, setPicked] = useState<Item | null>(null);
  const [codeError, setCodeError] = useState<string | null>(null);
  const [userId, setUserId] = useState("");
  const [runId, setRunId] = useState("");
  const [teamNote, setTeamNote] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const borrower = borrowers.find((b) => b.id === userId);

  const choose = (raw: string) => {
    const number = readCode(raw);
    const match =
      items.find((i) => itemNumber(i) === number) ??
      // A tool kept in a kit, scanned on its own, is lent on its own.
      tools.filter((t) => t.number === number).map((tool) => ({ kind: "tool" as const, tool }))[0];
    setPicked(match ?? null);
    setCodeError(
      match
        ? notLendable(match)
        : number
          ? `No kit or tool is numbered ${number}.`
          : "That is not a kit or tool number (such as K-03 or T-104).",
    );
  };

  const lend = async () => {
    setResult(null);
    if (!picked) return setCodeError("Scan or choose what to lend.");
    if (!userId) return setResult({ ok: false, message: "Choose the student." });
    setBusy(true);
    try {
      const { checkout } = await call(toolsApi.createCheckout, {
        body: {
          ...(picked.kind === "kit" ? { kitId: picked.kit.id } : { toolId: picked.tool.id }),
          userId,
          runId: runId || null,
          teamNote,
        },
      });
      setResult({
        ok: true,
        message: `${itemWords(picked)} lent to ${checkout.userName}${checkout.runTitle ? ` for "${checkout.runTitle}"` : " for the day"}.`,
      });
      setPicked(null);
      setCode("");
      setRunId("");
      setTeamNote("");
      router.refresh();
      scan.current?.focus();
    } catch (error) {
      setResult({ ok: false, message: error instanceof ApiError ? error.message : "Nothing was lent: try again." });
    } finally {
      setBusy(false);
    }
  };

  return (
    <form
      className="panel flex flex-col gap-4"
      aria-labelledby="lend-title"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        void lend();
      }}
    >
      <h2 id="lend-title">Lend a kit or a tool</h2>
      <FormResult result={result} />
      <div className="grid gap-4 md:grid-cols-2">
        <div className="field">
          <label htmlFor="lend-code" className="label">
            Scan the label, or type its number
          </label>
          <input
            id="lend-code"
            ref={scan}
            className="input font-mono text-xl uppercase"
            autoComplete="off"
            autoFocus
            value={code}
            aria-invalid={codeError ? true : undefined}
            aria-describedby="lend-code-said"
            onChange={(e) => setCode(e.target.value)}
            onKeyDown={(e) => {
              // A scanner ends with Enter: read the code, do not send the form yet.
              if (e.key === "Enter") {
                e.preventDefault();
                choose(code);
              }
            }}
            onBlur={() => code.trim() && choose(code)}
          />
          <p id="lend-code-said" className={codeError ? "field-error" : "hint"} aria-live="polite">
            {codeError ?? (picked ? itemWords(picked) : "K-03 is a kit, T-104 a tool.")}
          </p>
        </div>
        <label className="field">
          <span className="label">or pick it from the list</span>
          <select
            className="input"
            value={picked ? itemNumber(picked) : ""}
            onChange={(e) => {
              setCode(e.target.value);
              choose(e.target.value);
            }}
          >
            <option value="">Choose…</option>
            {items.map((i) => (
              <option key={itemNumber(i)} value={itemNumber(i)} disabled={!!notLendable(i)}>
                {itemWords(i)}
                {notLendable(i) ? " — not available" : ""}
              </option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">Student</span>
          <select
            className="input"
            value={userId}
            onChange={(e) => {
              setUserId(e.target.value);
              setRunId("");
            }}
          >
            <option value="">Choose the student…</option>
            {borrowers.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">For</span>
          <select className="input" value={runId} onChange={(e) => setRunId(e.target.value)} disabled={!borrower}>
            <option value="">The day (due back in 8 hours)</option>
            {borrower?.runs.map((r) => (
              <option key={r.id} value={r.id}>
                The run of &quot;{r.title}&quot;
              </option>
            ))}
          </select>
        </label>
        <label className="field md:col-span-2">
          <span className="label">Team mates working with it (optional)</span>
          <input className="input" value={teamNote} maxLength={200} onChange={(e) => setTeamNote(e.target.value)} />
        </label>
      </div>
      <button type="submit" className="btn btn-primary self-start text-lg" disabled={busy || !picked || !!codeError || !userId}>
        Lend
      </button>
      {!picked || !userId ? <p className="hint">Scan or choose what to lend and choose the student; then Lend.</p> : null}
    </form>
  );
}
