// Inspection points waiting for buy-off: the queue an instructor works from, apart from runs in
// progress, and the mail a student's call from the cart sends. The run row keeps the step it waits
// at and when the student called (lib/server/runs/events.ts writeFold), so the queue is one query.
import "server-only";
import { and, asc, eq, isNotNull, isNull, ne, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { assignments, runs, taskCardVersions, users } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import type { BuyOffCallDto } from "@/lib/contracts/runs";
import { getEnv } from "@/lib/server/env";
import { queueMail } from "@/lib/server/mail";
import { buyOffCallMail } from "@/lib/server/mail/messages";
import { reviewScope } from "@/lib/server/runs/scope";

/** The 1-based place of the run's waiting step in its version's steps. */
const stepNumber = sql<number>`(select e.ord::int from jsonb_array_elements(${taskCardVersions.steps}) with ordinality as e(step, ord)
  where e.step->>'id' = ${runs.waitingStepId}::text)`;

/** Inspection points done and not bought off, in the actor's scope: the ones called for first, longest waiting first. */
export async function listBuyOffCalls({ actor }: { actor: Actor }): Promise<BuyOffCallDto[]> {
  const rows = await getDb()
    .select({
      runId: runs.id,
      studentName: users.name,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      note: assignments.note,
      stepId: runs.waitingStepId,
      stepNumber,
      calledAt: runs.calledAt,
      lastEventAt: runs.lastEventAt,
    })
    .from(runs)
    .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .innerJoin(users, eq(users.id, runs.studentId))
    .where(and(isNotNull(runs.waitingStepId), ne(runs.status, "signed_off"), isNull(assignments.withdrawnAt), reviewScope(actor)))
    .orderBy(sql`${runs.calledAt} is null`, asc(runs.calledAt), asc(runs.lastEventAt))
    .limit(500);
  return rows.map((r) => ({
    ...r,
    stepId: r.stepId!,
    calledAt: r.calledAt?.toISOString() ?? null,
    lastEventAt: r.lastEventAt?.toISOString() ?? null,
  }));
}

/** How many inspection points wait for this instructor: the home screen's count. */
export async function countBuyOffCalls({ actor }: { actor: Actor }): Promise<{ waiting: number; called: number }> {
  const [row] = await getDb()
    .select({ waiting: sql<number>`count(*)::int`, called: sql<number>`count(${runs.calledAt})::int` })
    .from(runs)
    .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
    .where(and(isNotNull(runs.waitingStepId), ne(runs.status, "signed_off"), isNull(assignments.withdrawnAt), reviewScope(actor)));
  return row ?? { waiting: 0, called: 0 };
}

/**
 * Mails the instructors who review this run (staff of the student's classes, and who assigned it)
 * that the student called for a buy-off. A mail that cannot be queued never fails the student's sync.
 */
export async function noticeBuyOffCall(runId: string, stepId: string): Promise<void> {
  try {
    const [run] = await getDb()
      .select({
        studentId: runs.studentId,
        studentName: users.name,
        assignedBy: assignments.assignedBy,
        title: taskCardVersions.title,
        note: assignments.note,
        stepNumber,
      })
      .from(runs)
      .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
      .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
      .innerJoin(users, eq(users.id, runs.studentId))
      .where(and(eq(runs.id, runId), eq(runs.waitingStepId, stepId)));
    if (!run) return;
    const instructors = await getDb().execute<{ email: string; name: string }>(
      sql`select u.email, u.name from users u
          where u.status = 'active' and u.role in ('instructor', 'admin')
            and (u.id = ${run.assignedBy}
              or (u.role = 'instructor' and u.id in (select me.user_id from class_members me join class_members s on s.class_id = me.class_id where s.user_id = ${run.studentId})))`,
    );
    const link = `${getEnv().APP_URL.replace(/\/$/, "")}/review?tab=buy-offs`;
    for (const to of instructors.rows) {
      await queueMail(
        buyOffCallMail({
          to: to.email,
          name: to.name,
          studentName: run.studentName,
          title: run.title,
          stepNumber: run.stepNumber,
          note: run.note,
          link,
        }),
      );
    }
  } catch (error) {
    console.error(`[hangarleaf] the buy-off call of run ${runId} was not mailed: ${error instanceof Error ? error.message : error}`);
  }
}
