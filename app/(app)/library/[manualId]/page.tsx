import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { statusLabel } from "@/components/status-badge";
import { Table } from "@/components/table";
import { CitingBanner } from "../_components/citing-banner";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { getManual } from "@/lib/server/library/manuals";
import { documentTypeLabels } from "@/lib/domain/validation/library";
import { KeepOnCarts } from "../_components/keep-on-carts";
import { ManualAdmin } from "../_components/manual-admin";
import { RetryButton } from "../_components/retry-button";
import { RefreshWhileReading } from "../_components/refresh-while-reading";
import { UploadForm } from "../_components/upload-form";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Manual" };

export default async function ManualPage({ params }: { params: Promise<{ manualId: string }> }) {
  const { manualId } = await params;
  const user = await requirePageUser("library:view", `/library/${manualId}`);
  if (!isUuid(manualId)) notFound();
  const manual = await getManual({ id: manualId }).catch(notFoundOnMissing);
  const manages = can(user, "library:manage");
  // Students and instructors see what is readable; the library staff see every upload.
  const shown = manual.revisions.filter((r) => manages || r.status === "ready");
  if (!manages && !manual.currentRevisionId) notFound();
  const current = manual.revisions.find((r) => r.id === manual.currentRevisionId);

  return (
    <div className="flex flex-col gap-6">
      <Link href="/library" className="self-start py-2">
        ← Library
      </Link>
      {can(user, "cards:author") ? <CitingBanner userId={user.id} /> : null}
      <div className="flex flex-col gap-1">
        <h1>{manual.title}</h1>
        {manual.withdrawnAt ? (
          <p className="notice-error" role="note">
            Withdrawn from the library on {manual.withdrawnAt.toISOString().slice(0, 10)}
            {manual.withdrawReason ? `: ${manual.withdrawReason}` : ""}. Its pages stay readable for the task cards that cite them.
          </p>
        ) : null}
        {manages ? (
          <div className="flex flex-col gap-3">
            <KeepOnCarts manualId={manual.id} kept={manual.keepOnCarts} />
            <ManualAdmin
              manual={{
                id: manual.id,
                title: manual.title,
                documentType: manual.documentType,
                applicability: manual.applicability,
                ataChapters: manual.ataChapters,
                withdrawnAt: manual.withdrawnAt?.toISOString() ?? null,
              }}
            />
          </div>
        ) : null}
        <p className="text-ink-soft">
          {documentTypeLabels[manual.documentType]}
          {manual.applicability.length ? ` · applies to ${manual.applicability.join(", ")}` : ""}
          {manual.ataChapters.length ? ` · ATA ${manual.ataChapters.join(", ")}` : ""}
        </p>
        <p className="text-lg">
          {current ? (
            <>
              Current revision: <strong>{current.label}</strong> of {current.revisionDate}, {current.pageCount} pages.
              <span className="mt-2 flex flex-wrap items-center gap-4">
                <Link href={`/library/${manual.id}/${current.id}/1`} className="btn btn-primary">
                  Read it
                </Link>
                <a href={`/api/revisions/${current.id}/file`} download className="inline-flex min-h-11 items-center">
                  Download the PDF
                </a>
              </span>
            </>
          ) : (
            "No revision is ready yet."
          )}
        </p>
      </div>

      <section aria-labelledby="history" className="panel flex flex-col gap-3 overflow-x-auto">
        <h2 id="history">Revisions</h2>
        {shown.some((r) => r.status === "queued" || r.status === "processing") ? <RefreshWhileReading /> : null}
        <Table
          rows={shown}
          rowKey={(r) => r.id}
          columns={[
            {
              header: "Revision",
              cell: (r) => (
                <>
                  <strong>{r.label}</strong>{" "}
                  {r.id === manual.currentRevisionId ? (
                    <span className="badge bg-ok-pale text-ok">Current</span>
                  ) : r.supersededAt ? (
                    <span className="badge bg-amber-pale text-ink">Superseded</span>
                  ) : null}
                </>
              ),
            },
            { header: "Date", cell: (r) => r.revisionDate },
            {
              header: "State",
              cell: (r) => (
                <>
                  {statusLabel("revision", r.status)}
                  {r.status === "processing" ? ` (${r.pagesDone} of ${r.pageCount ?? "?"})` : ""}
                  {r.status === "failed" && r.error ? <span className="block text-sm text-danger">{r.error}</span> : null}
                </>
              ),
            },
            { header: "Pages", cell: (r) => r.pageCount ?? "—" },
            manages && { header: "Uploaded by", cell: (r) => r.uploadedBy ?? "—" },
            {
              header: "File",
              cell: (r) =>
                r.status === "ready" ? (
                  <span className="flex flex-wrap gap-x-4">
                    <Link
                      href={`/library/${manual.id}/${r.id}/1`}
                      className="inline-flex min-h-11 items-center font-semibold"
                      aria-label={`Read ${r.label}`}
                    >
                      Read
                    </Link>
                    <a
                      href={`/api/revisions/${r.id}/file`}
                      download
                      className="inline-flex min-h-11 items-center"
                      aria-label={`Download the PDF of ${r.label}`}
                    >
                      PDF
                    </a>
                    <Link href={`/library/${manual.id}/${r.id}/changes`} className="inline-flex min-h-11 items-center">
                      What changed
                    </Link>
                  </span>
                ) : manages && r.status === "failed" ? (
                  <RetryButton revisionId={r.id} label={r.label} />
                ) : (
                  "—"
                ),
            },
          ]}
        />
      </section>

      {manages ? (
        <section aria-labelledby="new-revision" className="flex flex-col gap-3">
          <h2 id="new-revision">Upload a new revision</h2>
          <p className="text-ink-soft">
            It becomes the current revision once every page is read; the one before stays readable, marked superseded.
          </p>
          <UploadForm mode={{ kind: "revision", manualId: manual.id }} />
        </section>
      ) : null}
    </div>
  );
}
