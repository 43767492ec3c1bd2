"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { libraryApi } from "@/lib/contracts/endpoints/library";
import { documentTypes, type DocumentType } from "@/lib/domain/vocabulary";
import { documentTypeLabels } from "@/lib/domain/validation/library";

interface Manual {
  id: string;
  title: string;
  documentType: DocumentType;
  applicability: string[];
  ataChapters: string[];
  withdrawnAt: string | null;
}
type Citing = Awaited<ReturnType<typeof loadCitations>>;
const loadCitations = (id: string) => call(libraryApi.manualCitations, { params: { id } });

/** The librarian's part of a manual's page: correct its details, withdraw it (after seeing what cites it), restore it. */
export function ManualAdmin({ manual }: { manual: Manual }) {
  const router = useRouter();
  const [mode, setMode] = useState<"idle" | "edit" | "withdraw">("idle");
  const [fields, setFields] = useState({
    title: manual.title,
    documentType: manual.documentType,
    applicability: manual.applicability.join(", "),
    ataChapters: manual.ataChapters.join(", "),
  });
  const [reason, setReason] = useState("");
  const [citing, setCiting] = useState<Citing | null>(null);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ message: string; fields: Record<string, string> } | null>(null);

  const act = async (work: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await work();
      setMode("idle");
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? { message: e.message, fields: e.fields } : { message: "That did not work. Try again.", fields: {} });
    } finally {
      setBusy(false);
    }
  };
  const alert = error ? (
    <p role="alert" className="notice-error">
      {error.message}
    </p>
  ) : null;

  if (manual.withdrawnAt)
    return (
      <div className="flex flex-wrap items-center gap-3">
        <button
          type="button"
          className="btn btn-secondary"
          disabled={busy}
          onClick={() => void act(() => call(libraryApi.restoreManual, { params: { id: manual.id } }))}
        >
          Restore to the library
        </button>
        {alert}
      </div>
    );

  if (mode === "edit")
    return (
      <form
        className="panel grid gap-3 md:grid-cols-2"
        aria-label="Correct the manual's details"
        onSubmit={(e) => {
          e.preventDefault();
          void act(() => call(libraryApi.updateManual, { params: { id: manual.id }, body: fields }));
        }}
      >
        {alert ? <div className="md:col-span-2">{alert}</div> : null}
        <label className="field md:col-span-2">
          <span className="label">Title</span>
          <input className="input" value={fields.title} maxLength={200} onChange={(e) => setFields({ ...fields, title: e.target.value })} />
          {error?.fields.title ? <span className="field-error">{error.fields.title}</span> : null}
        </label>
        <label className="field">
          <span className="label">Document type</span>
          <select
            className="input"
            value={fields.documentType}
            onChange={(e) => setFields({ ...fields, documentType: e.target.value as DocumentType })}
          >
            {documentTypes.map((t) => (
              <option key={t} value={t}>
                {documentTypeLabels[t]}
              </option>
            ))}
          </select>
        </label>
        <label className="field">
          <span className="label">Applies to (models, separated by commas)</span>
          <input className="input" value={fields.applicability} onChange={(e) => setFields({ ...fields, applicability: e.target.value })} />
          {error?.fields.applicability ? <span className="field-error">{error.fields.applicability}</span> : null}
        </label>
        <label className="field">
          <span className="label">ATA chapters (two digits each, separated by commas)</span>
          <input className="input" value={fields.ataChapters} onChange={(e) => setFields({ ...fields, ataChapters: e.target.value })} />
          {error?.fields.ataChapters ? <span className="field-error">{error.fields.ataChapters}</span> : null}
        </label>
        <div className="flex flex-wrap items-end gap-2">
          <button type="submit" className="btn btn-primary" disabled={busy}>
            Save the details
          </button>
          <button type="button" className="btn btn-secondary" onClick={() => setMode("idle")}>
            Cancel
          </button>
        </div>
      </form>
    );

  if (mode === "withdraw")
    return (
      <form
        role="alertdialog"
        aria-label="Withdraw the manual"
        className="notice-todo flex flex-col gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          void act(() => call(libraryApi.withdrawManual, { params: { id: manual.id }, body: { reason } }));
        }}
      >
        <p>
          Withdrawing takes {manual.title} out of the library list and out of search. Nothing is deleted: the cards below still open its
          pages, which then say it is withdrawn, and it can be restored.
        </p>
        {citing === null ? (
          <p>Looking up what cites it…</p>
        ) : citing.cards.length === 0 ? (
          <p>No task card cites it.</p>
        ) : (
          <div>
            <p>{citing.cards.length === 1 ? "One task card version cites it" : `${citing.cards.length} task card versions cite it`}:</p>
            <ul className="list-disc pl-6 font-normal" aria-label="Task cards citing this manual">
              {citing.cards.map((c) => (
                <li key={`${c.cardId} ${c.versionNumber}`}>
                  <Link href={`/cards/${c.cardId}`}>{c.title}</Link> version {c.versionNumber} ({c.status})
                  {c.openRuns ? `, ${c.openRuns} open ${c.openRuns === 1 ? "run" : "runs"}` : ""}
                </li>
              ))}
            </ul>
          </div>
        )}
        <label className="field">
          <span className="label">Why (readers of its pages see it)</span>
          <input className="input" required maxLength={300} value={reason} onChange={(e) => setReason(e.target.value)} />
        </label>
        {alert}
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn btn-danger" disabled={busy || citing === null}>
            Withdraw now
          </button>
          <button type="button" className="btn btn-secondary" onClick={() => setMode("idle")}>
            Keep it
          </button>
        </div>
      </form>
    );

  return (
    <div className="flex flex-wrap gap-3">
      <button type="button" className="btn btn-secondary" onClick={() => setMode("edit")}>
        Correct the details
      </button>
      <button
        type="button"
        className="btn btn-danger"
        onClick={() => {
          setMode("withdraw");
          setCiting(null);
          loadCitations(manual.id)
            .then(setCiting)
            .catch(() => setCiting({ cards: [] }));
        }}
      >
        Withdraw from the library…
      </button>
    </div>
  );
}
