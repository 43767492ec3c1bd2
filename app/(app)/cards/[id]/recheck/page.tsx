import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PageDiff } from "@/components/page-diff";
import { requirePageUser } from "@/app/_adapters/session";
import { getCard } from "@/lib/server/cards/read";
import { listOpenRechecks } from "@/lib/server/revisions/rechecks";
import { RecheckForm } from "../../_components/recheck-form";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Recheck task card" };

const statusWords = { changed: "changed", moved: "moved to another page", removed: "is no longer in the manual" } as const;

/** Each citation a new revision touched: old page and suggested new page side by side, and a decision. */
export default async function RecheckPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("cards:author", `/cards/${id}/recheck`);
  if (!isUuid(id)) notFound();
  const [card, rechecks] = await Promise.all([getCard({ actor: user, id }), listOpenRechecks({ cardId: id })]).catch(notFoundOnMissing);
  const title = (card.published ?? card.draft)?.title ?? "Task card";
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb" className="flex flex-wrap gap-x-3">
        <Link href="/cards" className="py-2">
          Task cards
        </Link>
        <span aria-hidden="true" className="py-2">
          ›
        </span>
        <Link href={`/cards/${id}`} className="py-2">
          {title}
        </Link>
      </nav>
      <h1>Recheck: {title}</h1>
      {rechecks.length === 0 ? (
        <p className="notice-ok">Nothing to recheck: every citation of this card is up to date with its manual.</p>
      ) : (
        <>
          <p className="text-ink-soft">
            A new revision changed pages this card cites. For each one, compare the old page with the suggested page of the new revision,
            then keep the suggestion, choose another page, or drop the citation. Finishing makes a new draft version of the card, which you
            publish when it is right. Check the step&apos;s own values (limits, torques, times) against the new page too. Assignments
            already running keep the version they were given.
          </p>
          <RecheckForm
            cardId={id}
            items={rechecks.map((r) => ({
              id: r.id,
              stepNumber: r.stepNumber,
              heading: `Step ${r.stepNumber}: ${r.manualTitle} page ${r.old.page} of ${r.old.label} ${statusWords[r.status]}`,
              stepText: r.stepText,
              suggestedPage: r.suggested.page,
              similarity: r.suggested.similarity,
              newLabel: r.suggested.label,
              pageCount: r.suggested.pageCount,
              diff: (
                <PageDiff
                  oldTitle={`${r.old.label}, page ${r.old.page} (cited now)`}
                  newTitle={
                    r.suggested.page
                      ? `${r.suggested.label}, page ${r.suggested.page} (suggested, ${Math.round(r.suggested.similarity * 100)} % alike)`
                      : `${r.suggested.label}: no similar page`
                  }
                  oldText={r.old.text}
                  newText={r.suggested.page ? (r.suggested.text ?? "") : null}
                />
              ),
            }))}
          />
        </>
      )}
    </div>
  );
}
