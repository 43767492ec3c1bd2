import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { PdfReaderLoader } from "@/components/pdf-reader-loader";
import { markStems } from "@/lib/domain/library/highlight";
import { getManual, getPage, getReadableRevision } from "@/lib/server/library/manuals";
import { listClasses } from "@/lib/server/classes";
import { PageMarks } from "./_components/page-marks";
import { findCorrections } from "@/search/postgres";
import { parseQuery } from "@/search/query";
import { CiteOnCard } from "./_components/cite-on-card";
import { PageText } from "./_components/page-text";
import { revisionOutline } from "@/lib/server/library/outline";
import { pageInRevision } from "@/lib/server/revisions/follow";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Page" };

/**
 * One page of a revision: its text (searched words marked), picture, and the way to the PDF at that
 * page. The deep link every search hit and task-card reference points at.
 */
export default async function ManualPageView({
  params,
  searchParams,
}: {
  params: Promise<{ manualId: string; revisionId: string; page: string }>;
  searchParams: Promise<{ q?: string }>;
}) {
  const { manualId, revisionId, page: pageParam } = await params;
  const { q = "" } = await searchParams;
  const user = await requirePageUser("library:view", `/library/${manualId}/${revisionId}/${pageParam}`);
  const pageNumber = Number(pageParam);
  if (!isUuid(manualId) || !isUuid(revisionId) || !Number.isInteger(pageNumber) || pageNumber < 1) notFound();
  const found = await Promise.all([
    getReadableRevision({ actor: user, id: revisionId }),
    getPage({ revisionId, pageNumber }),
    getManual({ id: manualId }),
    revisionOutline(revisionId),
  ]).catch(notFoundOnMissing);
  const [revision, page, manual, outline] = found;
  // The words a typo was read as ("magento" → magneto) are marked too.
  const corrections = q ? [...(await findCorrections(parseQuery(q).words)).values()].flat() : [];
  if (revision.manualId !== manualId) notFound();
  const current = manual.revisions.find((r) => r.id === manual.currentRevisionId);
  const superseded = revision.id !== manual.currentRevisionId;
  const count = revision.pageCount ?? pageNumber;
  const query = q ? `?q=${encodeURIComponent(q)}` : "";
  // The same content in the current revision, through the page comparisons: a moved page goes to
  // where it moved, a removed one says so; without comparisons, the same number, said as such.
  const followed = superseded && current ? await pageInRevision(revision.id, pageNumber, current.id) : null;
  // An instructor can show a note to a class they teach.
  const teaches = can(user, "assignments:manage") ? (await listClasses({ actor: user })).map((c) => ({ id: c.id, name: c.name })) : [];

  return (
    // Compact on purpose: on a 1024×768 cart screen the manual page starts in the top third.
    <div className="-mt-4 flex flex-col gap-2">
      {manual.withdrawnAt ? (
        <p role="alert" className="notice-error">
          This manual was withdrawn from the library on {manual.withdrawnAt.toISOString().slice(0, 10)}
          {manual.withdrawReason ? `: ${manual.withdrawReason}` : ""}. Ask the librarian or your instructor before working from it.
        </p>
      ) : null}
      {superseded ? (
        <div role="alert" className="notice-error flex flex-wrap items-baseline gap-x-2">
          <span>This is {revision.label}, a superseded revision. Do not work from it.</span>
          {current ? (
            followed?.page === null ? (
              <span>
                This page is not in the current revision, {current.label}: it was removed.{" "}
                <Link href={`/library/${manualId}/${current.id}/1${query}`} prefetch={false}>
                  Open {current.label}
                </Link>
              </span>
            ) : (
              <Link
                href={`/library/${manualId}/${current.id}/${followed?.page ?? Math.min(pageNumber, current.pageCount ?? pageNumber)}${query}`}
                prefetch={false}
              >
                {followed
                  ? `Open page ${followed.page} of the current revision, ${current.label}${
                      followed.status === "moved"
                        ? " (the same content, moved there)"
                        : followed.status === "changed"
                          ? " (where this content is now; it changed)"
                          : ""
                    }`
                  : `Open page ${Math.min(pageNumber, current.pageCount ?? pageNumber)} of the current revision, ${current.label} (same page number; the revisions were not compared)`}
              </Link>
            )
          ) : null}
        </div>
      ) : null}

      <div className="flex flex-wrap items-center gap-x-3 gap-y-1 lg:flex-nowrap">
        <nav aria-label="Breadcrumb" className="flex items-center gap-x-2">
          <Link href="/library" prefetch={false} className="inline-flex min-h-11 items-center">
            Library
          </Link>
          <span aria-hidden="true">›</span>
          {q ? (
            <>
              <Link href={`/search?q=${encodeURIComponent(q)}`} prefetch={false} className="inline-flex min-h-11 items-center">
                Back to the results
              </Link>
              <span aria-hidden="true">›</span>
            </>
          ) : null}
        </nav>
        <h1 className="min-w-0 flex-1 truncate text-xl leading-tight" title={`${manual.title} · ${revision.label}`}>
          <Link href={`/library/${manualId}`} prefetch={false} className="text-ink no-underline hover:underline">
            {manual.title}
          </Link>{" "}
          · {revision.label}
        </h1>
        <form action="/search" className="flex items-center gap-2" role="search" aria-label="Search in this manual">
          <input type="hidden" name="manual" value={manualId} />
          <label htmlFor="search-in-manual" className="sr-only">
            Search in this manual
          </label>
          <input id="search-in-manual" name="q" className="input w-44 py-1" defaultValue={q} placeholder="Search in this manual" />
          <button type="submit" className="btn btn-primary btn-small">
            Search
          </button>
        </form>
        <a
          href={`/api/revisions/${revisionId}/file#page=${pageNumber}`}
          className="btn btn-secondary btn-small"
          target="_blank"
          rel="noreferrer"
        >
          Download the PDF
        </a>
      </div>

      <PdfReaderLoader
        fileUrl={revision.readerFileKey ? `/api/revisions/${revisionId}/file?copy=reader` : `/api/revisions/${revisionId}/file`}
        fileSize={revision.readerFileKey && revision.readerSizeBytes ? revision.readerSizeBytes : revision.sizeBytes}
        pageCount={count}
        initialPage={pageNumber}
        marks={markStems(q, corrections)}
        baseHref={`/library/${manualId}/${revisionId}`}
        thumbnailBase={`/api/revisions/${revisionId}/pages`}
        query={query}
        outline={outline}
        revisionLabel={revision.label}
        isCurrent={!superseded}
        barExtra={
          can(user, "cards:author") ? (
            <CiteOnCard
              userId={user.id}
              revisionId={revisionId}
              revisionLabel={revision.label}
              superseded={superseded}
              initialPage={pageNumber}
            />
          ) : null
        }
        barTools={
          <PageMarks
            manualId={manualId}
            revisionId={revisionId}
            initialPage={pageNumber}
            baseHref={`/library/${manualId}/${revisionId}`}
            classes={teaches}
          />
        }
      />

      <PageText revisionId={revisionId} initial={{ page: pageNumber, text: page.text, ocr: page.ocr }} q={q} corrections={corrections} />
    </div>
  );
}
