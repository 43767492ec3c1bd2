import "server-only";
import { and, asc, desc, eq, inArray, ne, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { assignments, classes, classMembers, curriculumSubjects, runEvents, runPhotos, runs, signOffs, taskCards, taskCardVersions, users } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { getVersionById } from "@/lib/server/cards/cards";
import type { CardVersionDto } from "@/lib/contracts/cards";
import type { AssignmentDto, EventBatchResultDto, RunDetailDto, SignOffDto, WorkItemDto } from "@/lib/contracts/runs";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import { stepSchema } from "@/lib/domain/validation/cards";
import type { RunEventInput } from "@/lib/domain/validation/runs";
import { foldRun, orderEvents, type CardStepForRun, type RunEvent, type RunState, type RunStatus } from "@/lib/domain/runs/fold";
import { workingMinutes } from "@/lib/domain/runs/hours";
import { packetBytes, packetFor } from "@/lib/server/runs/packet";
import { assignableStudents, reviewScope, reviewsRun } from "@/lib/server/runs/scope";
import { workStatusOf } from "@/lib/domain/runs/work-status";

const runNotFound = () => new AppError("not_found", "That run was not found.");
const signedOffConflict = () => new AppError("conflict", "This run is signed off. Its record cannot change; ask your instructor to assign the card again.");

// ---------------------------------------------------------------- assigning

export interface AssignInput {
  cardId: string;
  versionNumber?: number;
  classId: string | null;
  studentIds: string[];
  dueOn: string | null;
  note: string;
}

/** Runs for every student of the class and every student named; a student already on it keeps theirs. */
export async function createAssignment({ actor, input }: { actor: Actor; input: AssignInput }): Promise<{ id: string; runs: number }> {
  return getDb().transaction(async (tx) => {
    const published = await tx
      .select({ id: taskCardVersions.id, number: taskCardVersions.number, title: taskCardVersions.title, archivedAt: taskCards.archivedAt })
      .from(taskCardVersions)
      .innerJoin(taskCards, eq(taskCards.id, taskCardVersions.cardId))
      .where(and(eq(taskCardVersions.cardId, input.cardId), eq(taskCardVersions.status, "published")))
      .orderBy(desc(taskCardVersions.number));
    if (!published.length) throw new AppError("invalid", "That card has no published version to assign.", { fields: { cardId: "Publish the card first." } });
    if (published[0]!.archivedAt) throw new AppError("invalid", "That card is archived.", { fields: { cardId: "Archived cards cannot be assigned." } });
    const version = input.versionNumber ? published.find((v) => v.number === input.versionNumber) : published[0];
    if (!version) throw new AppError("invalid", `Version ${input.versionNumber} of that card is not published.`, { fields: { versionNumber: "Not a published version." } });

    const studentIds = new Set<string>();
    if (input.classId) {
      const [found] = await tx.select({ id: classes.id }).from(classes).where(eq(classes.id, input.classId));
      const member = can(actor, "classes:view-all")
        ? true
        : (await tx.select({ u: classMembers.userId }).from(classMembers).where(and(eq(classMembers.classId, input.classId), eq(classMembers.userId, actor.id)))).length > 0;
      // An instructor outside the class learns nothing about it, as on the class pages.
      if (!found || !member) throw new AppError("invalid", "That class was not found among yours.", { fields: { classId: "Not one of your classes." } });
      const members = await tx
        .select({ id: users.id })
        .from(classMembers)
        .innerJoin(users, eq(users.id, classMembers.userId))
        .where(and(eq(classMembers.classId, input.classId), eq(users.role, "student"), ne(users.status, "deactivated")));
      members.forEach((m) => studentIds.add(m.id));
    }
    if (input.studentIds.length) {
      const named = await tx
        .select({ id: users.id })
        .from(users)
        .where(and(inArray(users.id, input.studentIds), eq(users.role, "student"), ne(users.status, "deactivated")));
      const mine = await assignableStudents(tx, actor, named.map((n) => n.id));
      // Someone else's student is answered like a stranger: an instructor learns nothing of other classes.
      if (named.length !== new Set(input.studentIds).size || mine.size !== named.length) {
        throw new AppError("invalid", "Some of the people chosen are not active students of your classes.", { fields: { studentIds: "Only active students of your classes can be assigned." } });
      }
      named.forEach((m) => studentIds.add(m.id));
    }
    if (!studentIds.size) throw new AppError("invalid", "That class has no active students yet.", { fields: { classId: "No students in it." } });

    const [assignment] = await tx
      .insert(assignments)
      .values({ cardId: input.cardId, versionId: version.id, classId: input.classId, dueOn: input.dueOn, note: input.note, assignedBy: actor.id })
      .returning({ id: assignments.id });
    const made = await tx
      .insert(runs)
      .values([...studentIds].map((studentId) => ({ assignmentId: assignment!.id, studentId, versionId: version.id })))
      .onConflictDoNothing()
      .returning({ id: runs.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "assignment.created",
      subjectType: "assignment",
      subjectId: assignment!.id,
      details: { title: version.title, version: version.number, classId: input.classId, students: studentIds.size, dueOn: input.dueOn },
    });
    return { id: assignment!.id, runs: made.length };
  });
}

/** Assignments the actor made or that reach a class they are staff of (all, for an admin). */
export async function listAssignments({ actor, cardId }: { actor: Actor; cardId?: string }): Promise<AssignmentDto[]> {
  const mine = can(actor, "classes:view-all")
    ? undefined
    : sql`(${assignments.assignedBy} = ${actor.id} or ${assignments.classId} in (select class_id from class_members where user_id = ${actor.id}))`;
  const rows = await getDb()
    .select({
      id: assignments.id,
      cardId: assignments.cardId,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      className: classes.name,
      dueOn: assignments.dueOn,
      note: assignments.note,
      assignedByName: users.name,
      createdAt: assignments.createdAt,
      counts: sql<Record<RunStatus, number> | null>`(select jsonb_object_agg(s.status, s.n) from (select status, count(*)::int as n from runs r where r.assignment_id = ${assignments.id} group by status) s)`,
    })
    .from(assignments)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, assignments.versionId))
    .leftJoin(classes, eq(classes.id, assignments.classId))
    .leftJoin(users, eq(users.id, assignments.assignedBy))
    .where(and(cardId ? eq(assignments.cardId, cardId) : undefined, mine))
    .orderBy(desc(assignments.createdAt))
    .limit(200);
  const zero: Record<RunStatus, number> = { not_started: 0, in_progress: 0, submitted: 0, returned: 0, signed_off: 0 };
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), counts: { ...zero, ...(r.counts ?? {}) } }));
}

// ---------------------------------------------------------------- reading runs

function workItemQuery(db: Db | Tx) {
  const newest = sql<number | null>`(select max(v.number) from task_card_versions v where v.card_id = ${taskCardVersions.cardId} and v.status = 'published')`;
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

type WorkRow = Awaited<ReturnType<ReturnType<typeof workItemQuery>["execute"]>>[number];

function toWorkItem(r: WorkRow): WorkItemDto {
  const { newest, ...rest } = r;
  return {
    ...rest,
    newerVersion: newest != null && newest > r.versionNumber ? newest : null,
    workStatus: workStatusOf(r.status, r.dueOn),
    lastEventAt: r.lastEventAt?.toISOString() ?? null,
  };
}

/** A student's own runs, the ones still to do first. */
export async function listMyWork({ actor }: { actor: Actor }): Promise<WorkItemDto[]> {
  const rows = await workItemQuery(getDb())
    .where(eq(runs.studentId, actor.id))
    .orderBy(sql`${runs.status} = 'signed_off'`, sql`${assignments.dueOn} nulls last`, desc(runs.createdAt));
  return rows.map(toWorkItem);
}

/** Runs waiting for an instructor: submitted ones, oldest first, and inspection points waiting on a cart. */
export async function listReviewQueue({ actor, status = "submitted" }: { actor: Actor; status?: RunStatus }): Promise<WorkItemDto[]> {
  const rows = await workItemQuery(getDb()).where(and(eq(runs.status, status), reviewScope(actor))).orderBy(asc(runs.submittedAt), asc(runs.lastEventAt)).limit(500);
  return rows.map(toWorkItem);
}

export async function listRunsOfStudent(db: Db | Tx, studentId: string): Promise<WorkItemDto[]> {
  const rows = await workItemQuery(db).where(eq(runs.studentId, studentId)).orderBy(desc(runs.createdAt));
  return rows.map(toWorkItem);
}

/**
 * The run, if the actor may see it: its student, or an instructor who reviews it (lib/server/runs/scope.ts).
 * Anyone else gets a 404, not a 403.
 */
async function loadRun(db: Db | Tx, actor: Actor, runId: string, { lock = false } = {}) {
  const query = db.select().from(runs).where(eq(runs.id, runId));
  const [run] = lock ? await query.for("update") : await query;
  if (!run || (run.studentId !== actor.id && !(await reviewsRun(db, actor, run)))) throw runNotFound();
  return run;
}

function stepsForFold(version: Pick<CardVersionDto, "steps">): CardStepForRun[] {
  return version.steps.map((s) => ({ id: s.id, inspectionPoint: s.inspectionPoint, measurement: s.measurement, timerMinutes: s.timerMinutes }));
}

/** Only the steps, for folding: the full version (manual titles, rechecks) is not needed to store events. */
async function stepsOnly(db: Db | Tx, versionId: string): Promise<Pick<CardVersionDto, "steps">> {
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

/** The fold of what is stored, with the reviewers' ids as the server knows them. */
async function foldStored(db: Db | Tx, runId: string, version: Pick<CardVersionDto, "steps">) {
  const rows = await eventsOf(db, runId);
  // Review events are written only by the permission-checked routes below (the events API refuses
  // them), so whoever wrote one was a reviewer then, even if their role changed since.
  const reviewers = new Set(rows.filter((r) => reviewEventTypes.has(r.event.type)).map((r) => r.event.userId));
  const events = rows.map((r) => toRunEvent(r.event));
  return { rows, events, reviewers, state: foldRun(events, stepsForFold(version), reviewers) };
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
  const version = await getVersionById(run.versionId, db);
  const { rows, reviewers, state } = await foldStored(db, runId, version);
  const photos = await db
    .select({ id: runPhotos.id, stepId: runPhotos.stepId, contentType: runPhotos.contentType, bytes: runPhotos.bytes })
    .from(runPhotos)
    .where(eq(runPhotos.runId, runId))
    .orderBy(asc(runPhotos.createdAt));
  const packet = await packetFor(db, version);
  return {
    run: toWorkItem(item!),
    version,
    // In the fold's order, so a late event is listed after the review moment it arrived behind.
    events: orderEvents(rows.map((r) => ({ ...toRunEvent(r.event), userName: r.userName }))).map((o) => o.event),
    reviewers: [...reviewers],
    photos,
    signOff: await signOffOf(db, runId),
    packet: packet.pages.length ? { url: `/api/runs/${runId}/packet`, pages: packet.pages } : null,
    keepOnCarts: packet.keepOnCarts,
    state,
  };
}

/** The run's offline packet as PDF bytes: only the pages its card version cites. */
export async function getRunPacket({ actor, runId }: { actor: Actor; runId: string }): Promise<{ bytes: Uint8Array; hash: string }> {
  const db = getDb();
  const run = await loadRun(db, actor, runId);
  const plan = await packetFor(db, await getVersionById(run.versionId, db));
  if (!plan.pages.length) throw new AppError("not_found", "This card cites no manual pages.");
  return { bytes: await packetBytes(db, plan), hash: plan.hash };
}

// ---------------------------------------------------------------- writing events

const reviewEventTypes = new Set(["inspection.bought_off", "run.returned", "run.signed_off"]);

/** Stores what the fold says back onto the run row, for lists and queues. */
async function writeFold(tx: Tx, runId: string, state: RunState, events: RunEvent[]) {
  const times = events.map((e) => e.clientTime).sort();
  const submitted = events.filter((e) => e.type === "run.submitted").map((e) => e.clientTime).sort().at(-1);
  await tx
    .update(runs)
    .set({
      status: state.status,
      startedAt: times[0] ? new Date(times[0]) : null,
      lastEventAt: times.at(-1) ? new Date(times.at(-1)!) : null,
      submittedAt: state.status === "submitted" && submitted ? new Date(submitted) : null,
    })
    .where(eq(runs.id, runId));
}

function isSignedOffError(error: unknown) {
  return databaseErrorCode(error) === "HLF03";
}

/**
 * Stores a batch of events from a cart. Idempotent by event id: what is already stored is counted
 * as a duplicate and nothing changes, so a cart may re-send a batch whose answer it never got, even
 * after sign-off. New events on a signed-off run are refused (409), here and by the database.
 */
export async function appendEvents({ actor, runId, events }: { actor: Actor; runId: string; events: RunEventInput[] }): Promise<EventBatchResultDto> {
  try {
    return await getDb().transaction(async (tx) => {
      const run = await loadRun(tx, actor, runId, { lock: true });
      const ids = [...new Set(events.map((e) => e.id))];
      const known = await tx.select({ id: runEvents.id, runId: runEvents.runId }).from(runEvents).where(inArray(runEvents.id, ids));
      if (known.some((k) => k.runId !== runId)) {
        throw new AppError("conflict", "An event id in this batch belongs to another run. Each event needs its own id.");
      }
      const knownIds = new Set(known.map((k) => k.id));
      const fresh = [...new Map(events.filter((e) => !knownIds.has(e.id)).map((e) => [e.id, e])).values()];
      if (fresh.length && run.studentId !== actor.id) throw new AppError("forbidden", "Only the student doing this run records its work.");
      if (fresh.length && run.status === "signed_off") throw signedOffConflict();
      if (fresh.length) {
        // One receipt time for the batch, read after the run's lock: the fold orders batches by it,
        // and the transaction's start time (the column default) can be earlier than a batch that
        // held the lock first.
        const serverTime = await receiptTime(tx, runId);
        await tx.insert(runEvents).values(
          fresh.map((e) => ({ id: e.id, runId, userId: actor.id, type: e.type, stepId: e.stepId, payload: e.payload, clientTime: new Date(e.clientTime), serverTime })),
        );
      }
      if (!fresh.length) return { stored: 0, duplicates: events.length, status: run.status };
      const { events: all, state } = await foldStored(tx, runId, await stepsOnly(tx, run.versionId));
      await writeFold(tx, runId, state, all);
      return { stored: fresh.length, duplicates: events.length - fresh.length, status: state.status };
    });
  } catch (error) {
    if (isSignedOffError(error)) throw signedOffConflict();
    // Two runs sent an event with the same new id at the same moment.
    if (databaseErrorCode(error) === "23505") throw new AppError("conflict", "An event id in this batch is already used. Each event needs its own id.");
    throw error;
  }
}

/**
 * The receipt time of what is written now on this run, read under the run's lock: later than every
 * receipt before it on the run, even within one millisecond (JavaScript keeps milliseconds) or if
 * the clock steps back, so a batch never ties with the review moment it waited behind.
 */
async function receiptTime(tx: Tx, runId: string): Promise<Date> {
  const [row] = await tx
    .execute<{ now: Date | string }>(
      sql`select greatest(clock_timestamp(), coalesce(max(server_time) + interval '1 millisecond', clock_timestamp())) as now from run_events where run_id = ${runId}`,
    )
    .then((r) => r.rows);
  return new Date(row!.now);
}

/**
 * A review event made on the server, at the server's time: the fold places it after everything
 * received before it, so a cart whose clock runs fast cannot have earlier work folded in after it.
 */
async function appendReviewEvent(tx: Tx, actor: Actor, runId: string, type: "run.returned" | "run.signed_off" | "inspection.bought_off", stepId: string | null, payload: Record<string, unknown>) {
  const serverTime = await receiptTime(tx, runId);
  await tx.insert(runEvents).values({ id: crypto.randomUUID(), runId, userId: actor.id, type, stepId, payload, clientTime: serverTime, serverTime });
}

async function reviewContext(tx: Tx, actor: Actor, runId: string) {
  const run = await loadRun(tx, actor, runId, { lock: true });
  if (run.status === "signed_off") throw signedOffConflict();
  const version = await getVersionById(run.versionId, tx);
  return { run, version, ...(await foldStored(tx, runId, version)) };
}

export async function buyOff({ actor, runId, stepId }: { actor: Actor; runId: string; stepId: string }) {
  return getDb().transaction(async (tx) => {
    const { version, state } = await reviewContext(tx, actor, runId);
    const step = version.steps.find((s) => s.id === stepId);
    if (!step?.inspectionPoint) throw new AppError("invalid", "That step is not an inspection point of this card.", { fields: { stepId: "Not an inspection point." } });
    if (state.steps[stepId]?.boughtOff) throw new AppError("conflict", "That inspection point is already bought off.");
    if (!state.steps[stepId]?.checked) throw new AppError("invalid", "The student has not done that step yet.", { fields: { stepId: "Not done yet." } });
    await appendReviewEvent(tx, actor, runId, "inspection.bought_off", stepId, {});
    const after = await foldStored(tx, runId, version);
    await writeFold(tx, runId, after.state, after.events);
    await recordAudit(tx, { actorId: actor.id, action: "run.bought_off", subjectType: "run", subjectId: runId, details: { stepId } });
    return { status: after.state.status };
  });
}

export async function returnRun({ actor, runId, comment }: { actor: Actor; runId: string; comment: string }) {
  return getDb().transaction(async (tx) => {
    const { state, version } = await reviewContext(tx, actor, runId);
    if (state.status !== "submitted") throw new AppError("conflict", "Only a submitted run can be returned.");
    await appendReviewEvent(tx, actor, runId, "run.returned", null, { comment });
    const after = await foldStored(tx, runId, version);
    await writeFold(tx, runId, after.state, after.events);
    await recordAudit(tx, { actorId: actor.id, action: "run.returned", subjectType: "run", subjectId: runId, details: { comment } });
    return { status: after.state.status };
  });
}

/** What a sign-off keeps of the revisions the version cited: the record says what the work followed. */
function revisionsCitedBy(version: CardVersionDto): SignOffDto["revisionsCited"] {
  const byRevision = new Map<string, SignOffDto["revisionsCited"][number]>();
  for (const ref of version.steps.flatMap((s) => s.references)) {
    const entry = byRevision.get(ref.revisionId) ?? { revisionId: ref.revisionId, manualTitle: ref.manualTitle, label: ref.revisionLabel, pages: [] };
    if (!entry.pages.includes(ref.page)) entry.pages.push(ref.page);
    byRevision.set(ref.revisionId, entry);
  }
  return [...byRevision.values()].map((e) => ({ ...e, pages: e.pages.sort((a, b) => a - b) }));
}

/**
 * The student's events that count as work: folded (not set aside) and placed up to the last
 * hand-in, so notes sent while waiting for the sign-off do not add hours.
 */
function workCounted(events: RunEvent[], state: RunState, studentId: string): RunEvent[] {
  const setAside = new Set(state.ignored.map((i) => i.id));
  const ordered = orderEvents(events).map((o) => o.event);
  const lastHandIn = ordered.map((e) => e.type).lastIndexOf("run.submitted");
  return ordered.slice(0, lastHandIn + 1).filter((e) => e.userId === studentId && !setAside.has(e.id));
}

export async function signOffRun({ actor, runId, comment }: { actor: Actor; runId: string; comment: string }) {
  try {
    return await getDb().transaction(async (tx) => {
      const { run, version, state, events } = await reviewContext(tx, actor, runId);
      if (state.status !== "submitted") throw new AppError("conflict", "Only a submitted run can be signed off.");
      const waiting = version.steps.findIndex((s) => s.inspectionPoint && !state.steps[s.id]?.boughtOff);
      if (waiting >= 0) throw new AppError("invalid", `Buy off the inspection point at step ${waiting + 1} before signing off.`, { fields: { stepId: "Inspection point not bought off." } });
      const unchecked = version.steps.findIndex((s) => !state.steps[s.id]?.checked);
      if (unchecked >= 0) throw new AppError("invalid", `Step ${unchecked + 1} is not done. Return the run instead.`);
      await appendReviewEvent(tx, actor, runId, "run.signed_off", null, { comment });
      const actualMinutes = workingMinutes(workCounted(events, state, run.studentId), { assignedAt: run.createdAt.toISOString() });
      const revisionsCited = revisionsCitedBy(version);
      await tx.insert(signOffs).values({ runId, instructorId: actor.id, versionId: version.id, revisionsCited, actualMinutes, comment });
      await tx.update(runs).set({ status: "signed_off" }).where(eq(runs.id, runId));
      await recordAudit(tx, {
        actorId: actor.id,
        action: "run.signed_off",
        subjectType: "run",
        subjectId: runId,
        details: { studentId: run.studentId, title: version.title, version: version.number, revisions: revisionsCited.map((r) => `${r.manualTitle} ${r.label}`) },
      });
      return { status: "signed_off" as const };
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505" || isSignedOffError(error)) throw signedOffConflict();
    throw error;
  }
}

export { loadRun };
