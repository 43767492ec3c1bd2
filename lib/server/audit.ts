import { and, desc, eq, gte, inArray, like, lt, or, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "@/db";
import { getDb } from "@/db";
import { auditEvents, classes, curriculumSubjects, manuals, revisions, runs, taskCardVersions, users } from "@/db/schema";
import { isUuid } from "@/lib/contracts/endpoint";
import { describeAuditEvent, type AuditDetail, type AuditNames } from "@/lib/domain/audit/describe";
import { auditKinds, type AuditKind } from "@/lib/domain/validation/audit";

export interface AuditEntry {
  actorId: string | null;
  action: string;
  subjectType: string;
  subjectId?: string | null;
  details?: Record<string, unknown>;
}

/** Written inside the transaction of the change it records, so neither exists without the other. */
export async function recordAudit(tx: Tx | Db, entry: AuditEntry): Promise<void> {
  await tx.insert(auditEvents).values({
    actorId: entry.actorId,
    action: entry.action,
    subjectType: entry.subjectType,
    subjectId: entry.subjectId ?? null,
    details: entry.details ?? {},
  });
}

export interface AuditFilter {
  limit?: number;
  kind?: AuditKind;
  /** Part of the actor's name or e-mail. */
  actor?: string;
  /** Dates (YYYY-MM-DD), both days included. */
  from?: string;
  to?: string;
}

// A type, not an interface: the endpoint declares its events as plain JSON objects.
export type AuditEventRow = {
  id: string;
  action: string;
  subjectType: string;
  subjectId: string | null;
  details: Record<string, unknown>;
  createdAt: Date;
  actorName: string | null;
  actorEmail: string | null;
  /** Who did what to which record, in words (lib/domain/audit/describe.ts). */
  summary: string;
  /** The details in words, one "label: value" line each. */
  detailLines: AuditDetail[];
};

export async function listAuditEvents({ limit = 200, kind, actor, from, to }: AuditFilter = {}): Promise<AuditEventRow[]> {
  const where: SQL[] = [];
  if (kind) where.push(or(...auditKinds[kind].map((prefix) => like(auditEvents.action, `${prefix}%`)))!);
  if (actor) {
    const pattern = `%${actor.replace(/[\\%_]/g, "\\$&")}%`; // typed text is matched literally
    where.push(sql`(${users.name} ilike ${pattern} or ${users.email} ilike ${pattern})`);
  }
  if (from) where.push(gte(auditEvents.createdAt, new Date(`${from}T00:00:00Z`)));
  if (to) where.push(lt(auditEvents.createdAt, new Date(new Date(`${to}T00:00:00Z`).getTime() + 86_400_000)));
  const db = getDb();
  const rows = await db
    .select({
      id: auditEvents.id,
      action: auditEvents.action,
      subjectType: auditEvents.subjectType,
      subjectId: auditEvents.subjectId,
      details: auditEvents.details,
      createdAt: auditEvents.createdAt,
      actorName: users.name,
      actorEmail: users.email,
    })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditEvents.createdAt))
    .limit(limit);
  const names = await namesFor(db, rows);
  return rows.map((r) => {
    const { summary, details } = describeAuditEvent(r, names);
    return { ...r, summary, detailLines: details };
  });
}

type Row = { subjectType: string; subjectId: string | null; details: Record<string, unknown> };

/** The ids entries keep, by kind of record: the subjects, and the ids their details carry. */
function idsIn(rows: readonly Row[]) {
  const ids = {
    people: new Set<string>(),
    manuals: new Set<string>(),
    classes: new Set<string>(),
    cards: new Set<string>(),
    subjects: new Set<string>(),
    revisions: new Set<string>(),
    runs: new Set<string>(),
  };
  // Only ids: a stored value that is not one (older entries, hand-written ones) is left unnamed.
  const add = (set: Set<string>, value: unknown) => {
    for (const v of Array.isArray(value) ? value : [value]) if (typeof v === "string" && isUuid(v)) set.add(v);
  };
  const bySubject: Record<string, Set<string>> = {
    user: ids.people,
    manual: ids.manuals,
    class: ids.classes,
    task_card: ids.cards,
    subject: ids.subjects,
    run: ids.runs,
  };
  for (const r of rows) {
    const subjects = bySubject[r.subjectType];
    if (subjects) add(subjects, r.subjectId);
    add(ids.people, r.details.userIds);
    add(ids.people, r.details.userId);
    add(ids.people, r.details.coauthors);
    add(ids.people, r.details.studentId);
    add(ids.classes, r.details.classId);
    add(ids.cards, r.details.from);
    add(ids.revisions, r.details.revisionId);
  }
  return ids;
}

/**
 * Names for the ids on a page of entries: one query per kind of record, however many entries
 * (a person, class or card named by many entries is read once).
 */
async function namesFor(db: Db, rows: readonly Row[]): Promise<AuditNames> {
  const ids = idsIn(rows);
  const list = (set: Set<string>) => [...set];
  const [people, manualRows, classRows, cardRows, subjectRows, revisionRows, runRows] = await Promise.all([
    ids.people.size
      ? db
          .select({ id: users.id, name: users.name })
          .from(users)
          .where(inArray(users.id, list(ids.people)))
      : [],
    ids.manuals.size
      ? db
          .select({ id: manuals.id, name: manuals.title })
          .from(manuals)
          .where(inArray(manuals.id, list(ids.manuals)))
      : [],
    ids.classes.size
      ? db
          .select({ id: classes.id, name: classes.name })
          .from(classes)
          .where(inArray(classes.id, list(ids.classes)))
      : [],
    // A card's title is its newest version's.
    ids.cards.size
      ? db
          .selectDistinctOn([taskCardVersions.cardId], { id: taskCardVersions.cardId, name: taskCardVersions.title })
          .from(taskCardVersions)
          .where(inArray(taskCardVersions.cardId, list(ids.cards)))
          .orderBy(taskCardVersions.cardId, desc(taskCardVersions.number))
      : [],
    ids.subjects.size
      ? db
          .select({ id: curriculumSubjects.id, name: curriculumSubjects.name })
          .from(curriculumSubjects)
          .where(inArray(curriculumSubjects.id, list(ids.subjects)))
      : [],
    ids.revisions.size
      ? db
          .select({ id: revisions.id, label: revisions.label, manualTitle: manuals.title })
          .from(revisions)
          .innerJoin(manuals, eq(manuals.id, revisions.manualId))
          .where(inArray(revisions.id, list(ids.revisions)))
      : [],
    ids.runs.size
      ? db
          .select({
            id: runs.id,
            studentName: users.name,
            title: taskCardVersions.title,
            version: taskCardVersions.number,
            // Only the step ids, in order, for "step 3": not the steps' text.
            stepIds: sql<
              string[]
            >`(select coalesce(jsonb_agg(s.step->>'id' order by s.n), '[]'::jsonb) from jsonb_array_elements(${taskCardVersions.steps}) with ordinality as s(step, n))`,
          })
          .from(runs)
          .innerJoin(users, eq(users.id, runs.studentId))
          .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
          .where(inArray(runs.id, list(ids.runs)))
      : [],
  ]);
  const byId = (found: readonly { id: string; name: string }[]) => Object.fromEntries(found.map((f) => [f.id, f.name]));
  return {
    people: byId(people),
    manuals: byId(manualRows),
    classes: byId(classRows),
    cards: byId(cardRows),
    subjects: byId(subjectRows),
    revisions: Object.fromEntries(revisionRows.map((r) => [r.id, { label: r.label, manualTitle: r.manualTitle }])),
    runs: Object.fromEntries(runRows.map(({ id, ...run }) => [id, run])),
  };
}

export type { Tx };
