// The instructor's side: buy-off of an inspection point, return for rework, sign-off.
import "server-only";
import { applyRunAssetChange } from "@/lib/server/fleet/assets";
import { eq } from "drizzle-orm";
import { getDb, type Tx } from "@/db";
import { runEvents, runs, signOffs } from "@/db/schema";
import { recordAudit } from "@/lib/server/audit";
import type { Actor } from "@/lib/domain/access/permissions";
import { getVersionById } from "@/lib/server/cards/read";
import type { CardVersionDto } from "@/lib/contracts/cards";
import type { SignOffDto } from "@/lib/contracts/runs";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import { cannotMarkDone, orderEvents, type RunEvent, type RunState } from "@/lib/domain/runs/fold";
import { workingMinutes } from "@/lib/domain/runs/hours";
import { signedOffConflict, writeFold, isSignedOffError, receiptTime } from "@/lib/server/runs/events";
import { loadRun, foldStored } from "@/lib/server/runs/queries";
import { assertNotWithdrawn } from "@/lib/server/runs/assign";
import { confirmOwnPassword } from "@/lib/server/auth/sign-in";

/**
 * A review event made on the server, at the server's time: the fold places it after everything
 * received before it, so a cart whose clock runs fast cannot have earlier work folded in after it.
 */
async function appendReviewEvent(
  tx: Tx,
  actor: Actor,
  runId: string,
  type: "run.returned" | "run.signed_off" | "inspection.bought_off",
  stepId: string | null,
  payload: Record<string, unknown>,
) {
  const serverTime = await receiptTime(tx, runId);
  await tx
    .insert(runEvents)
    .values({ id: crypto.randomUUID(), runId, userId: actor.id, type, stepId, payload, clientTime: serverTime, serverTime });
}

async function reviewContext(tx: Tx, actor: Actor, runId: string) {
  const run = await loadRun(tx, actor, runId, { lock: true });
  if (run.status === "signed_off") throw signedOffConflict();
  await assertNotWithdrawn(tx, run.assignmentId);
  const version = await getVersionById(run.versionId, tx);
  return { run, version, ...(await foldStored(tx, runId, version)) };
}

export async function buyOff({ actor, runId, stepId }: { actor: Actor; runId: string; stepId: string }) {
  return getDb().transaction(async (tx) => {
    const { version, state } = await reviewContext(tx, actor, runId);
    const step = version.steps.find((s) => s.id === stepId);
    if (!step?.inspectionPoint)
      throw new AppError("invalid", "That step is not an inspection point of this card.", {
        fields: { stepId: "Not an inspection point." },
      });
    if (state.steps[stepId]?.boughtOff) throw new AppError("conflict", "That inspection point is already bought off.");
    if (!state.steps[stepId]?.checked)
      throw new AppError("invalid", "The student has not done that step yet.", { fields: { stepId: "Not done yet." } });
    await appendReviewEvent(tx, actor, runId, "inspection.bought_off", stepId, {});
    const after = await foldStored(tx, runId, version);
    await writeFold(tx, runId, after.state, after.events);
    await recordAudit(tx, { actorId: actor.id, action: "run.bought_off", subjectType: "run", subjectId: runId, details: { stepId } });
    return { status: after.state.status };
  });
}

export async function returnRun({
  actor,
  runId,
  comment,
  reopenStepIds = [],
}: {
  actor: Actor;
  runId: string;
  comment: string;
  reopenStepIds?: string[];
}) {
  return getDb().transaction(async (tx) => {
    const { state, version } = await reviewContext(tx, actor, runId);
    if (state.status !== "submitted") throw new AppError("conflict", "Only a submitted run can be returned.");
    const numbers = new Map(version.steps.map((s, i) => [s.id, i + 1]));
    const reopen = [...new Set(reopenStepIds)];
    if (reopen.some((id) => !numbers.has(id)))
      throw new AppError("invalid", "A step named to do again is not on this card version.", {
        fields: { reopenStepIds: "Not a step of this card." },
      });
    await appendReviewEvent(tx, actor, runId, "run.returned", null, { comment, reopenStepIds: reopen });
    const after = await foldStored(tx, runId, version);
    await writeFold(tx, runId, after.state, after.events);
    await recordAudit(tx, {
      actorId: actor.id,
      action: "run.returned",
      subjectType: "run",
      subjectId: runId,
      details: { comment, reopenedSteps: reopen.map((id) => numbers.get(id)!).sort((a, b) => a - b) },
    });
    return { status: after.state.status };
  });
}

/** What a sign-off keeps of the revisions the version cited: the record says what the work followed. */
function revisionsCitedBy(version: CardVersionDto): SignOffDto["revisionsCited"] {
  const byRevision = new Map<string, SignOffDto["revisionsCited"][number]>();
  for (const ref of version.steps.flatMap((s) => s.references)) {
    const entry = byRevision.get(ref.revisionId) ?? {
      revisionId: ref.revisionId,
      manualTitle: ref.manualTitle,
      label: ref.revisionLabel,
      pages: [],
    };
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

export async function signOffRun({ actor, runId, comment, password }: { actor: Actor; runId: string; comment: string; password: string }) {
  // Whose run first (404 for a stranger's), then the password, before the run's lock: a wrong
  // password changes nothing and holds nobody up.
  await loadRun(getDb(), actor, runId);
  await confirmOwnPassword({ userId: actor.id, password });
  try {
    return await getDb().transaction(async (tx) => {
      const { run, version, state, events } = await reviewContext(tx, actor, runId);
      if (state.status !== "submitted") throw new AppError("conflict", "Only a submitted run can be signed off.");
      const waiting = version.steps.findIndex((s) => s.inspectionPoint && !state.steps[s.id]?.boughtOff);
      if (waiting >= 0)
        throw new AppError("invalid", `Buy off the inspection point at step ${waiting + 1} before signing off.`, {
          fields: { stepId: "Inspection point not bought off." },
        });
      const unchecked = version.steps.findIndex((s) => !state.steps[s.id]?.checked);
      if (unchecked >= 0) throw new AppError("invalid", `Step ${unchecked + 1} is not done. Return the run instead.`);
      const unexplained = version.steps.findIndex((s) => cannotMarkDone(s, state.steps[s.id]!));
      if (unexplained >= 0)
        throw new AppError(
          "invalid",
          `Step ${unexplained + 1}'s reading is out of limits and has no note of what was found. Return the run and name the step.`,
        );
      await appendReviewEvent(tx, actor, runId, "run.signed_off", null, { comment });
      const actualMinutes = workingMinutes(workCounted(events, state, run.studentId), { assignedAt: run.createdAt.toISOString() });
      const revisionsCited = revisionsCitedBy(version);
      await tx.insert(signOffs).values({ runId, instructorId: actor.id, versionId: version.id, revisionsCited, actualMinutes, comment });
      await tx.update(runs).set({ status: "signed_off" }).where(eq(runs.id, runId));
      // An engine removed or installed in this run is written on the assets now, naming the run.
      await applyRunAssetChange(tx, actor, runId, new Date());
      await recordAudit(tx, {
        actorId: actor.id,
        action: "run.signed_off",
        subjectType: "run",
        subjectId: runId,
        details: {
          studentId: run.studentId,
          title: version.title,
          version: version.number,
          revisions: revisionsCited.map((r) => `${r.manualTitle} ${r.label}`),
        },
      });
      return { status: "signed_off" as const };
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505" || isSignedOffError(error)) throw signedOffConflict();
    throw error;
  }
}
