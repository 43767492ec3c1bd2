"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { FormField } from "@/components/form-field";
import { documentTypes } from "@/lib/domain/vocabulary";
import { formatBytes } from "@/lib/domain/library/format";
import { documentTypeLabels, manualUploadSchema, revisionFieldsSchema } from "@/lib/domain/validation/library";
import { useRetryRevision, useRevisionStatus } from "./use-revision-status";

type Mode = { kind: "manual" } | { kind: "revision"; manualId: string };

// The handler's own schema, with the file added: the same rules in the form and on the server.
const fileSchema = z
  .custom<FileList>((v) => typeof FileList !== "undefined" && v instanceof FileList, "Choose a PDF file.")
  .refine((files) => files.length === 1, "Choose a PDF file.")
  .refine((files) => (files[0]?.size ?? 0) > 0, "The file is empty.");
const manualFormSchema = manualUploadSchema.extend({ file: fileSchema });
const revisionFormSchema = revisionFieldsSchema.extend({ file: fileSchema });
type FormInput = z.input<typeof manualFormSchema>;

interface UploadResult {
  status: number;
  body: { revisionId?: string; manualId?: string; error?: { message: string; fields?: Record<string, string> } } | null;
}

/** fetch cannot report upload progress; XMLHttpRequest can. */
function send(url: string, data: FormData, onProgress: (sent: number, total: number) => void): Promise<UploadResult> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.upload.onprogress = (e) => onProgress(e.loaded, e.total);
    xhr.onload = () => {
      let body: UploadResult["body"] = null;
      try {
        body = JSON.parse(xhr.responseText) as UploadResult["body"];
      } catch {
        /* not JSON: reported by status below */
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () =>
      resolve({ status: 0, body: { error: { message: "The connection broke during the upload. Nothing was stored; try again." } } });
    xhr.send(data);
  });
}

export function UploadForm({ mode }: { mode: Mode }) {
  const router = useRouter();
  const [progress, setProgress] = useState<{ sent: number; total: number } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [revisionId, setRevisionId] = useState<string | null>(null);
  const [manualId, setManualId] = useState<string | null>(mode.kind === "revision" ? mode.manualId : null);
  const status = useRevisionStatus(revisionId);
  const retry = useRetryRevision();
  const form = useForm<FormInput, unknown, z.output<typeof manualFormSchema>>({
    resolver: zodResolver((mode.kind === "manual" ? manualFormSchema : revisionFormSchema) as typeof manualFormSchema),
    defaultValues: {
      title: "",
      documentType: "maintenance_manual",
      applicability: "",
      ataChapters: "",
      revisionLabel: "",
      revisionDate: "",
    },
  });
  const { errors, isSubmitting } = form.formState;
  const fieldLabels: Record<string, string> = {
    title: "Title",
    documentType: "Document type",
    applicability: "Applies to",
    ataChapters: "ATA chapters",
    revisionLabel: "Revision label",
    revisionDate: "Revision date",
    file: "PDF file",
  };
  // Every refused field, at the top as well as beside the field: on a long form the one beside it
  // can be out of sight.
  const refused = Object.entries(errors)
    .map(([field, e]) => ({ field, message: (e as { message?: string } | undefined)?.message }))
    .filter((e): e is { field: string; message: string } => !!e.message && !problem?.endsWith(e.message));

  // Once the revision is read (or failed), the page behind the form shows it, and the form is
  // emptied for the next upload; the message about this one stays.
  const finished = useRef<string | null>(null);
  const revisionState = status.data?.status;
  useEffect(() => {
    if (!revisionId || (revisionState !== "ready" && revisionState !== "failed") || finished.current === revisionId) return;
    finished.current = revisionId;
    if (revisionState === "ready") form.reset();
    router.refresh();
  }, [revisionId, revisionState, form, router]);

  const onSubmit = form.handleSubmit(async () => {
    setProblem(null);
    setRevisionId(null);
    // The raw strings go to the server, which parses them with the same schema.
    const values = form.getValues();
    const data = new FormData();
    const names =
      mode.kind === "manual"
        ? (["title", "documentType", "applicability", "ataChapters", "revisionLabel", "revisionDate"] as const)
        : (["revisionLabel", "revisionDate"] as const);
    for (const name of names) data.append(name, String(values[name] ?? ""));
    const file = (values.file as FileList)[0]!;
    data.append("file", file, file.name); // the file last: the fields arrive first
    const url = mode.kind === "manual" ? "/api/manuals" : `/api/manuals/${mode.manualId}/revisions`;
    setProgress({ sent: 0, total: file.size });
    const result = await send(url, data, (sent, total) => setProgress({ sent, total }));
    if (result.status === 202 && result.body?.revisionId) {
      setRevisionId(result.body.revisionId);
      if (result.body.manualId) setManualId(result.body.manualId);
      return;
    }
    setProgress(null);
    const error = result.body?.error;
    for (const [field, message] of Object.entries(error?.fields ?? {})) {
      if (field in values) form.setError(field as keyof FormInput, { message });
    }
    setProblem(error?.message ?? `The upload was refused (status ${result.status}).`);
  });

  const revision = status.data;
  const busy = isSubmitting || (revisionId !== null && revision?.status !== "ready" && revision?.status !== "failed");

  return (
    <form
      onSubmit={onSubmit}
      noValidate
      className="panel flex flex-col gap-4"
      aria-label={mode.kind === "manual" ? "Upload a manual" : "Upload a new revision"}
    >
      <div aria-live="assertive">
        {problem || refused.length ? (
          <div className="notice-error" role="alert">
            {problem ? <p>{problem}</p> : null}
            {refused.length ? (
              <>
                <p>{refused.length === 1 ? "One field needs a change:" : `${refused.length} fields need a change:`}</p>
                <ul className="list-disc pl-6 font-normal">
                  {refused.map((e) => (
                    <li key={e.field}>
                      <a href={`#${e.field}`} onClick={() => form.setFocus(e.field as keyof FormInput)}>
                        {fieldLabels[e.field] ?? e.field}
                      </a>
                      : {e.message}
                    </li>
                  ))}
                </ul>
              </>
            ) : null}
          </div>
        ) : null}
      </div>
      {mode.kind === "manual" ? (
        <div className="grid gap-4 md:grid-cols-2">
          <FormField id="title" label="Title" error={errors.title?.message}>
            {(props) => <input {...props} {...form.register("title")} className="input" />}
          </FormField>
          <FormField id="documentType" label="Document type" error={errors.documentType?.message}>
            {(props) => (
              <select {...props} {...form.register("documentType")} className="input">
                {documentTypes.map((t) => (
                  <option key={t} value={t}>
                    {documentTypeLabels[t]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <FormField
            id="applicability"
            label="Applies to (optional)"
            hint="Models, separated by commas."
            error={errors.applicability?.message}
          >
            {(props) => <input {...props} {...form.register("applicability")} className="input" />}
          </FormField>
          <FormField
            id="ataChapters"
            label="ATA chapters (optional)"
            hint="Two digits each, separated by commas: 32, 61."
            error={errors.ataChapters?.message}
          >
            {(props) => <input {...props} {...form.register("ataChapters")} className="input" />}
          </FormField>
        </div>
      ) : null}
      <div className="grid gap-4 md:grid-cols-2">
        <FormField id="revisionLabel" label="Revision label" hint="As printed on the document." error={errors.revisionLabel?.message}>
          {(props) => <input {...props} {...form.register("revisionLabel")} className="input" />}
        </FormField>
        <FormField id="revisionDate" label="Revision date" error={errors.revisionDate?.message}>
          {(props) => <input {...props} {...form.register("revisionDate")} type="date" className="input" />}
        </FormField>
      </div>
      <FormField id="file" label="PDF file" error={errors.file?.message as string | undefined}>
        {(props) => <input {...props} {...form.register("file")} type="file" accept="application/pdf,.pdf" className="input py-2" />}
      </FormField>
      <button type="submit" className="btn btn-primary self-start" disabled={busy}>
        {mode.kind === "manual" ? "Upload manual" : "Upload revision"}
      </button>

      {progress && revision?.status !== "ready" ? (
        <div className="flex flex-col gap-2" aria-live="polite">
          <label htmlFor="upload-progress" className="label">
            {revisionId ? "Uploaded" : "Uploading"}: {formatBytes(progress.sent)} of {formatBytes(progress.total)}
            {!revisionId && progress.total > 0 && progress.sent >= progress.total ? " · the server is checking the file…" : ""}
          </label>
          <progress id="upload-progress" className="h-4 w-full" max={progress.total || 1} value={progress.sent} />
        </div>
      ) : null}
      {revision ? (
        <div className="flex flex-col gap-2" aria-live="polite">
          {revision.status === "failed" ? (
            <>
              <p className="notice-error" role="alert">
                Reading the PDF failed: {revision.error}
              </p>
              <button
                type="button"
                className="btn btn-secondary self-start"
                disabled={retry.isPending}
                onClick={() => retry.mutate(revision.id)}
              >
                Try again
              </button>
            </>
          ) : revision.status === "ready" ? (
            <p className="notice-ok" role="status">
              {revision.label} is ready: {revision.pageCount} pages{revision.current ? ", now the current revision" : ""}.{" "}
              {manualId ? (
                <Link href={`/library/${manualId}`} onClick={() => router.refresh()}>
                  Open the manual
                </Link>
              ) : null}{" "}
              {manualId && revision.current ? (
                <Link href={`/library/${manualId}/${revision.id}/1`} className="ml-2">
                  Read it
                </Link>
              ) : null}
            </p>
          ) : (
            <>
              <label htmlFor="ingest-progress" className="label">
                {revision.status === "queued"
                  ? "Waiting for the reader…"
                  : `Reading pages: ${revision.pagesDone} of ${revision.pageCount ?? "?"}`}
              </label>
              <progress id="ingest-progress" className="h-4 w-full" max={revision.pageCount ?? 1} value={revision.pagesDone} />
            </>
          )}
        </div>
      ) : null}
    </form>
  );
}
