import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MarkedText } from "@/components/marked-text";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { PdfReaderLoader } from "@/components/pdf-reader-loader";
import { highlightWords, markStems } from "@/lib/domain/library/highlight";
import { getManual, getPage, getReadableRevision } from "@/lib/server/library/manuals";
import { findCorrections } from "@/search/postgres";
import { parseQuery } from "@/search/query";
import { CiteOnCard } from "./_components/cite-on-card";
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
  ]).catch(notFoundOnMissing);
  const [revision, page, manual] = found;
  // The words a typo was read as ("magento" → magneto) are marked too.
  const corrections = q ? [...(await findCorrections(parseQuery(q).words)).values()].flat() : [];
  if (revision.manualId !== manualId) notFound();
  const current = manual.revisions.find((r) => r.id === manual.currentRevisionId);
  const superseded = revision.id !== manual.currentRevisionId;
  const count = revision.pageCount ?? pageNumber;
  const query = q ? `?q=${encodeURIComponent(q)}` : "";

  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Breadcrumb" className="flex flex-wrap gap-x-3">
        <Link href="/library" prefetch={false} className="py-2">
          Library
        </Link>
        <span aria-hidden="true" className="py-2">
          ›
        </span>
        <Link href={`/library/${manualId}`} prefetch={false} className="py-2">
          {manual.title}
        </Link>
        {q ? (
          <>
            <span aria-hidden="true" className="py-2">
              ›
            </span>
            <Link href={`/search?q=${encodeURIComponent(q)}`} prefetch={false} className="py-2">
              Back to the results
            </Link>
          </>
        ) : null}
      </nav>

      {superseded ? (
        <div role="alert" className="notice-error">
          This is {revision.label}, a superseded revision. Do not work from it.{" "}
          {current ? (
            <Link
              href={`/library/${manualId}/${current.id}/${Math.min(pageNumber, current.pageCount ?? pageNumber)}${query}`}
              prefetch={false}
            >
              Open page {Math.min(pageNumber, current.pageCount ?? pageNumber)} of the current revision, {current.label}
            </Link>
          ) : null}
        </div>
      ) : null}

      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">
          {manual.title} · {revision.label}
        </h1>
        <form action="/search" className="flex items-end gap-2" role="search" aria-label="Search in this manual">
          <input type="hidden" name="manual" value={manualId} />
          <label className="field">
            <span className="label">Search in this manual</span>
            <input name="q" className="input w-64" defaultValue={q} />
          </label>
          <button type="submit" className="btn btn-primary">
            Search
          </button>
        </form>
        <a href={`/api/revisions/${revisionId}/file#page=${pageNumber}`} className="btn btn-secondary" target="_blank" rel="noreferrer">
          Open the whole PDF
        </a>
      </div>

      {can(user, "cards:author") ? (
        <CiteOnCard
          userId={user.id}
          revisionId={revisionId}
          revisionLabel={revision.label}
          superseded={superseded}
          initialPage={pageNumber}
        />
      ) : null}

      <PdfReaderLoader
        fileUrl={revision.readerFileKey ? `/api/revisions/${revisionId}/file?copy=reader` : `/api/revisions/${revisionId}/file`}
        fileSize={revision.readerFileKey && revision.readerSizeBytes ? revision.readerSizeBytes : revision.sizeBytes}
        pageCount={count}
        initialPage={pageNumber}
        marks={markStems(q, corrections)}
        baseHref={`/library/${manualId}/${revisionId}`}
        thumbnailBase={`/api/revisions/${revisionId}/pages`}
        query={query}
      />

      <details className="panel">
        <summary className="cursor-pointer py-2 font-semibold">
          Text of page {pageNumber} (for reading aloud, copying, or a slow connection)
        </summary>
        <article className="mt-2 whitespace-pre-line leading-relaxed" aria-label={`Text of page ${pageNumber}`}>
          {page.ocr ? (
            <p className="hint mb-2">This page is a scan; its text was read by OCR and may hold errors. Check against the PDF.</p>
          ) : null}
          <MarkedText snippet={highlightWords(page.text, q, corrections)} />
        </article>
      </details>
    </div>
  );
}
