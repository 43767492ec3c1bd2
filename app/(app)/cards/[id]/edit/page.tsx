import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageUser } from "@/app/_adapters/session";
import { getCard } from "@/lib/server/cards/read";
import { listSubjects } from "@/lib/server/cards/subjects";
import { listManuals } from "@/lib/server/library/manuals";
import { CardEditor } from "../../_components/card-editor";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Edit task card" };

export default async function EditCardPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("cards:author", `/cards/${id}/edit`);
  if (!isUuid(id)) notFound();
  const [card, subjects, manuals] = await Promise.all([
    getCard({ actor: user, id }).catch(notFoundOnMissing),
    listSubjects(),
    listManuals(),
  ]);
  const base = card.draft ?? card.published;
  if (!base) notFound();
  const options = manuals
    .filter((m) => m.currentRevisionId)
    .map((m) => ({
      manualId: m.id,
      title: m.title,
      revisionId: m.currentRevisionId!,
      label: m.currentLabel ?? "",
      pageCount: m.pageCount ?? null,
    }));
  return (
    <div className="flex flex-col gap-4">
      <nav aria-label="Breadcrumb" className="flex gap-3">
        <Link href="/cards" className="inline-flex min-h-11 items-center">
          Task cards
        </Link>
        <span aria-hidden="true" className="py-2">
          ›
        </span>
        <Link href={`/cards/${id}`} className="inline-flex min-h-11 items-center">
          {base.title}
        </Link>
      </nav>
      <h1>
        {card.draft ? `Editing draft version ${card.draft.number}` : `Editing: the first change makes draft version ${base.number + 1}`}
      </h1>
      {card.archivedAt ? <p className="notice-error">This card is archived. Bring it back from the archive before editing.</p> : null}
      {card.canEdit ? null : (
        <p className="notice-error">
          {card.ownerName ?? "Another author"} owns this card: only the owner, their co-authors or an admin can change it.{" "}
          <Link href={`/cards/${id}`}>Back to the card</Link> to duplicate it.
        </p>
      )}
      {card.canEdit ? (
        <CardEditor key={`${base.number}-${base.editCount}`} card={card} subjects={subjects} manuals={options} userId={user.id} />
      ) : null}
    </div>
  );
}
