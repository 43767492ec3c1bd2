// The words the database, the server and the browser share: each list once, here. Pure data, so a
// client component can import it without drizzle's pg-core coming along (db/schema.ts builds its
// enums from these).

export const roles = ["student", "instructor", "librarian", "admin"] as const;
export type Role = (typeof roles)[number];

export const userStatuses = ["invited", "active", "deactivated"] as const;
export type UserStatus = (typeof userStatuses)[number];

export const documentTypes = [
  "maintenance_manual",
  "overhaul_manual",
  "parts_catalog",
  "service_bulletin",
  "airworthiness_directive",
  "handbook",
  "school_procedure",
] as const;
export type DocumentType = (typeof documentTypes)[number];

export const revisionStatuses = ["queued", "processing", "ready", "failed"] as const;
export type RevisionStatus = (typeof revisionStatuses)[number];

export const runStatuses = ["not_started", "in_progress", "submitted", "returned", "signed_off"] as const;
export type RunStatus = (typeof runStatuses)[number];

/** A run's status in the shop's words, as the badges and messages say it. */
export const runStatusLabels: Record<RunStatus, string> = {
  not_started: "Ready to start",
  in_progress: "In work",
  submitted: "Waiting for inspection",
  returned: "Sent back for rework",
  signed_off: "Signed off",
};
