// Findings on the fleet: what a student found during a run (a crack, a leak, a worn part), filed at
// the cart (offline too, as a run event, or straight to the API) with an id made there, so a
// re-send is stored once; decided and closed by an instructor of the student's classes.
import "server-only";
import { and, desc, eq, inArray, isNull, isNotNull, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { z } from "zod";
import { getDb, type Db, type Tx } from "@/db";
import { assets, assignments, findings, runs, taskCardVersions, users } from "@/db/schema";
import type { FindingDto } from "@/lib/contracts/fleet";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import type { FindingDecision } from "@/lib/domain/fleet/fleet";
import { offlineHours } from "@/lib/domain/runs/hours";
import type { decideFindingSchema, findingSchema } from "@/lib/domain/validation/fleet";
import { recordAudit } from "@/lib/server/audit";
import { takeOutOfService } from "@/lib/server/fleet/assets";
import { loadRun } from "@/lib/server/runs/queries";
import { reviewScope, reviewsRun } from "@/lib/server/runs/scope";

const findingNotFound = () => new AppError("not_found", "That finding was not found.");
const reporter = alias(users, "reporter");
const closer = alias(users, "closer");

const select = {
  f: findings,
  assetIdentifier: assets.identifier,
  runTitle: taskCardVersions.title,
  steps: taskCardVersions.steps,
  reportedByName: reporter.name,
  closedByName: closer.name,
};

function findingQuery(db: Db | Tx) {
  return db
    .select(select)
    .from(findings)
    .innerJoin(assets, eq(assets.id, findings.assetId))
    .innerJoin(reporter, eq(reporter.id, findings.reportedBy))
    .leftJoin(closer, eq(closer.id, findings.closedBy))
    .leftJoin(runs, eq(runs.id, findings.runId))
    .leftJoin(assignments, eq(assignments.id, runs.assignmentId))
    .leftJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId));
}

type Row = Awaited<ReturnType<ReturnType<typeof findingQuery>["where"]>>[number];
const toDto = (r: Row): FindingDto => {
  const steps = (r.steps ?? []) as { id: string }[];
  const index = r.f.stepId ? steps.findIndex((s) => s.id === r.f.stepId) : -1;
  return {
    id: r.f.id,
    assetId: r.f.assetId,
    assetIdentifier: r.assetIdentifier,
    runId: r.f.runId,
    runTitle: r.runTitle,
    stepId: r.f.stepId,
    stepNumber: index >= 0 ? index + 1 : null,
    text: r.f.text,
    photoKey: r.f.photoKey,
    reportedBy: r.f.reportedBy,
    reportedByName: r.reportedByName,
    foundAt: r.f.foundAt.toISOString(),
    receivedAt: r.f.receivedAt.toISOString(),
    decision: r.f.decision as FindingDecision | null,
    decisionNote: r.f.decisionNote,
    newAssignmentId: r.f.newAssignmentId,
    closedAt: r.f.closedAt?.toISOString() ?? null,
    closedByName: r.closedByName,
  };
};

/**
 * Findings everyone signed in may read (a crack on a trainer is everyone's business): of one asset,
 * or the open ones an instructor decides (their students' runs, and those filed without a run).
 */
export async function listFindings({
  actor,
  assetId,
  open,
  mine,
}: {
  actor: Actor;
  assetId?: string;
  open?: boolean;
  /** Only those the actor may decide. */
  mine?: boolean;
}): Promise<FindingDto[]> {
  const scope = mine ? reviewScope(actor) : undefined;
  const rows = await findingQuery(getDb())
    .where(
      and(
        assetId ? eq(findings.assetId, assetId) : undefined,
        open === true ? isNull(findings.closedAt) : open === false ? isNotNull(findings.closedAt) : undefined,
        mine && scope ? sql`(${findings.runId} is null or ${scope})` : undefined,
      ),
    )
    .orderBy(desc(findings.receivedAt))
    .limit(500);
  return rows.map(toDto);
}

/**
 * Stores a finding once: a second one with the same id is the same finding (200, as it was).
 * With a run, only its student files it (on the run's asset or any other in the fleet); the time
 * found is the cart's stamp held inside [receipt − one offline session, receipt].
 */
export async function fileFinding(
  tx: Tx,
  { actor, input, receivedAt = new Date() }: { actor: Actor; input: z.output<typeof findingSchema>; receivedAt?: Date },
): Promise<{ finding: FindingDto; created: boolean }> {
  if (input.id) {
    const [known] = await findingQuery(tx).where(eq(findings.id, input.id));
    if (known) {
      if (known.f.reportedBy !== actor.id)
        throw new AppError("conflict", "That finding id is already used. Each finding needs its own id.");
      return { finding: toDto(known), created: false };
    }
  }
  const [asset] = await tx.select({ id: assets.id, identifier: assets.identifier }).from(assets).where(eq(assets.id, input.assetId));
  if (!asset) throw new AppError("invalid", "That asset is not in the fleet.", { fields: { assetId: "Not in the fleet." } });
  if (input.runId) {
    const run = await loadRun(tx, actor, input.runId);
    if (run.studentId !== actor.id && !(await reviewsRun(tx, actor, run))) throw new AppError("not_found", "That run was not found.");
    if (input.stepId) {
      const [version] = await tx
        .select({ steps: taskCardVersions.steps })
        .from(taskCardVersions)
        .where(eq(taskCardVersions.id, run.versionId));
      if (!((version?.steps ?? []) as { id: string }[]).some((s) => s.id === input.stepId))
        throw new AppError("invalid", "That step is not on the run's card.", { fields: { stepId: "Not on this card." } });
    }
  } else if (input.stepId) {
    throw new AppError("invalid", "A step belongs to a run: name the run too.", { fields: { runId: "Name the run." } });
  }
  const stamp = input.foundAt ? Date.parse(input.foundAt) : receivedAt.getTime();
  const foundAt = new Date(Math.min(Math.max(stamp, receivedAt.getTime() - offlineHours * 3_600_000), receivedAt.getTime()));
  const [row] = await tx
    .insert(findings)
    .values({
      ...(input.id ? { id: input.id } : {}),
      assetId: input.assetId,
      runId: input.runId,
      stepId: input.stepId,
      text: input.text,
      photoKey: input.photoKey,
      reportedBy: actor.id,
      foundAt,
      receivedAt,
    })
    .onConflictDoNothing()
    .returning({ id: findings.id });
  if (!row) {
    // The same id arrived by the other path (the run's events) a moment ago.
    const [known] = await findingQuery(tx).where(eq(findings.id, input.id!));
    return { finding: toDto(known!), created: false };
  }
  await recordAudit(tx, {
    actorId: actor.id,
    action: "finding.filed",
    subjectType: "finding",
    subjectId: row.id,
    details: { asset: asset.identifier, runId: input.runId, text: input.text.slice(0, 200) },
  });
  const [stored] = await findingQuery(tx).where(eq(findings.id, row.id));
  return { finding: toDto(stored!), created: true };
}

export async function fileFindingNow({ actor, input }: { actor: Actor; input: z.output<typeof findingSchema> }) {
  return getDb().transaction((tx) => fileFinding(tx, { actor, input }));
}

/**
 * Decides what happens and closes the finding: fixed in the run, a new card assigned (naming the
 * assignment), deferred (with why), or the asset out of service (with why, shown to anyone
 * starting a run on it). An instructor of the run's student, any instructor for one filed without
 * a run, an admin. A closed finding stays closed: a new one is filed if it comes back.
 */
export async function decideFinding({ actor, id, input }: { actor: Actor; id: string; input: z.output<typeof decideFindingSchema> }) {
  return getDb().transaction(async (tx) => {
    const [row] = await tx.select().from(findings).where(eq(findings.id, id)).for("update");
    if (!row) throw findingNotFound();
    if (row.runId && !can(actor, "classes:view-all")) {
      const [run] = await tx.select().from(runs).where(eq(runs.id, row.runId));
      if (!run || !(await reviewsRun(tx, actor, run))) throw findingNotFound();
    }
    if (row.closedAt) throw new AppError("conflict", "This finding is closed already; file a new one if it came back.");
    if (input.newAssignmentId) {
      const [a] = await tx.select({ id: assignments.id }).from(assignments).where(eq(assignments.id, input.newAssignmentId));
      if (!a) throw new AppError("invalid", "That assignment was not found.", { fields: { newAssignmentId: "Not found." } });
    }
    if (input.decision === "out_of_service") await takeOutOfService(tx, actor, row.assetId, input.note);
    await tx
      .update(findings)
      .set({
        decision: input.decision,
        decisionNote: input.note,
        newAssignmentId: input.newAssignmentId,
        closedAt: new Date(),
        closedBy: actor.id,
      })
      .where(eq(findings.id, id));
    const [asset] = await tx.select({ identifier: assets.identifier }).from(assets).where(eq(assets.id, row.assetId));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "finding.closed",
      subjectType: "finding",
      subjectId: id,
      details: { asset: asset?.identifier ?? null, decision: input.decision, note: input.note },
    });
    const [stored] = await findingQuery(tx).where(eq(findings.id, id));
    return toDto(stored!);
  });
}

/** Open findings on these assets: what the cart shows before work starts on them. */
export async function openFindingsOn(db: Db | Tx, assetIds: string[]) {
  if (!assetIds.length) return [];
  return (await findingQuery(db).where(and(inArray(findings.assetId, assetIds), isNull(findings.closedAt)))).map(toDto);
}
