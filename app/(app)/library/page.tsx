import type { Metadata } from "next";
import Link from "next/link";
import { StatusBadge } from "@/components/status-badge";
import { Table } from "@/components/table";
import { CitingBanner } from "./_components/citing-banner";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { listManuals } from "@/lib/server/library/manuals";
import { documentTypeLabels } from "@/lib/domain/validation/library";

export const metadata: Metadata = { title: "Library" };

export default async function LibraryPage() {
  const user = await requirePageUser("library:view", "/library");
  const manages = can(user, "library:manage");
  // Withdrawn manuals are out of the library for readers; the library staff see them, marked, to restore.
  const rows = (await listManuals()).filter((m) => manages || (m.currentRevisionId && !m.withdrawnAt));
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-4">
        <h1>Library</h1>
        {manages ? (
          <Link href="/library/upload" className="btn btn-primary ml-auto">
            Upload a manual
          </Link>
        ) : null}
      </div>
      {can(user, "cards:author") ? <CitingBanner userId={user.id} /> : null}
      <p className="text-ink-soft">
        Every manual shows its current revision. Older revisions stay readable from the manual&apos;s page, marked superseded.
      </p>
      <div className="panel overflow-x-auto">
        <Table
          rows={rows}
          rowKey={(m) => m.id}
          empty={`The library is empty.${manages ? " Upload the first manual." : ""}`}
          columns={[
            {
              header: "Title",
              // A manual opens where it is read: the reader at its first page, with the contents beside it.
              cell: (m) => (
                <Link
                  href={m.currentRevisionId ? `/library/${m.id}/${m.currentRevisionId}/1` : `/library/${m.id}`}
                  className="inline-flex min-h-11 items-center font-semibold"
                >
                  {m.title}
                  {m.withdrawnAt ? <span className="badge bg-danger-pale text-danger ml-2">Withdrawn</span> : null}
                </Link>
              ),
            },
            { header: "Type", cell: (m) => documentTypeLabels[m.documentType] },
            { header: "Applies to", cell: (m) => m.applicability.join(", ") || "—" },
            { header: "ATA", cell: (m) => m.ataChapters.join(", ") || "—" },
            { header: "Current revision", cell: (m) => (m.currentLabel ? `${m.currentLabel} (${m.currentDate})` : "none yet") },
            { header: "Pages", cell: (m) => m.pageCount ?? "—" },
            {
              header: "Details",
              cell: (m) => (
                <Link
                  href={`/library/${m.id}`}
                  className="inline-flex min-h-11 items-center"
                  aria-label={`Revisions and details of ${m.title}`}
                >
                  Revisions and details
                </Link>
              ),
            },
            manages && {
              header: "State",
              // No revision yet shows as ready, as a manual with nothing waiting.
              cell: (m) => <StatusBadge kind="revision" status={m.latestStatus ?? "ready"} screen="library" />,
            },
          ]}
        />
      </div>
    </div>
  );
}
