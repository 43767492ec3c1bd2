import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { getCard } from "@/lib/server/cards/read";
import { getClassById, listClasses } from "@/lib/server/classes";
import { isUuid } from "@/lib/server/http";
import { listAssignments } from "@/lib/server/runs/assign";
import { AssignForm } from "../../_components/assign-form";
import { AssignmentActions } from "../../_components/assignment-actions";
import { dateTimeIn, dayIn } from "@/lib/domain/time";
import { upcomingBookings } from "@/lib/server/fleet/bookings";
import { schoolTimeZone } from "@/lib/server/settings";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Assign a task card" };

export default async function AssignPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("assignments:manage", `/cards/${id}/assign`);
  if (!isUuid(id)) notFound();
  const card = await getCard({ actor: user, id }).catch(notFoundOnMissing);
  const classes = await listClasses({ actor: user });
  const members = await Promise.all(classes.map((c) => getClassById({ actor: user, id: c.id })));
  const students = [
    ...new Map(
      members.flatMap((c) =>
        c.members
          .filter((m) => m.role === "student" && m.status !== "deactivated")
          .map((m) => [m.id, { id: m.id, name: m.name, className: c.name }]),
      ),
    ).values(),
  ];
  const assignments = await listAssignments({ actor: user, cardId: id });
  const zone = await schoolTimeZone();
  const today = dayIn(zone);
  const bookings = await upcomingBookings();
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
        <p className="notice-error">
          {card.archivedAt ? "This card is archived and cannot be assigned." : "Publish the card before assigning it."}
        </p>
      ) : (
        <AssignForm
          cardId={id}
          today={today}
          versions={published}
          classes={classes.map((c) => ({ id: c.id, name: c.name }))}
          students={students}
          bookings={bookings.map((b) => ({
            id: b.id,
            label: `${dateTimeIn(zone, b.startsAt)} · ${b.assetIdentifier} in ${b.placeName}${b.className ? ` · ${b.className}` : ""}`,
          }))}
        />
      )}
      <section aria-label="Assignments of this card" className="panel overflow-x-auto">
        <h2>Given so far</h2>
        <Table
          rows={assignments}
          rowKey={(a) => a.id}
          empty="Not assigned yet."
          columns={[
            { header: "Given", className: "whitespace-nowrap", cell: (a) => a.createdAt.slice(0, 10) },
            { header: "To", cell: (a) => a.className ?? "Chosen students" },
            { header: "Version", cell: (a) => `v${a.versionNumber}` },
            { header: "Due", cell: (a) => a.dueOn ?? "—" },
            { header: "Note", cell: (a) => a.note || "—" },
            { header: "Signed off / all", cell: (a) => `${a.counts.signed_off} / ${Object.values(a.counts).reduce((x, y) => x + y, 0)}` },
            { header: "Change", cell: (a) => <AssignmentActions assignment={a} today={today} /> },
          ]}
        />
      </section>
    </div>
  );
}
