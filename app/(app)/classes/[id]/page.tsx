import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Table } from "@/components/table";
import { listUsers } from "@/lib/server/accounts";
import { can, roleLabels } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { getClassById } from "@/lib/server/classes";
import { AddMembersForm, RemoveMemberButton } from "./_components/member-controls";
import { isUuid } from "@/lib/server/http";
import { notFoundOnMissing } from "@/app/_adapters/not-found";
import { dateTimeIn } from "@/lib/domain/time";
import { listSessions } from "@/lib/server/attendance";
import { schoolTimeZone } from "@/lib/server/settings";
import { PlanSessionForm } from "./_components/plan-session-form";

export const metadata: Metadata = { title: "Class" };

export default async function ClassPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser("classes:view", `/classes/${id}`);
  if (!isUuid(id)) notFound();
  const found = await getClassById({ actor: user, id }).catch(notFoundOnMissing);
  const manages = can(user, "classes:manage");
  // Instructors who are staff of the class keep its registers (admins every class's).
  const keeps = can(user, "classes:view-all") || (can(user, "attendance:take") && found.members.some((m) => m.id === user.id));
  const sessions = keeps ? await listSessions({ actor: user, classId: found.id }) : null;
  const zone = await schoolTimeZone();
  const memberIds = new Set(found.members.map((m) => m.id));
  const candidates = manages
    ? (await listUsers())
        .filter((u) => !memberIds.has(u.id) && u.status !== "deactivated")
        .map((u) => ({ id: u.id, label: `${u.name} (${roleLabels[u.role].toLowerCase()}, ${u.email})` }))
    : [];
  return (
    <div className="flex flex-col gap-6">
      <Link href="/classes" className="self-start py-2">
        ← All classes
      </Link>
      <div>
        <h1>{found.name}</h1>
        {found.description ? <p className="text-ink-soft">{found.description}</p> : null}
        {found.startsOn && found.endsOn ? (
          <p>
            {found.startsOn} to {found.endsOn}
          </p>
        ) : null}
      </div>
      <section aria-labelledby="members" className="panel flex flex-col gap-3">
        <h2 id="members">Members ({found.members.length})</h2>
        {found.members.length ? (
          <Table
            rows={found.members}
            rowKey={(m) => m.id}
            columns={[
              { header: "Name", cell: (m) => <strong>{m.name}</strong> },
              { header: "Role", cell: (m) => roleLabels[m.role] },
              { header: "E-mail", cell: (m) => m.email },
              manages && { header: "Actions", cell: (m) => <RemoveMemberButton classId={found.id} userId={m.id} name={m.name} /> },
            ]}
          />
        ) : (
          <p>Nobody is in this class yet.</p>
        )}
      </section>
      {manages ? <AddMembersForm classId={found.id} candidates={candidates} /> : null}
      {sessions ? (
        <section aria-labelledby="sessions" className="panel flex flex-col gap-3">
          <h2 id="sessions">Sessions and attendance</h2>
          <Table
            rows={sessions}
            rowKey={(s) => s.id}
            empty="No session planned yet."
            columns={[
              {
                header: "Session",
                cell: (s) => (
                  <Link href={`/classes/${found.id}/sessions/${s.id}`} className="inline-flex min-h-11 items-center font-semibold">
                    {s.subject}
                  </Link>
                ),
              },
              { header: "When", cell: (s) => `${dateTimeIn(zone, s.startsAt)} · ${s.minutes} min` },
              { header: "Section", cell: (s) => s.section },
              {
                header: "Register",
                cell: (s) =>
                  `${s.counts.present} present, ${s.counts.late} late, ${s.counts.absent} absent, ${s.counts.excused} excused${s.counts.unrecorded ? `, ${s.counts.unrecorded} not marked` : ""}${s.closedAt ? " · closed" : ""}`,
              },
            ]}
          />
        </section>
      ) : null}
      {sessions ? <PlanSessionForm classId={found.id} /> : null}
    </div>
  );
}
