import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageDiff } from "@/components/page-diff";
import { requirePageUser } from "@/app/_adapters/session";
import { getManual, getPage, getReadableRevision } from "@/lib/server/library/manuals";
import { getComparison } from "@/lib/server/revisions/rechecks";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Old and new page" };

const pageOf = (v: string | undefined) => (v && /^\d{1,7}$/.test(v) ? Number(v) : null);

export default async function ComparePagesPage({
  params,
  searchParams,
}: {
  params: Promise<{ manualId: string; revisionId: string }>;
  searchParams: Promise<{ old?: string; new?: string }>;
}) {
  const { manualId, revisionId } = await params;
  const query = await searchParams;
  const user = await requirePageUser("library:view", `/library/${manualId}/${revisionId}/changes`);
  if (!isUuid(manualId) || !isUuid(revisionId)) notFound();
  const oldPage = pageOf(query.old);
  const newPage = pageOf(query.new);
  const found = await Promise.all([
    getManual({ id: manualId }),
    getReadableRevision({ actor: user, id: revisionId }),
    getComparison({ revisionId }),
  ]).catch(notFoundOnMissing);
  const [manual, revision, comparison] = found;
  if (revision.manualId !== manualId || !comparison.previousRevisionId || (!oldPage && !newPage)) notFound();
  const previous = manual.revisions.find((r) => r.id === comparison.previousRevisionId);
  const text = async (id: string, n: number | null) =>
    n ? ((await getPage({ revisionId: id, pageNumber: n }).catch(() => null))?.text ?? null) : null;
  const [oldText, newText] = await Promise.all([text(comparison.previousRevisionId, oldPage), text(revisionId, newPage)]);

  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb" className="flex flex-wrap gap-x-3">
        <Link href={`/library/${manualId}`} className="py-2">
          {manual.title}
        </Link>
        <span aria-hidden="true" className="py-2">
          ›
        </span>
        <Link href={`/library/${manualId}/${revisionId}/changes`} className="py-2">
          What changed in {revision.label}
        </Link>
      </nav>
      <h1>
        {previous?.label ?? "Before"} page {oldPage ?? "—"} and {revision.label} page {newPage ?? "—"}
      </h1>
      <PageDiff
        oldTitle={oldPage ? `${previous?.label ?? "Before"}, page ${oldPage}` : "Not in the revision before"}
        newTitle={newPage ? `${revision.label}, page ${newPage}` : `Not in ${revision.label}`}
        oldText={oldText ?? ""}
        newText={newPage ? (newText ?? "") : null}
      />
      <div className="flex flex-wrap gap-3">
        {oldPage && previous ? (
          <Link href={`/library/${manualId}/${previous.id}/${oldPage}`} className="btn btn-secondary">
            Open the old page in the reader
          </Link>
        ) : null}
        {newPage ? (
          <Link href={`/library/${manualId}/${revisionId}/${newPage}`} className="btn btn-secondary">
            Open the new page in the reader
          </Link>
        ) : null}
      </div>
    </div>
  );
}
