import { z } from "zod";

/** What the audit page filters by: the prefixes of the actions each kind covers. */
export const auditKinds = {
  accounts: ["account."],
  classes: ["class."],
  library: ["manual.", "revision."],
  cards: ["card.", "subject."],
  assignments: ["assignment."],
  runs: ["run."],
  tools: ["tool.", "kit."],
  attendance: ["session.", "attendance.", "standard."],
} as const;
export type AuditKind = keyof typeof auditKinds;

// The audit log's filters, from a query string: anything unreadable is ignored, not an error.
export const auditQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(1000).default(200),
  kind: z
    .enum(Object.keys(auditKinds) as [AuditKind, ...AuditKind[]])
    .optional()
    .catch(undefined),
  actor: z
    .string()
    .trim()
    .max(100)
    .optional()
    .catch(undefined)
    .transform((v) => v || undefined),
  from: z.iso.date().optional().catch(undefined),
  to: z.iso.date().optional().catch(undefined),
});
