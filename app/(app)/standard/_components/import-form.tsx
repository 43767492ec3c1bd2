"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";

interface Outcome {
  imported: number;
  updated: number;
  refused: { line: number; reason: string }[];
}

/** Uploads the school's CSV of the standard and lists every row refused, by line. */
export function ImportForm() {
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const [refused, setRefused] = useState<Outcome["refused"]>([]);
  return (
    <form
      className="panel flex flex-col gap-4"
      aria-labelledby="import-title"
      onSubmit={async (e) => {
        e.preventDefault();
        if (!file) return setResult({ ok: false, message: "Choose the CSV file first." });
        setBusy(true);
        setResult(null);
        setRefused([]);
        try {
          const form = new FormData();
          form.set("file", file);
          const answer = await fetch("/api/standard/import", { method: "POST", body: form });
          const data = (await answer.json().catch(() => null)) as (Outcome & { error?: { message: string } }) | null;
          if (!answer.ok || !data) return setResult({ ok: false, message: data?.error?.message ?? "The file was not imported." });
          setRefused(data.refused);
          setResult({
            ok: data.refused.length === 0,
            message: `${data.imported} new element${data.imported === 1 ? "" : "s"}, ${data.updated} updated${data.refused.length ? `; ${data.refused.length} row${data.refused.length === 1 ? "" : "s"} refused (listed below)` : ""}.`,
          });
          router.refresh();
        } catch {
          setResult({ ok: false, message: "No connection to the server. Check the network and try again." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 id="import-title">Import the school&apos;s copy</h2>
      <p>
        A CSV with the header <code>code,area,element</code> and one element a row, such as{" "}
        <code>AM.II.A.S1,Metallic Structures,Install solid rivets</code>. Elements already known get the new words; none is deleted (cards
        and records point at them).
      </p>
      <FormResult result={result} />
      <label className="field">
        <span className="label">CSV file</span>
        <input className="input" type="file" accept=".csv,text/csv" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
      </label>
      <button type="submit" className="btn btn-primary self-start" disabled={busy || !file}>
        Import
      </button>
      {refused.length ? (
        <section aria-label="Rows refused">
          <h3 className="font-bold">Rows refused</h3>
          <ul className="ml-5 list-disc">
            {refused.map((r) => (
              <li key={`${r.line}-${r.reason}`}>
                Line {r.line}: {r.reason}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </form>
  );
}
