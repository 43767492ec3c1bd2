import { desc, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { getDb } from "@/db";
import { auditEvents, users } from "@/db/schema";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

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

export async function listAuditEvents({ limit = 200 }: { limit?: number } = {}) {
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
    .orderBy(desc(auditEvents.createdAt))
    .limit(limit);
}

export type { Tx };
