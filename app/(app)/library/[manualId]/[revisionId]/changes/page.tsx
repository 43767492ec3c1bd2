import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StatusBadge, statusLabel, statusesOf } from "@/components/status-badge";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { AppError } from "@/lib/domain/errors";
import { getManual, getReadableRevision } from "@/lib/server/library/manuals";
import { getComparison, listRechecksOfRevision } from "@/lib/server/revisions/rechecks";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "What changed" };

/** The comparison of a revision with the one before it, as a list of the new revision's effective pages. */
export default async function RevisionChangesPage({
  params,
  searchParams,
}: {
  params: Promise<{ manualId: string; revisionId: string }>;
  searchParams: Promise<{ all?: string }>;
}) {
  const { manualId, revisionId } = await params;
  const { all } = await searchParams;
  const user = await requirePageUser("library:view", `/library/${manualId}/${revisionId}/changes`);
  if (!isUuid(manualId) || !isUuid(revisionId)) notFound();
  const [manual, revision] = await Promise.all([getManual({ id: manualId }), getReadableRevision({ actor: user, id: revisionId })]).catch(
    notFoundOnMissing,
  );
  if (revision.manualId !== manualId) notFound();
  const comparison = await getComparison({ revisionId }).catch((error: unknown) => {
    if (error instanceof AppError && error.code === "not_found") return null;
    throw error;
  });
  const previous = manual.revisions.find((r) => r.id === comparison?.previousRevisionId);
  const rechecks = await listRechecksOfRevision({ revisionId });
  const shown = comparison ? (all ? comparison.pages : comparison.pages.filter((p) => p.status !== "unchanged")) : [];
  const compareLink = (oldPage: number | null, newPage: number | null) =>
    `/library/${manualId}/${revisionId}/changes/compare?${new URLSearchParams({ ...(oldPage ? { old: String(oldPage) } : {}), ...(newPage ? { new: String(newPage) } : {}) })}`;

  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb" className="flex flex-wrap gap-x-3">
        <Link href="/library" className="py-2">
          Library
        </Link>
        <span aria-hidden="true" className="py-2">
          ›
        </span>
        <Link href={`/library/${manualId}`} className="py-2">
          {manual.title}
        </Link>
      </nav>
      <h1>
        What changed in {revision.label}
        {previous ? ` since ${previous.label}` : ""}
      </h1>
      {!comparison ? (
        <p className="notice-error">
          This revision has not been compared yet. The comparison is made a moment after the revision is ready; reload in a little while.
        </p>
      ) : !comparison.previousRevisionId ? (
        <p className="panel">This is the first revision of the manual in the library: there is nothing to compare it with.</p>
      ) : (
        <>
          <ul className="flex flex-wrap gap-2" aria-label="Summary">
            {statusesOf("page").map((s) => (
              <StatusBadge key={s} as="li" kind="page" status={s} className="text-base">
                {statusLabel("page", s)}: {comparison.summary[s]}
              </StatusBadge>
            ))}
          </ul>
          <p className="text-ink-soft">
            Page numbers, revision labels, dates and running headers are left out of the comparison. A moved page has the same content at a
            new page number.
          </p>

          <section className="panel flex flex-col gap-2" aria-labelledby="affected">
            <h2 id="affected">Task cards to recheck</h2>
            {rechecks.length === 0 ? (
              <p>No published task card cites a page that changed, moved or went.</p>
            ) : (
              <ul className="flex flex-col gap-1">
                {rechecks.map((r) => (
                  <li key={r.cardId}>
                    <Link href={`/cards/${r.cardId}`} className="font-semibold">
                      {r.title}
                    </Link>
                    : {r.open} of {r.total} citations still to recheck
                    {r.ownerName ? ` (owner ${r.ownerName})` : ""}
                  </li>
                ))}
              </ul>
            )}
          </section>

          <section className="panel flex flex-col gap-2 overflow-x-auto" aria-labelledby="pages">
            <div className="flex flex-wrap items-center gap-3">
              <h2 id="pages" className="mr-auto">
                Effective pages of {revision.label}
              </h2>
              <Link href={all ? "?" : "?all=1"} className="btn btn-secondary btn-small">
                {all ? "Show only what changed" : "Show every page"}
              </Link>
            </div>
            <Table
              rows={shown}
              rowKey={(_, i) => i}
              empty="No page changed."
              columns={[
                { header: `Page in ${revision.label}`, cell: (p) => p.newPage ?? "—" },
                { header: "State", cell: (p) => <StatusBadge kind="page" status={p.status} /> },
                { header: `Page in ${previous?.label ?? "the revision before"}`, cell: (p) => p.oldPage ?? "—" },
                { header: "Similarity", cell: (p) => (p.status === "changed" ? `${Math.round(p.similarity * 100)} %` : "—") },
                {
                  header: "Side by side",
                  cell: (p) => (
                    <Link href={compareLink(p.oldPage, p.newPage)} className="inline-flex min-h-11 items-center">
                      Compare
                    </Link>
                  ),
                },
              ]}
            />
          </section>
        </>
      )}
    </div>
  );
}
