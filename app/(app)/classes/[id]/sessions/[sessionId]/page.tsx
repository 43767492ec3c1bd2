import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { requirePageUser } from "@/app/_adapters/session";
import { notFoundOnMissing } from "@/app/_adapters/not-found";
import { dateTimeIn } from "@/lib/domain/time";
import { getSession } from "@/lib/server/attendance";
import { isUuid } from "@/lib/server/http";
import { schoolTimeZone } from "@/lib/server/settings";
import { CloseRegister, RegisterForm } from "./_components/register-form";

export const metadata: Metadata = { title: "Attendance" };

export default async function SessionPage({ params }: { params: Promise<{ id: string; sessionId: string }> }) {
  const { id, sessionId } = await params;
  const user = await requirePageUser("attendance:take", `/classes/${id}/sessions/${sessionId}`);
  if (!isUuid(sessionId)) notFound();
  const session = await getSession({ actor: user, id: sessionId }).catch(notFoundOnMissing);
  if (session.classId !== id.toLowerCase()) notFound();
  const zone = await schoolTimeZone();
  return (
    <div className="flex flex-col gap-5">
      <Link href={`/classes/${id}`} className="self-start py-2">
        ← {session.className}
      </Link>
      <div>
        <h1>{session.subject}</h1>
        <p className="text-lg">
          {dateTimeIn(zone, session.startsAt)} · {session.minutes} min · {session.section}
        </p>
        <p className={session.closedAt ? "font-semibold" : "text-ink-soft"}>
          {session.closedAt
            ? `Register closed ${dateTimeIn(zone, session.closedAt)}: changes are corrections with a reason.`
            : "Register open."}
        </p>
      </div>
      {/* Not remounted on refresh: its message and choices stay, the history below each student updates. */}
      <RegisterForm session={session} />
      {session.closedAt ? null : <CloseRegister sessionId={session.id} />}
    </div>
  );
}
