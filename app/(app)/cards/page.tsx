import type { Metadata } from "next";
import Link from "next/link";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { listCards } from "@/lib/server/cards/read";
import { listSubjects } from "@/lib/server/cards/subjects";
import { CardsTable } from "./_components/cards-table";

export const metadata: Metadata = { title: "Task cards" };

export default async function CardsPage({ searchParams }: { searchParams: Promise<{ model?: string; for?: string }> }) {
  const user = await requirePageUser("cards:view", "/cards");
  // Opened from a cart at an aircraft (?model=HT-20&for=HL-TR1): the list starts scoped to its model.
  const scope = await searchParams;
  const author = can(user, "cards:author");
  const [cards, subjects] = await Promise.all([listCards({ actor: user }), listSubjects()]);
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">Task cards</h1>
        {can(user, "subjects:manage") ? (
          <Link href="/cards/subjects" className="btn btn-secondary">
            Curriculum subjects
          </Link>
        ) : null}
        {author ? (
          <Link href="/cards/new" className="btn btn-primary">
            New task card
          </Link>
        ) : null}
      </div>
      <p className="text-ink-soft">
        {author
          ? "Cards are built from manual pages. A published version never changes; editing makes a new draft version."
          : "Published task cards. Each cites the manual pages it follows."}
      </p>
      <CardsTable
        initialCards={cards}
        subjects={subjects}
        author={author}
        initialModel={typeof scope.model === "string" ? scope.model.slice(0, 60) : ""}
        scopedFor={typeof scope.for === "string" ? scope.for.slice(0, 30) : null}
      />
    </div>
  );
}
