// Reading runs: work lists, the review queue, one run folded from its events, its packet.
import "server-only";
import { and, asc, desc, eq, inArray, isNull, or, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import {
  assignments,
  citationRechecks,
  curriculumSubjects,
  runEvents,
  runPhotos,
  runs,
  signOffs,
  taskCardVersions,
  users,
} from "@/db/schema";
import { type Actor } from "@/lib/domain/access/permissions";
import { getVersionById } from "@/lib/server/cards/read";
import type { CardVersionDto } from "@/lib/contracts/cards";
import type { RunDetailDto, SignOffDto, WorkItemDto } from "@/lib/contracts/runs";
import { AppError } from "@/lib/domain/errors";
import { stepSchema } from "@/lib/domain/validation/cards";
import { foldRun, orderEvents, type CardStepForRun, type RunEvent, type RunState, type RunStatus } from "@/lib/domain/runs/fold";
import { packetBytes, packetFor } from "@/lib/server/runs/packet";
import { reviewScope, reviewsRun } from "@/lib/server/runs/scope";
import { workStatusOf } from "@/lib/domain/runs/work-status";
import { dayIn } from "@/lib/domain/time";
import { runTools } from "@/lib/server/tools/lending";
import { schoolTimeZone } from "@/lib/server/settings";
import { reviewEventTypes } from "@/lib/server/runs/events";

const runNotFound = () => new AppError("not_found", "That run was not found.");

function workItemQuery(db: Db | Tx) {
  const newest = sql<
    number | null
  >`(select max(v.number) from task_card_versions v where v.card_id = ${taskCardVersions.cardId} and v.status = 'published')`;
  return db
    .select({
      runId: runs.id,
      assignmentId: runs.assignmentId,
      cardId: taskCardVersions.cardId,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      newest,
      subjectName: curriculumSubjects.name,
      ataChapter: taskCardVersions.ataChapter,
      dueOn: assignments.dueOn,
      note: assignments.note,
      status: runs.status,
      studentId: runs.studentId,
      studentName: users.name,
      lastEventAt: runs.lastEventAt,
      estimatedMinutes: taskCardVersions.estimatedMinutes,
    })
    .from(runs)
    .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .innerJoin(users, eq(users.id, runs.studentId))
    .leftJoin(curriculumSubjects, eq(curriculumSubjects.id, taskCardVersions.subjectId));
}

/** A withdrawn assignment's runs leave the lists, except those signed off: they are records. */
const notWithdrawn = or(isNull(assignments.withdrawnAt), eq(runs.status, "signed_off"));

type WorkRow = Awaited<ReturnType<ReturnType<typeof workItemQuery>["execute"]>>[number];

/** `today` is the school's day (lib/domain/time.ts dayIn): a card due today is overdue once the school's today ends. */
function toWorkItem(r: WorkRow, today: string): WorkItemDto {
  const { newest, ...rest } = r;
  return {
    ...rest,
    newerVersion: newest != null && newest > r.versionNumber ? newest : null,
    workStatus: workStatusOf(r.status, r.dueOn, today),
    lastEventAt: r.lastEventAt?.toISOString() ?? null,
  };
}

/** A student's own runs, the ones still to do first. */
export async function listMyWork({ actor }: { actor: Actor }): Promise<WorkItemDto[]> {
  const rows = await workItemQuery(getDb())
    .where(and(eq(runs.studentId, actor.id), notWithdrawn))
    .orderBy(sql`${runs.status} = 'signed_off'`, sql`${assignments.dueOn} nulls last`, desc(runs.createdAt));
  const today = dayIn(await schoolTimeZone());
  return rows.map((r) => toWorkItem(r, today));
}

/** Runs waiting for an instructor: submitted ones, oldest first, and inspection points waiting on a cart. */
export async function listReviewQueue({ actor, status = "submitted" }: { actor: Actor; status?: RunStatus }): Promise<WorkItemDto[]> {
  const rows = await workItemQuery(getDb())
    .where(and(eq(runs.status, status), notWithdrawn, reviewScope(actor)))
    .orderBy(asc(runs.submittedAt), asc(runs.lastEventAt))
    .limit(500);
  const today = dayIn(await schoolTimeZone());
  return rows.map((r) => toWorkItem(r, today));
}

export async function listRunsOfStudent(db: Db | Tx, studentId: string): Promise<WorkItemDto[]> {
  const rows = await workItemQuery(db)
    .where(and(eq(runs.studentId, studentId), notWithdrawn))
    .orderBy(desc(runs.createdAt));
  const today = dayIn(await schoolTimeZone());
  return rows.map((r) => toWorkItem(r, today));
}

/**
 * The run, if the actor may see it: its student, or an instructor who reviews it (lib/server/runs/scope.ts).
 * Anyone else gets a 404, not a 403.
 */
export async function loadRun(db: Db | Tx, actor: Actor, runId: string, { lock = false } = {}) {
  const query = db.select().from(runs).where(eq(runs.id, runId));
  const [run] = lock ? await query.for("update") : await query;
  if (!run || (run.studentId !== actor.id && !(await reviewsRun(db, actor, run)))) throw runNotFound();
  return run;
}

function stepsForFold(version: Pick<CardVersionDto, "steps">): CardStepForRun[] {
  return version.steps.map((s) => ({
    id: s.id,
    inspectionPoint: s.inspectionPoint,
    measurement: s.measurement,
    timerMinutes: s.timerMinutes,
  }));
}

/** Only the steps, for folding: the full version (manual titles, rechecks) is not needed to store events. */
export async function stepsOnly(db: Db | Tx, versionId: string): Promise<Pick<CardVersionDto, "steps">> {
  const [row] = await db.select({ steps: taskCardVersions.steps }).from(taskCardVersions).where(eq(taskCardVersions.id, versionId));
  return { steps: ((row?.steps ?? []) as unknown[]).map((s) => stepSchema.parse(s)) as unknown as CardVersionDto["steps"] };
}

async function eventsOf(db: Db | Tx, runId: string) {
  return db
    .select({ event: runEvents, userName: users.name, role: users.role })
    .from(runEvents)
    .innerJoin(users, eq(users.id, runEvents.userId))
    .where(eq(runEvents.runId, runId));
}

function toRunEvent(e: typeof runEvents.$inferSelect): RunEvent {
  return {
    id: e.id,
    type: e.type as RunEvent["type"],
    userId: e.userId,
    clientTime: e.clientTime.toISOString(),
    serverTime: e.serverTime.toISOString(),
    stepId: e.stepId,
    payload: e.payload as Record<string, unknown>,
  };
}

// Review events are written only by the permission-checked routes below (the events API refuses
// them), so whoever wrote one was a reviewer then, even if their role changed since.
const reviewersOf = (stored: (typeof runEvents.$inferSelect)[]) =>
  new Set(stored.filter((e) => reviewEventTypes.has(e.type)).map((e) => e.userId));

/** The fold of what is stored, with the reviewers' ids as the server knows them. */
export async function foldStored(db: Db | Tx, runId: string, version: Pick<CardVersionDto, "steps">) {
  const rows = await eventsOf(db, runId);
  const reviewers = reviewersOf(rows.map((r) => r.event));
  const events = rows.map((r) => toRunEvent(r.event));
  return { rows, events, reviewers, state: foldRun(events, stepsForFold(version), reviewers) };
}

/** The folds of many runs, as foldStored folds one, from one read of their events (a record lists many). */
export async function foldStoredRuns(
  db: Db | Tx,
  list: readonly { runId: string; steps: readonly CardStepForRun[] }[],
): Promise<Map<string, RunState>> {
  if (!list.length) return new Map();
  const stored = await db
    .select()
    .from(runEvents)
    .where(
      inArray(
        runEvents.runId,
        list.map((r) => r.runId),
      ),
    );
  const byRun = new Map<string, (typeof runEvents.$inferSelect)[]>();
  for (const e of stored) {
    const events = byRun.get(e.runId);
    if (events) events.push(e);
    else byRun.set(e.runId, [e]);
  }
  return new Map(
    list.map(({ runId, steps }) => {
      const events = byRun.get(runId) ?? [];
      return [runId, foldRun(events.map(toRunEvent), steps, reviewersOf(events))];
    }),
  );
}

async function signOffOf(db: Db | Tx, runId: string): Promise<SignOffDto | null> {
  const [row] = await db
    .select({ s: signOffs, instructorName: users.name, versionNumber: taskCardVersions.number })
    .from(signOffs)
    .innerJoin(users, eq(users.id, signOffs.instructorId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, signOffs.versionId))
    .where(eq(signOffs.runId, runId));
  if (!row) return null;
  return {
    instructorName: row.instructorName,
    signedAt: row.s.signedAt.toISOString(),
    versionNumber: row.versionNumber,
    revisionsCited: row.s.revisionsCited as SignOffDto["revisionsCited"],
    actualMinutes: row.s.actualMinutes,
    comment: row.s.comment,
  };
}

export async function getRunDetail({ actor, runId }: { actor: Actor; runId: string }): Promise<RunDetailDto & { state: RunState }> {
  const db = getDb();
  const run = await loadRun(db, actor, runId);
  const [item] = await workItemQuery(db).where(eq(runs.id, runId));
  const version = await staleStepsMarked(db, await getVersionById(run.versionId, db), run.status);
  const { rows, reviewers, state } = await foldStored(db, runId, version);
  const photos = await db
    .select({ id: runPhotos.id, stepId: runPhotos.stepId, contentType: runPhotos.contentType, bytes: runPhotos.bytes })
    .from(runPhotos)
    .where(eq(runPhotos.runId, runId))
    .orderBy(asc(runPhotos.createdAt));
  const packet = await packetFor(db, version);
  const timeZone = await schoolTimeZone();
  return {
    run: toWorkItem(item!, dayIn(timeZone)),
    timeZone,
    version,
    // In the fold's order, so a late event is listed after the review moment it arrived behind.
    events: orderEvents(rows.map((r) => ({ ...toRunEvent(r.event), userName: r.userName }))).map((o) => o.event),
    reviewers: [...reviewers],
    photos,
    signOff: await signOffOf(db, runId),
    packet: packet.pages.length ? { url: `/api/runs/${runId}/packet`, pages: packet.pages } : null,
    keepOnCarts: packet.keepOnCarts,
    tools: await runTools(db, run, version.tools),
    state,
  };
}

/**
 * A run on a version whose cited pages a newer manual revision changed keeps the "ask before you go
 * on" notice on those steps until it is moved to a newer card version or signed off, even after the
 * author rechecked the card (which clears it on the card's newest version only).
 */
async function staleStepsMarked(db: Db, version: CardVersionDto, status: RunStatus): Promise<CardVersionDto> {
  if (status === "signed_off") return version;
  const rows = await db
    .selectDistinct({ stepId: citationRechecks.stepId })
    .from(citationRechecks)
    .where(eq(citationRechecks.versionId, version.id));
  if (!rows.length) return version;
  const stale = new Set(rows.map((r) => r.stepId));
  return { ...version, steps: version.steps.map((s) => (stale.has(s.id) ? { ...s, underRecheck: true } : s)) };
}

/** The run's offline packet as PDF bytes: only the pages its card version cites. */
export async function getRunPacket({ actor, runId }: { actor: Actor; runId: string }): Promise<{ bytes: Uint8Array; hash: string }> {
  const db = getDb();
  const run = await loadRun(db, actor, runId);
  const plan = await packetFor(db, await getVersionById(run.versionId, db));
  if (!plan.pages.length) throw new AppError("not_found", "This card cites no manual pages.");
  return { bytes: await packetBytes(db, plan), hash: plan.hash };
}
