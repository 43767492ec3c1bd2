// Moving open runs to the newest published version of their card, after a recheck: per student,
// chosen by the instructor, with what each move restarts said first. A move is a server event on the
// run ("run.moved"): the fold restarts the steps that changed and keeps the rest (lib/domain/runs/move.ts).
import "server-only";
import { and, eq, inArray, lt, ne, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { assignments, citationRechecks, runEvents, runs, taskCardVersions, users } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import type { RunToMoveDto } from "@/lib/contracts/runs";
import { AppError } from "@/lib/domain/errors";
import { compareSteps, type StepMove } from "@/lib/domain/runs/move";
import { stepSchema, type Step } from "@/lib/domain/validation/cards";
import { recordAudit } from "@/lib/server/audit";
import { receiptTime, writeFold } from "@/lib/server/runs/events";
import { foldStored, loadRun, stepsOnly } from "@/lib/server/runs/queries";
import { reviewScope } from "@/lib/server/runs/scope";

type VersionRow = { id: string; number: number; steps: Step[] };

async function newestPublished(db: Db | Tx, cardId: string): Promise<VersionRow> {
  const [row] = await db
    .select({ id: taskCardVersions.id, number: taskCardVersions.number, steps: taskCardVersions.steps })
    .from(taskCardVersions)
    .where(and(eq(taskCardVersions.cardId, cardId), eq(taskCardVersions.status, "published")))
    .orderBy(sql`${taskCardVersions.number} desc`)
    .limit(1);
  if (!row) throw new AppError("not_found", "That task card has no published version.");
  return { ...row, steps: (row.steps as unknown[]).map((s) => stepSchema.parse(s)) };
}

/** The steps of versions from `fromNumber` up to the target whose cited page a newer revision changed or removed. */
async function recheckedSteps(db: Db | Tx, cardId: string, fromNumber: number, toNumber: number): Promise<Set<string>> {
  const rows = await db
    .selectDistinct({ stepId: citationRechecks.stepId })
    .from(citationRechecks)
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, citationRechecks.versionId))
    .where(
      and(
        eq(citationRechecks.cardId, cardId),
        inArray(citationRechecks.status, ["changed", "removed"]),
        sql`${taskCardVersions.number} >= ${fromNumber} and ${taskCardVersions.number} < ${toNumber}`,
      ),
    );
  return new Set(rows.map((r) => r.stepId));
}

/** What moving from each older version to the target does, once per version. */
async function movesFrom(db: Db | Tx, cardId: string, target: VersionRow, versionIds: string[]) {
  const olds = versionIds.length
    ? await db
        .select({ id: taskCardVersions.id, number: taskCardVersions.number, steps: taskCardVersions.steps })
        .from(taskCardVersions)
        .where(inArray(taskCardVersions.id, [...new Set(versionIds)]))
    : [];
  const moves = new Map<string, StepMove>();
  for (const old of olds) {
    const steps = (old.steps as unknown[]).map((s) => stepSchema.parse(s));
    moves.set(old.id, compareSteps(steps, target.steps, await recheckedSteps(db, cardId, old.number, target.number)));
  }
  return moves;
}

const numbersOf = (ids: string[], steps: Step[]) =>
  ids
    .map((id) => steps.findIndex((s) => s.id === id) + 1)
    .filter((n) => n > 0)
    .sort((a, b) => a - b);

/** Open runs of the card on older versions, in the actor's scope, each with what a move would restart. */
export async function listRunsToMove({
  actor,
  cardId,
}: {
  actor: Actor;
  cardId: string;
}): Promise<{ target: number; runs: RunToMoveDto[] }> {
  const db = getDb();
  const target = await newestPublished(db, cardId);
  const rows = await db
    .select({
      runId: runs.id,
      studentName: users.name,
      status: runs.status,
      versionId: runs.versionId,
      versionNumber: taskCardVersions.number,
      dueOn: assignments.dueOn,
      note: assignments.note,
    })
    .from(runs)
    .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .innerJoin(users, eq(users.id, runs.studentId))
    .where(
      and(
        eq(taskCardVersions.cardId, cardId),
        lt(taskCardVersions.number, target.number),
        ne(runs.status, "signed_off"),
        reviewScope(actor),
      ),
    )
    .orderBy(users.name)
    .limit(500);
  const moves = await movesFrom(
    db,
    cardId,
    target,
    rows.map((r) => r.versionId),
  );
  return {
    target: target.number,
    runs: rows.map(({ versionId, ...r }) => {
      const move = moves.get(versionId)!;
      return {
        ...r,
        restartSteps: numbersOf(move.restarted, target.steps),
        addedSteps: numbersOf(move.added, target.steps),
        removedSteps: move.removed.length,
        keptSteps: move.kept.length,
      };
    }),
  };
}

/**
 * Moves the named runs to the card's newest published version. Each run is checked as the review
 * routes check it (the actor's scope, 404 otherwise) and must be open, of this card, on an older version.
 */
export async function moveRuns({ actor, cardId, runIds }: { actor: Actor; cardId: string; runIds: string[] }) {
  return getDb().transaction(async (tx) => {
    const target = await newestPublished(tx, cardId);
    const moved: { runId: string; restartSteps: number[] }[] = [];
    for (const runId of [...new Set(runIds)]) {
      const run = await loadRun(tx, actor, runId, { lock: true });
      const [from] = await tx
        .select({ cardId: taskCardVersions.cardId, number: taskCardVersions.number })
        .from(taskCardVersions)
        .where(eq(taskCardVersions.id, run.versionId));
      if (from?.cardId !== cardId) throw new AppError("not_found", "That run was not found on this card.");
      if (run.status === "signed_off")
        throw new AppError("conflict", "A signed-off run keeps the version it was signed off on. Assign the card again instead.");
      if (from.number >= target.number) throw new AppError("conflict", `That run is already on version ${from.number}.`);
      const move = (await movesFrom(tx, cardId, target, [run.versionId])).get(run.versionId)!;
      const serverTime = await receiptTime(tx, runId);
      await tx.insert(runEvents).values({
        id: crypto.randomUUID(),
        runId,
        userId: actor.id,
        type: "run.moved",
        stepId: null,
        payload: { fromVersion: from.number, toVersion: target.number, reopenStepIds: move.restarted },
        clientTime: serverTime,
        serverTime,
      });
      await tx.update(runs).set({ versionId: target.id }).where(eq(runs.id, runId));
      const after = await foldStored(tx, runId, await stepsOnly(tx, target.id));
      await writeFold(tx, runId, after.state, after.events);
      const restartSteps = numbersOf(move.restarted, target.steps);
      await recordAudit(tx, {
        actorId: actor.id,
        action: "run.moved",
        subjectType: "run",
        subjectId: runId,
        details: { fromVersion: from.number, toVersion: target.number, restartedSteps: restartSteps },
      });
      moved.push({ runId, restartSteps });
    }
    return { version: target.number, moved };
  });
}
