import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CardView } from "@/components/card-view";
import { can } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { listColleagues } from "@/lib/server/accounts";
import { getCard, getCardVersion } from "@/lib/server/cards/read";
import { CardActions } from "../_components/card-actions";
import { CoauthorsForm } from "../_components/coauthors-form";
import { MoveRuns } from "../_components/move-runs";
import { dayIn } from "@/lib/domain/time";
import { schoolTimeZone } from "@/lib/server/settings";
import { listRunsToMove } from "@/lib/server/runs/move";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Task card" };

export default async function CardPage({
  params,
  searchParams,
}: {
  params: Promise<{ id: string }>;
  searchParams: Promise<{ v?: string }>;
}) {
  const { id } = await params;
  const { v } = await searchParams;
  const user = await requirePageUser("cards:view", `/cards/${id}`);
  if (!isUuid(id)) notFound();
  const author = can(user, "cards:author");
  const card = await getCard({ actor: user, id }).catch(notFoundOnMissing);
  const wanted = v && /^\d+$/.test(v) ? Number(v) : null;
  const shown = wanted
    ? await getCardVersion({ actor: user, cardId: id, number: wanted }).catch(() => notFound())
    : (card.published ?? card.draft);
  if (!shown) notFound();
  const zone = await schoolTimeZone();
  const toMove = can(user, "assignments:manage") && card.published ? await listRunsToMove({ actor: user, cardId: id }) : null;

  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/cards" className="inline-flex min-h-11 items-center">
          Task cards
        </Link>
      </nav>
      {card.archivedAt ? <p className="notice-error">This card is archived: it is not offered for new work.</p> : null}
      {author && card.openRechecks > 0 ? (
        <p role="alert" className="notice-error">
          A new manual revision changed {card.openRechecks === 1 ? "a page" : `${card.openRechecks} pages`} this card cites.{" "}
          <Link href={`/cards/${id}/recheck`}>Recheck the citations</Link>
        </p>
      ) : null}
      {card.published && shown.number < card.published.number ? (
        <p role="alert" className="notice-error">
          This is version {shown.number}. Version {card.published.number} is the current one.{" "}
          <Link href={`/cards/${id}`}>Open version {card.published.number}</Link>
        </p>
      ) : null}
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">{shown.title}</h1>
        {can(user, "assignments:manage") && card.published && !card.archivedAt ? (
          <Link href={`/cards/${id}/assign`} className="btn btn-primary">
            Assign
          </Link>
        ) : null}
        <a href={`/api/cards/${id}/versions/${shown.number}/pdf`} className="btn btn-secondary" target="_blank" rel="noreferrer">
          Print (PDF)
        </a>
      </div>
      {author ? (
        <section className="panel flex flex-col gap-3" aria-label="Card versions and actions">
          <CardActions card={card} />
          {card.ownerId === user.id || can(user, "cards:edit-any") ? (
            <CoauthorsForm card={card} colleagues={await listColleagues()} />
          ) : null}
          <div>
            <h2 className="text-base font-bold">Versions</h2>
            <ul className="flex flex-wrap gap-2">
              {card.versions.map((ver) => (
                <li key={ver.number}>
                  <Link
                    href={`/cards/${id}?v=${ver.number}`}
                    aria-current={ver.number === shown.number ? "page" : undefined}
                    className={`btn btn-small ${ver.number === shown.number ? "btn-primary" : "btn-secondary"}`}
                  >
                    v{ver.number} ·{" "}
                    {ver.status === "published" ? `published ${ver.publishedAt ? dayIn(zone, ver.publishedAt) : ""}` : "draft"}
                  </Link>
                </li>
              ))}
            </ul>
            <p className="hint mt-1">
              Owner: {card.ownerName ?? "nobody"}
              {card.coauthors.length ? ` · co-authors: ${card.coauthors.map((c) => c.name).join(", ")}` : ""}
              {shown.publishedByName ? ` · published by ${shown.publishedByName}` : ""}
            </p>
          </div>
        </section>
      ) : null}
      {toMove ? <MoveRuns cardId={id} target={toMove.target} runs={toMove.runs} /> : null}
      <CardView version={shown} />
    </div>
  );
}
