import type { Metadata } from "next";
import Link from "next/link";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { listManuals } from "@/lib/server/library/manuals";
import { documentTypeLabels } from "@/lib/domain/validation/library";

export const metadata: Metadata = { title: "Library" };

const statusText: Record<string, string> = {
  queued: "Waiting to be read",
  processing: "Being read",
  failed: "Last upload failed",
};

export default async function LibraryPage() {
  const user = await requirePageUser("library:view", "/library");
  const manages = can(user, "library:manage");
  const rows = (await listManuals()).filter((m) => manages || m.currentRevisionId);
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
      <p className="text-ink-soft">Every manual shows its current revision. Older revisions stay readable from the manual&apos;s page, marked superseded.</p>
      <div className="panel overflow-x-auto">
        <table className="data-table">
          <thead>
            <tr>
              <th scope="col">Title</th>
              <th scope="col">Type</th>
              <th scope="col">Applies to</th>
              <th scope="col">ATA</th>
              <th scope="col">Current revision</th>
              <th scope="col">Pages</th>
              {manages ? <th scope="col">State</th> : null}
            </tr>
          </thead>
          <tbody>
            {rows.map((m) => (
              <tr key={m.id}>
                <td>
                  <Link href={`/library/${m.id}`} className="inline-flex min-h-11 items-center font-semibold">
                    {m.title}
                  </Link>
                </td>
                <td>{documentTypeLabels[m.documentType]}</td>
                <td>{m.applicability.join(", ") || "—"}</td>
                <td>{m.ataChapters.join(", ") || "—"}</td>
                <td>{m.currentLabel ? `${m.currentLabel} (${m.currentDate})` : "none yet"}</td>
                <td>{m.pageCount ?? "—"}</td>
                {manages ? (
                  <td>
                    {m.latestStatus && m.latestStatus !== "ready" ? (
                      <span className={`badge ${m.latestStatus === "failed" ? "bg-danger-pale text-danger" : "bg-amber-pale text-ink"}`}>
                        {statusText[m.latestStatus]}
                      </span>
                    ) : (
                      <span className="badge bg-ok-pale text-ok">Ready</span>
                    )}
                  </td>
                ) : null}
              </tr>
            ))}
            {rows.length === 0 ? (
              <tr>
                <td colSpan={manages ? 7 : 6}>The library is empty.{manages ? " Upload the first manual." : ""}</td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
