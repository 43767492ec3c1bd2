// The fleet: assets, what is installed on what (with its history), what applies to an asset, and
// the student work done on it. Assets are never deleted; status changes are audited.
import "server-only";
import { and, asc, desc, eq, ilike, inArray, isNull, or, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import type { z } from "zod";
import { getDb, type Db, type Tx } from "@/db";
import { assetInstallations, assets, manuals, runAssetChanges, runAssets, runs, taskCardVersions, users } from "@/db/schema";
import type { AssetDetailDto, AssetDto, InstallationDto } from "@/lib/contracts/fleet";
import type { Actor } from "@/lib/domain/access/permissions";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import { appliesTo, installationProblem, type AssetKind, type AssetStatus } from "@/lib/domain/fleet/fleet";
import type { createAssetSchema, runAssetsSchema, updateAssetSchema } from "@/lib/domain/validation/fleet";
import { recordAudit } from "@/lib/server/audit";
import { listFindings, openFindingsOn } from "@/lib/server/fleet/findings";
import { listBookings } from "@/lib/server/fleet/bookings";
import { loadRun } from "@/lib/server/runs/queries";

export const assetNotFound = () => new AppError("not_found", "That asset was not found.");
const parents = alias(assets, "parent_assets");

type Row = typeof assets.$inferSelect;
const toDto = (a: Row, installedOn: AssetDto["installedOn"], openFindingCount: number): AssetDto => ({
  id: a.id,
  identifier: a.identifier,
  kind: a.kind as AssetKind,
  model: a.model,
  serial: a.serial,
  status: a.status as AssetStatus,
  statusReason: a.statusReason,
  location: a.location,
  spanMetres: a.spanMetres,
  installedOn,
  openFindingCount,
});

export async function listAssets({ q, kind }: { q?: string; kind?: AssetKind } = {}): Promise<AssetDto[]> {
  const db = getDb();
  const words = (q ?? "").trim().replace(/[\\%_]/g, (c) => `\\${c}`);
  const rows = await db
    .select({
      a: assets,
      parentId: parents.id,
      parentIdentifier: parents.identifier,
      position: assetInstallations.position,
      open: sql<number>`(select count(*)::int from findings f where f.asset_id = ${assets.id} and f.closed_at is null)`,
    })
    .from(assets)
    .leftJoin(assetInstallations, and(eq(assetInstallations.assetId, assets.id), isNull(assetInstallations.removedAt)))
    .leftJoin(parents, eq(parents.id, assetInstallations.parentId))
    .where(
      and(
        kind ? eq(assets.kind, kind) : undefined,
        words
          ? or(ilike(assets.identifier, `%${words}%`), ilike(assets.model, `%${words}%`), ilike(assets.serial, `%${words}%`))
          : undefined,
      ),
    )
    .orderBy(asc(assets.kind), asc(assets.identifier))
    .limit(2000);
  return rows.map((r) =>
    toDto(r.a, r.parentId ? { id: r.parentId, identifier: r.parentIdentifier!, position: r.position ?? "" } : null, r.open),
  );
}

async function assetRow(db: Db | Tx, id: string, { lock = false } = {}) {
  const query = db.select().from(assets).where(eq(assets.id, id));
  const [row] = lock ? await query.for("update") : await query;
  if (!row) throw assetNotFound();
  return row;
}

const installer = alias(users, "installer");
const remover = alias(users, "remover");
const installRun = alias(runs, "install_run");
const removeRun = alias(runs, "remove_run");
const installVersion = alias(taskCardVersions, "install_version");
const removeVersion = alias(taskCardVersions, "remove_version");
const child = alias(assets, "child_assets");

/** Every installation the asset took part in, as the thing installed or as what it went on; newest first. */
async function historyOf(db: Db | Tx, id: string): Promise<InstallationDto[]> {
  const rows = await db
    .select({
      i: assetInstallations,
      child: { id: child.id, identifier: child.identifier, kind: child.kind },
      parent: { id: parents.id, identifier: parents.identifier, kind: parents.kind },
      installedByName: installer.name,
      removedByName: remover.name,
      installedRunTitle: installVersion.title,
      removedRunTitle: removeVersion.title,
    })
    .from(assetInstallations)
    .innerJoin(child, eq(child.id, assetInstallations.assetId))
    .innerJoin(parents, eq(parents.id, assetInstallations.parentId))
    .leftJoin(installer, eq(installer.id, assetInstallations.installedBy))
    .leftJoin(remover, eq(remover.id, assetInstallations.removedBy))
    .leftJoin(installRun, eq(installRun.id, assetInstallations.installedRunId))
    .leftJoin(installVersion, eq(installVersion.id, installRun.versionId))
    .leftJoin(removeRun, eq(removeRun.id, assetInstallations.removedRunId))
    .leftJoin(removeVersion, eq(removeVersion.id, removeRun.versionId))
    .where(or(eq(assetInstallations.assetId, id), eq(assetInstallations.parentId, id)))
    .orderBy(desc(assetInstallations.installedAt))
    .limit(500);
  return rows.map((r) => ({
    id: r.i.id,
    asset: { ...r.child, kind: r.child.kind as AssetKind },
    parent: { ...r.parent, kind: r.parent.kind as AssetKind },
    position: r.i.position,
    installedAt: r.i.installedAt.toISOString(),
    installedByName: r.installedByName,
    installedRun: r.i.installedRunId ? { id: r.i.installedRunId, title: r.installedRunTitle ?? "" } : null,
    removedAt: r.i.removedAt?.toISOString() ?? null,
    removedByName: r.removedByName,
    removedRun: r.i.removedRunId ? { id: r.i.removedRunId, title: r.removedRunTitle ?? "" } : null,
  }));
}

/** Manuals in the library and published cards whose applicability takes this asset (general ones too, marked so). */
export async function documentsFor(db: Db | Tx, asset: { model: string; serial: string }) {
  const manualRows = await db
    .select({ id: manuals.id, title: manuals.title, applicability: manuals.applicability })
    .from(manuals)
    .where(isNull(manuals.withdrawnAt))
    .orderBy(asc(manuals.title));
  const cardRows = await db.execute<{ id: string; title: string; applicability: string[] }>(sql`
    select distinct on (c.id) c.id, v.title, v.applicability
    from task_cards c join task_card_versions v on v.card_id = c.id
    where v.status = 'published' and c.archived_at is null
    order by c.id, v.number desc`);
  const pick = <T extends { applicability: string[] }>(rows: T[]) =>
    rows.flatMap((r) => {
      const a = appliesTo(r.applicability, asset);
      return a.applies ? [{ ...r, general: a.general }] : [];
    });
  return {
    manuals: pick(manualRows),
    cards: pick(cardRows.rows).sort((a, b) => a.title.localeCompare(b.title)),
  };
}

export async function getAsset({ actor, id }: { actor: Actor; id: string }): Promise<AssetDetailDto> {
  const db = getDb();
  const a = await assetRow(db, id);
  const [history, applies, allFindings, installed, work, bookings] = await Promise.all([
    historyOf(db, id),
    documentsFor(db, a),
    listFindings({ actor, assetId: id }),
    db
      .select({
        id: assets.id,
        identifier: assets.identifier,
        kind: assets.kind,
        model: assets.model,
        position: assetInstallations.position,
      })
      .from(assetInstallations)
      .innerJoin(assets, eq(assets.id, assetInstallations.assetId))
      .where(and(eq(assetInstallations.parentId, id), isNull(assetInstallations.removedAt)))
      .orderBy(asc(assets.identifier)),
    db
      .select({
        runId: runs.id,
        title: taskCardVersions.title,
        versionNumber: taskCardVersions.number,
        studentName: users.name,
        status: runs.status,
        date: sql<string>`coalesce(${runs.lastEventAt}, ${runs.createdAt})`,
      })
      .from(runAssets)
      .innerJoin(runs, eq(runs.id, runAssets.runId))
      .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
      .innerJoin(users, eq(users.id, runs.studentId))
      .where(eq(runAssets.assetId, id))
      .orderBy(desc(sql`coalesce(${runs.lastEventAt}, ${runs.createdAt})`))
      .limit(300),
    listBookings({ assetId: id, from: new Date(Date.now() - 7 * 86_400_000).toISOString() }),
  ]);
  const current = history.find((h) => h.asset.id === id && !h.removedAt);
  const open = allFindings.filter((f) => !f.closedAt);
  return {
    ...toDto(a, current ? { id: current.parent.id, identifier: current.parent.identifier, position: current.position } : null, open.length),
    installed: installed.map((i) => ({ ...i, kind: i.kind as AssetKind })),
    history,
    openFindings: open,
    closedFindings: allFindings.filter((f) => f.closedAt),
    applies,
    work: work.map((w) => ({ ...w, date: new Date(w.date).toISOString() })),
    bookings,
  };
}

export async function createAsset({ actor, input }: { actor: Actor; input: z.output<typeof createAssetSchema> }) {
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx.insert(assets).values(input).returning({ id: assets.id });
      await recordAudit(tx, {
        actorId: actor.id,
        action: "asset.created",
        subjectType: "asset",
        subjectId: row!.id,
        details: { identifier: input.identifier, kind: input.kind, model: input.model },
      });
      return { id: row!.id };
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505")
      throw new AppError("conflict", `${input.identifier} is already in the fleet.`, { fields: { identifier: "Already in the fleet." } });
    throw error;
  }
}

export async function updateAsset({ actor, id, input }: { actor: Actor; id: string; input: z.output<typeof updateAssetSchema> }) {
  return getDb().transaction(async (tx) => {
    const before = await assetRow(tx, id, { lock: true });
    const status = input.status ?? before.status;
    const statusReason = input.statusReason ?? (input.status && input.status !== before.status ? "" : before.statusReason);
    if (status === "out_of_service" && !statusReason)
      throw new AppError("invalid", "Say why it is out of service.", { fields: { statusReason: "Say why it is out of service." } });
    await tx
      .update(assets)
      .set({ ...input, status, statusReason })
      .where(eq(assets.id, id));
    await recordAudit(tx, {
      actorId: actor.id,
      action: status !== before.status ? "asset.status_changed" : "asset.updated",
      subjectType: "asset",
      subjectId: id,
      details: { identifier: before.identifier, from: before.status, to: status, reason: statusReason },
    });
    return { id };
  });
}

/** Puts an asset out of service (a finding's decision), in the caller's transaction. */
export async function takeOutOfService(tx: Tx, actor: Actor, id: string, reason: string) {
  const before = await assetRow(tx, id, { lock: true });
  await tx.update(assets).set({ status: "out_of_service", statusReason: reason }).where(eq(assets.id, id));
  await recordAudit(tx, {
    actorId: actor.id,
    action: "asset.status_changed",
    subjectType: "asset",
    subjectId: id,
    details: { identifier: before.identifier, from: before.status, to: "out_of_service", reason },
  });
}

/** The assets named on a run and the installation changes it makes (applied when it is signed off). */
export async function runAssetsOf(db: Db | Tx, runId: string) {
  const named = await db
    .select({
      id: assets.id,
      identifier: assets.identifier,
      kind: assets.kind,
      model: assets.model,
      status: assets.status,
      statusReason: assets.statusReason,
    })
    .from(runAssets)
    .innerJoin(assets, eq(assets.id, runAssets.assetId))
    .where(eq(runAssets.runId, runId))
    .orderBy(asc(assets.identifier));
  const changes = await db
    .select({
      action: runAssetChanges.action,
      assetId: runAssetChanges.assetId,
      parentId: runAssetChanges.parentId,
      position: runAssetChanges.position,
      appliedAt: runAssetChanges.appliedAt,
    })
    .from(runAssetChanges)
    .where(eq(runAssetChanges.runId, runId))
    .orderBy(asc(runAssetChanges.createdAt));
  return { assets: named, changes };
}

type Change = { action: "install" | "remove"; assetId: string; parentId: string; position: string };
/** Removals before installations: an engine change takes the old one off before the new one goes on. */
const inOrder = <C extends { action: string }>(changes: readonly C[]) =>
  [...changes].sort((a, b) => (a.action === b.action ? 0 : a.action === "remove" ? -1 : 1));

/**
 * Names the assets a run works on (replacing what was named) and the changes it makes. The student
 * of the run or a reviewer; not once it is signed off. Changes are checked now against where the
 * assets are, and again at sign-off.
 */
export async function setRunAssets(
  db: Db | Tx,
  { actor, runId, input }: { actor: Actor; runId: string; input: z.output<typeof runAssetsSchema> },
) {
  const run = await loadRun(db, actor, runId);
  if (run.status === "signed_off") throw new AppError("conflict", "This run is signed off: what it worked on is part of the record.");
  const ids = [...new Set([...input.assetIds, ...input.changes.flatMap((c) => [c.assetId, c.parentId])])];
  const known = ids.length ? await db.select({ id: assets.id }).from(assets).where(inArray(assets.id, ids)) : [];
  if (ids.some((id) => !known.some((k) => k.id === id)))
    throw new AppError("invalid", "An asset named is not in the fleet.", { fields: { assetIds: "Not in the fleet." } });
  const problem = await changesProblem(db, input.changes);
  if (problem) throw new AppError("invalid", problem, { fields: { changes: problem } });
  await db.delete(runAssets).where(eq(runAssets.runId, runId));
  if (ids.length) await db.insert(runAssets).values(ids.map((assetId) => ({ runId, assetId, namedBy: actor.id })));
  await db.delete(runAssetChanges).where(and(eq(runAssetChanges.runId, runId), isNull(runAssetChanges.appliedAt)));
  if (input.changes.length) await db.insert(runAssetChanges).values(inOrder(input.changes).map((c) => ({ runId, ...c })));
  return runAssetsOf(db, runId);
}

/** The first change that cannot be, in order, each seeing the ones before it done. */
async function changesProblem(db: Db | Tx, changes: readonly Change[]): Promise<string | null> {
  const freed = new Set<string>();
  const placed = new Map<string, { parentId: string; parentIdentifier: string }>();
  for (const change of inOrder(changes)) {
    const [asset, parent] = await Promise.all([assetRow(db, change.assetId), assetRow(db, change.parentId)]);
    const [stored] = await db
      .select({ parentId: assetInstallations.parentId, parentIdentifier: parents.identifier })
      .from(assetInstallations)
      .innerJoin(parents, eq(parents.id, assetInstallations.parentId))
      .where(and(eq(assetInstallations.assetId, change.assetId), isNull(assetInstallations.removedAt)));
    const current = placed.get(change.assetId) ?? (freed.has(change.assetId) ? null : (stored ?? null));
    const problem = installationProblem(
      change,
      { ...asset, kind: asset.kind as AssetKind },
      { ...parent, kind: parent.kind as AssetKind },
      current,
    );
    if (problem) return problem;
    if (change.action === "remove") freed.add(change.assetId);
    else placed.set(change.assetId, { parentId: parent.id, parentIdentifier: parent.identifier });
  }
  return null;
}

/**
 * At sign-off, in its transaction: the run's installation changes are written on the assets, naming
 * the run and the instructor. Refused (and the sign-off with it) when the assets have moved since.
 */
export async function applyRunAssetChange(tx: Tx, actor: Actor, runId: string, at: Date) {
  const pending = await tx
    .select()
    .from(runAssetChanges)
    .where(and(eq(runAssetChanges.runId, runId), isNull(runAssetChanges.appliedAt)))
    .for("update");
  if (!pending.length) return;
  const changes = inOrder(pending.map((c) => ({ ...c, action: c.action as "install" | "remove" })));
  for (const id of [...new Set(changes.map((c) => c.assetId))].sort()) await assetRow(tx, id, { lock: true });
  const problem = await changesProblem(tx, changes);
  if (problem)
    throw new AppError(
      "conflict",
      `The run's installation change cannot be recorded: ${problem} Correct what the run names, then sign off.`,
    );
  for (const change of changes) {
    if (change.action === "install") {
      await tx.insert(assetInstallations).values({
        assetId: change.assetId,
        parentId: change.parentId,
        position: change.position,
        installedAt: at,
        installedBy: actor.id,
        installedRunId: runId,
      });
    } else {
      await tx
        .update(assetInstallations)
        .set({ removedAt: at, removedBy: actor.id, removedRunId: runId })
        .where(and(eq(assetInstallations.assetId, change.assetId), isNull(assetInstallations.removedAt)));
    }
    await tx.update(runAssetChanges).set({ appliedAt: at }).where(eq(runAssetChanges.id, change.id));
    const [a, p] = await Promise.all([assetRow(tx, change.assetId), assetRow(tx, change.parentId)]);
    await recordAudit(tx, {
      actorId: actor.id,
      action: change.action === "install" ? "asset.installed" : "asset.removed",
      subjectType: "asset",
      subjectId: change.assetId,
      details: { identifier: a.identifier, parent: p.identifier, runId },
    });
  }
}

/** What the cart and the review screen read of a run's assets: named, the change, their open findings. */
export async function runAssetsView({ actor, runId }: { actor: Actor; runId: string }) {
  const db = getDb();
  await loadRun(db, actor, runId);
  const named = await runAssetsOf(db, runId);
  return {
    ...named,
    openFindings: await openFindingsOn(
      db,
      named.assets.map((a) => a.id),
    ),
  };
}

export async function nameRunAssets({ actor, runId, input }: { actor: Actor; runId: string; input: z.output<typeof runAssetsSchema> }) {
  await getDb().transaction((tx) => setRunAssets(tx, { actor, runId, input }));
  return runAssetsView({ actor, runId });
}
