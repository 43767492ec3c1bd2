import { and, desc, eq, gte, like, lt, or, sql, type SQL } from "drizzle-orm";
import type { Db, Tx } from "@/db";
import { getDb } from "@/db";
import { auditEvents, users } from "@/db/schema";
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

export async function listAuditEvents({ limit = 200, kind, actor, from, to }: AuditFilter = {}) {
  const where: SQL[] = [];
  if (kind) where.push(or(...auditKinds[kind].map((prefix) => like(auditEvents.action, `${prefix}%`)))!);
  if (actor) {
    const pattern = `%${actor.replace(/[\\%_]/g, "\\$&")}%`; // typed text is matched literally
    where.push(sql`(${users.name} ilike ${pattern} or ${users.email} ilike ${pattern})`);
  }
  if (from) where.push(gte(auditEvents.createdAt, new Date(`${from}T00:00:00Z`)));
  if (to) where.push(lt(auditEvents.createdAt, new Date(new Date(`${to}T00:00:00Z`).getTime() + 86_400_000)));
  return getDb()
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
}

export type { Tx };
