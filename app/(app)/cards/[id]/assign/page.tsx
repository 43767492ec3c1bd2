import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageUser } from "@/app/_adapters/session";
import { getCard } from "@/lib/server/cards/read";
import { getClassById, listClasses } from "@/lib/server/classes";
import { isUuid } from "@/lib/server/http";
import { listAssignments } from "@/lib/server/runs/assign";
import { AssignForm } from "../../_components/assign-form";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Assign a task card" };

export default async function AssignPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("assignments:manage", `/cards/${id}/assign`);
  if (!isUuid(id)) notFound();
  const card = await getCard({ actor: user, id }).catch(notFoundOnMissing);
  const classes = await listClasses({ actor: user });
  const members = await Promise.all(classes.map((c) => getClassById({ actor: user, id: c.id })));
  const students = [...new Map(members.flatMap((c) => c.members.filter((m) => m.role === "student" && m.status !== "deactivated").map((m) => [m.id, { id: m.id, name: m.name, className: c.name }]))).values()];
  const assignments = await listAssignments({ actor: user, cardId: id });
  const published = card.versions.filter((v) => v.status === "published").map((v) => v.number);
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href={`/cards/${id}`} className="inline-flex min-h-11 items-center">
          {card.published?.title ?? card.draft?.title ?? "Task card"}
        </Link>
      </nav>
      <h1>Assign: {card.published?.title ?? card.draft?.title}</h1>
      {published.length === 0 || card.archivedAt ? (
        <p className="notice-error">{card.archivedAt ? "This card is archived and cannot be assigned." : "Publish the card before assigning it."}</p>
      ) : (
        <AssignForm cardId={id} versions={published} classes={classes.map((c) => ({ id: c.id, name: c.name }))} students={students} />
      )}
      <section aria-label="Assignments of this card" className="panel overflow-x-auto">
        <h2>Given so far</h2>
        <table className="data-table">
          <thead>
            <tr>
              <th scope="col">Given</th>
              <th scope="col">To</th>
              <th scope="col">Version</th>
              <th scope="col">Due</th>
              <th scope="col">Note</th>
              <th scope="col">Signed off / all</th>
            </tr>
          </thead>
          <tbody>
            {assignments.map((a) => (
              <tr key={a.id}>
                <td className="whitespace-nowrap">{a.createdAt.slice(0, 10)}</td>
                <td>{a.className ?? "Chosen students"}</td>
                <td>v{a.versionNumber}</td>
                <td>{a.dueOn ?? "—"}</td>
                <td>{a.note || "—"}</td>
                <td>
                  {a.counts.signed_off} / {Object.values(a.counts).reduce((x, y) => x + y, 0)}
                </td>
              </tr>
            ))}
            {assignments.length === 0 ? (
              <tr>
                <td colSpan={6}>Not assigned yet.</td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </section>
    </div>
  );
}
