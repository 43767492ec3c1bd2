import { sql } from "drizzle-orm";
import {
  bigint,
  boolean,
  check,
  customType,
  date,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  real,
  text,
  timestamp,
  uniqueIndex,
  uuid,
  type AnyPgColumn,
} from "drizzle-orm/pg-core";
import { documentTypes, revisionStatuses, roles, runStatuses, userStatuses } from "@/lib/domain/vocabulary";

export const userRole = pgEnum("user_role", roles);
export const userStatus = pgEnum("user_status", userStatuses);
export const tokenPurpose = pgEnum("token_purpose", ["invitation", "password_reset"]);

const timestamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
};

/**
 * The school's own settings, one row (id "school"): the time zone its days and times are told in.
 * Stored times stay UTC; this is how screens, mails and "is it overdue" read them. Also the hours
 * the school plans per section of the standard.
 */
export const schoolSettings = pgTable("school_settings", {
  id: text("id").primaryKey().default("school"),
  timeZone: text("time_zone").notNull().default("UTC"),
  // Hours the school plans per section of the standard ({ "General": 400, … }); attendance is
  // shown against them. A section left out has no plan.
  plannedHours: jsonb("planned_hours").$type<Partial<Record<string, number>>>().notNull().default({}),
  ...timestamps,
});

export const users = pgTable(
  "users",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    // Stored lower-cased; the unique index is on the stored value.
    email: text("email").notNull(),
    name: text("name").notNull(),
    role: userRole("role").notNull(),
    status: userStatus("status").notNull().default("invited"),
    passwordHash: text("password_hash"),
    // Bumped on password change, deactivation and role change: sealed cookies carry the version
    // they were issued with, so older cookies stop working at once.
    sessionVersion: integer("session_version").notNull().default(0),
    lastSignInAt: timestamp("last_sign_in_at", { withTimezone: true }),
    ...timestamps,
  },
  (t) => [uniqueIndex("users_email_key").on(t.email), index("users_role_idx").on(t.role)],
);

export const classes = pgTable(
  "classes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    description: text("description").notNull().default(""),
    startsOn: date("starts_on"),
    endsOn: date("ends_on"),
    ...timestamps,
  },
  (t) => [uniqueIndex("classes_name_key").on(t.name)],
);

export const classMembers = pgTable(
  "class_members",
  {
    classId: uuid("class_id")
      .notNull()
      .references(() => classes.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    ...timestamps,
  },
  (t) => [primaryKey({ columns: [t.classId, t.userId] }), index("class_members_user_idx").on(t.userId)],
);

export const accountTokens = pgTable(
  "account_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    purpose: tokenPurpose("purpose").notNull(),
    // Only the SHA-256 of the token is stored: a copy of the database opens no accounts.
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    ...timestamps,
  },
  (t) => [uniqueIndex("account_tokens_hash_key").on(t.tokenHash), index("account_tokens_user_idx").on(t.userId)],
);

/**
 * One signed-in session. The cookie names it; signing out deletes it, so a copy of the cookie
 * replayed afterwards is refused even before the cookie's own expiry.
 */
export const userSessions = pgTable(
  "user_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    ...timestamps,
  },
  (t) => [index("user_sessions_user_idx").on(t.userId)],
);

export const signInThrottles = pgTable("sign_in_throttles", {
  // "account:<email>" or "address:<ip>"
  key: text("key").primaryKey(),
  failures: integer("failures").notNull().default(0),
  lastFailureAt: timestamp("last_failure_at", { withTimezone: true }).notNull().defaultNow(),
  blockedUntil: timestamp("blocked_until", { withTimezone: true }),
  ...timestamps,
});

export const auditEvents = pgTable(
  "audit_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    actorId: uuid("actor_id").references(() => users.id, { onDelete: "set null" }),
    action: text("action").notNull(),
    subjectType: text("subject_type").notNull(),
    subjectId: text("subject_id"),
    details: jsonb("details")
      .$type<Record<string, unknown>>()
      .notNull()
      .default(sql`'{}'::jsonb`),
    ...timestamps,
  },
  (t) => [index("audit_events_created_idx").on(t.createdAt)],
);

export const documentType = pgEnum("document_type", documentTypes);
export const revisionStatus = pgEnum("revision_status", revisionStatuses);

export const manuals = pgTable(
  "manuals",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    title: text("title").notNull(),
    documentType: documentType("document_type").notNull(),
    // Models the document applies to (aircraft, engine, propeller or component), as written on it.
    applicability: text("applicability")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    // ATA chapters the document covers, two digits ("05", "32", "74").
    ataChapters: text("ata_chapters")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    // Set only when a revision is ready; never points at a queued, processing or failed one.
    currentRevisionId: uuid("current_revision_id").references((): AnyPgColumn => revisions.id, { onDelete: "set null" }),
    // A librarian's choice: carts store the whole current PDF, not only the pages cards cite.
    keepOnCarts: boolean("keep_on_carts").notNull().default(false),
    // Withdrawn from the library by a librarian: out of the list and of search, still readable
    // where a card cites it, and restorable. Nothing of it is deleted.
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    withdrawnBy: uuid("withdrawn_by").references((): AnyPgColumn => users.id, { onDelete: "set null" }),
    withdrawReason: text("withdraw_reason").notNull().default(""),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    ...timestamps,
  },
  (t) => [uniqueIndex("manuals_title_key").on(t.title)],
);

export const revisions = pgTable(
  "revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    manualId: uuid("manual_id")
      .notNull()
      .references(() => manuals.id, { onDelete: "cascade" }),
    label: text("label").notNull(),
    revisionDate: date("revision_date").notNull(),
    status: revisionStatus("status").notNull().default("queued"),
    pageCount: integer("page_count"),
    pagesDone: integer("pages_done").notNull().default(0),
    error: text("error"),
    fileKey: text("file_key").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    sha256: text("sha256").notNull(),
    // The same document rewritten by qpdf with its objects packed in object streams: the reader
    // opens page 700 of a large manual with a few range requests instead of hundreds. Made after
    // the revision is ready; until then (or if qpdf cannot) the reader uses the upload itself.
    readerFileKey: text("reader_file_key"),
    readerSizeBytes: bigint("reader_size_bytes", { mode: "number" }),
    uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    // How often ingest has started on it, and when the worker last said it is still at it: a
    // revision whose worker died is picked up again by the sweeper in worker/index.ts.
    attempts: integer("attempts").notNull().default(0),
    heartbeatAt: timestamp("heartbeat_at", { withTimezone: true }),
    readyAt: timestamp("ready_at", { withTimezone: true }),
    supersededAt: timestamp("superseded_at", { withTimezone: true }),
    ...timestamps,
  },
  (t) => [uniqueIndex("revisions_manual_label_key").on(t.manualId, t.label), index("revisions_status_idx").on(t.status)],
);

const tsvector = customType<{ data: string }>({ dataType: () => "tsvector" });

export const pages = pgTable(
  "pages",
  {
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    pageNumber: integer("page_number").notNull(),
    text: text("text").notNull(),
    // The first line of text on the page: running headings and titles, weighed higher by search.
    heading: text("heading").notNull().default(""),
    ocr: boolean("ocr").notNull().default(false),
    thumbnailKey: text("thumbnail_key"),
    // Kept by PostgreSQL itself: the heading weighs A, the body B. GIN-indexed (db/migrations/
    // 0006_search_gin.sql); the heading alone has its own vector, so pages whose heading matches
    // are found without reading every page that merely mentions the word.
    searchVector: tsvector("search_vector").generatedAlwaysAs(
      sql`setweight(to_tsvector('english', coalesce(heading, '')), 'A') || setweight(to_tsvector('english', coalesce(text, '')), 'B')`,
    ),
    headingVector: tsvector("heading_vector").generatedAlwaysAs(sql`to_tsvector('english', coalesce(heading, ''))`),
    ...timestamps,
  },
  (t) => [
    primaryKey({ columns: [t.revisionId, t.pageNumber] }),
    index("pages_search_gin").using("gin", t.searchVector),
    index("pages_heading_gin").using("gin", t.headingVector),
  ],
);

/** Every word (as a search lexeme) found in the library, for correcting typos in queries. */
export const searchWords = pgTable("search_words", {
  word: text("word").primaryKey(),
  ...timestamps,
});

/**
 * One row, whose number triggers raise whenever something a search can find or show changes
 * (migration 0008): the search engine keeps answers under it (search/postgres.ts).
 */
/**
 * A reader's bookmark or note on a manual page, kept on the revision it was made on and followed
 * to later revisions through the page comparisons (lib/server/library/marks.ts). A note with a
 * class is shown to that class's members; everything else is its writer's own.
 */
export const pageMarks = pgTable(
  "page_marks",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    manualId: uuid("manual_id")
      .notNull()
      .references(() => manuals.id, { onDelete: "cascade" }),
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    pageNumber: integer("page_number").notNull(),
    kind: text("kind").notNull(),
    text: text("text").notNull().default(""),
    classId: uuid("class_id").references((): AnyPgColumn => classes.id, { onDelete: "set null" }),
    ...timestamps,
  },
  (t) => [
    index("page_marks_manual_idx").on(t.manualId, t.userId),
    check("page_marks_kind", sql`${t.kind} in ('bookmark', 'note')`),
    check("page_marks_page", sql`${t.pageNumber} >= 1`),
  ],
);

export const searchGeneration = pgTable(
  "search_generation",
  {
    id: boolean("id").primaryKey().default(true),
    n: bigint("n", { mode: "number" }).notNull().default(0),
  },
  (t) => [check("search_generation_one_row", sql`${t.id}`)],
);

export const curriculumSubjects = pgTable(
  "curriculum_subjects",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    ...timestamps,
  },
  (t) => [uniqueIndex("curriculum_subjects_name_key").on(t.name)],
);

export const cardVersionStatus = pgEnum("card_version_status", ["draft", "published"]);

/** A task card: what stays the same across its versions. The content lives in its versions. */
export const taskCards = pgTable("task_cards", {
  id: uuid("id").primaryKey().defaultRandom(),
  // The instructor who owns the card: told when a new revision touches the pages it cites.
  ownerId: uuid("owner_id").references(() => users.id, { onDelete: "set null" }),
  duplicatedFrom: uuid("duplicated_from").references((): AnyPgColumn => taskCards.id, { onDelete: "set null" }),
  archivedAt: timestamp("archived_at", { withTimezone: true }),
  ...timestamps,
});

/** Instructors the owner lets edit, publish and archive the card beside them. */
export const cardCoauthors = pgTable(
  "card_coauthors",
  {
    cardId: uuid("card_id")
      .notNull()
      .references(() => taskCards.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    ...timestamps,
  },
  (t) => [primaryKey({ columns: [t.cardId, t.userId] }), index("card_coauthors_user_idx").on(t.userId)],
);

/**
 * One version of a card. A draft changes freely; a published version is frozen: a trigger in
 * db/migrations/0004_task_cards.sql refuses any update or delete of it and of its citations.
 */
export const taskCardVersions = pgTable(
  "task_card_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    cardId: uuid("card_id")
      .notNull()
      .references(() => taskCards.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    status: cardVersionStatus("status").notNull().default("draft"),
    title: text("title").notNull(),
    applicability: text("applicability")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    ataChapter: text("ata_chapter").notNull().default(""),
    subjectId: uuid("subject_id").references(() => curriculumSubjects.id, { onDelete: "restrict" }),
    estimatedMinutes: integer("estimated_minutes"),
    tools: text("tools")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    consumables: text("consumables")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    protectiveEquipment: text("protective_equipment")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    // The ordered steps, as validated by lib/domain/validation/cards.ts (stepSchema).
    steps: jsonb("steps")
      .notNull()
      .default(sql`'[]'::jsonb`),
    // Bumped on every save of a draft: a save made from an older copy is refused (409), so two
    // editors never overwrite each other without knowing.
    editCount: integer("edit_count").notNull().default(0),
    createdBy: uuid("created_by").references(() => users.id, { onDelete: "set null" }),
    publishedAt: timestamp("published_at", { withTimezone: true }),
    publishedBy: uuid("published_by").references(() => users.id, { onDelete: "set null" }),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("task_card_versions_card_number_key").on(t.cardId, t.number),
    // At most one draft per card.
    uniqueIndex("task_card_versions_one_draft_key")
      .on(t.cardId)
      .where(sql`status = 'draft'`),
    index("task_card_versions_subject_idx").on(t.subjectId),
  ],
);

/**
 * The manual pages a version's steps cite, one row each, kept in step with the steps JSON: the
 * revision-impact check asks "which published cards cite page N of revision R" with an index.
 */
export const cardCitations = pgTable(
  "card_citations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    versionId: uuid("version_id")
      .notNull()
      .references(() => taskCardVersions.id, { onDelete: "cascade" }),
    stepId: uuid("step_id").notNull(),
    stepNumber: integer("step_number").notNull(),
    manualId: uuid("manual_id")
      .notNull()
      .references(() => manuals.id, { onDelete: "restrict" }),
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "restrict" }),
    pageNumber: integer("page_number").notNull(),
    quote: text("quote").notNull().default(""),
    ...timestamps,
  },
  (t) => [index("card_citations_revision_page_idx").on(t.revisionId, t.pageNumber), index("card_citations_version_idx").on(t.versionId)],
);

/** A ready revision compared page by page with the one before it (lib/domain/revisions/compare.ts). */
export const revisionComparisons = pgTable("revision_comparisons", {
  revisionId: uuid("revision_id")
    .primaryKey()
    .references(() => revisions.id, { onDelete: "cascade" }),
  previousRevisionId: uuid("previous_revision_id").references(() => revisions.id, { onDelete: "cascade" }),
  // [{ status, oldPage, newPage, similarity }] in the order of the new revision's pages.
  pages: jsonb("pages").notNull(),
  summary: jsonb("summary").notNull(),
  ...timestamps,
});

export const recheckStatus = pgEnum("recheck_status", ["changed", "moved", "removed"]);
export const recheckOutcome = pgEnum("recheck_outcome", ["open", "accepted", "relinked", "dropped"]);

/**
 * One citation of a published card that a new revision touched: the page changed, moved or went.
 * Open until the card's author accepts the suggested page, picks another, or drops the citation.
 */
export const citationRechecks = pgTable(
  "citation_rechecks",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revisionId: uuid("revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    previousRevisionId: uuid("previous_revision_id")
      .notNull()
      .references(() => revisions.id, { onDelete: "cascade" }),
    cardId: uuid("card_id")
      .notNull()
      .references(() => taskCards.id, { onDelete: "cascade" }),
    versionId: uuid("version_id")
      .notNull()
      .references(() => taskCardVersions.id, { onDelete: "cascade" }),
    stepId: uuid("step_id").notNull(),
    stepNumber: integer("step_number").notNull(),
    oldPage: integer("old_page").notNull(),
    status: recheckStatus("status").notNull(),
    suggestedPage: integer("suggested_page"),
    similarity: real("similarity").notNull().default(0),
    outcome: recheckOutcome("outcome").notNull().default("open"),
    chosenPage: integer("chosen_page"),
    resolvedBy: uuid("resolved_by").references(() => users.id, { onDelete: "set null" }),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    // The draft version the decision went into.
    resultVersionId: uuid("result_version_id").references(() => taskCardVersions.id, { onDelete: "set null" }),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("citation_rechecks_once_key").on(t.revisionId, t.versionId, t.stepId, t.oldPage),
    index("citation_rechecks_card_idx").on(t.cardId, t.outcome),
  ],
);

// ---------------------------------------------------------------- assignments, runs, sign-off

/** An instructor gives a published card version to a class or to students, with a due date. */
export const assignments = pgTable(
  "assignments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    cardId: uuid("card_id")
      .notNull()
      .references(() => taskCards.id, { onDelete: "restrict" }),
    // Pinned: a run always follows the version it was assigned, even after a newer one is published.
    versionId: uuid("version_id")
      .notNull()
      .references(() => taskCardVersions.id, { onDelete: "restrict" }),
    classId: uuid("class_id").references(() => classes.id, { onDelete: "set null" }),
    dueOn: date("due_on", { mode: "string" }),
    note: text("note").notNull().default(""),
    assignedBy: uuid("assigned_by").references(() => users.id, { onDelete: "set null" }),
    // Withdrawn, not deleted: runs not yet signed off leave the students' work and the queues,
    // their events stay, and signed-off runs stay in the records as they were.
    withdrawnAt: timestamp("withdrawn_at", { withTimezone: true }),
    withdrawnBy: uuid("withdrawn_by").references(() => users.id, { onDelete: "set null" }),
    withdrawReason: text("withdraw_reason").notNull().default(""),
    /** The hangar booking the card is done in: its asset is named on each run. */
    bookingId: uuid("booking_id").references((): AnyPgColumn => bookings.id, { onDelete: "restrict" }),
    ...timestamps,
  },
  (t) => [index("assignments_version_idx").on(t.versionId)],
);

export const runStatus = pgEnum("run_status", runStatuses);

/**
 * One student's run of an assignment. Its state is folded from run_events (lib/domain/runs/fold.ts);
 * `status` and the times here are a copy of the fold kept for lists and queues.
 */
export const runs = pgTable(
  "runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assignmentId: uuid("assignment_id")
      .notNull()
      .references(() => assignments.id, { onDelete: "restrict" }),
    studentId: uuid("student_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    versionId: uuid("version_id")
      .notNull()
      .references(() => taskCardVersions.id, { onDelete: "restrict" }),
    status: runStatus("status").notNull().default("not_started"),
    startedAt: timestamp("started_at", { withTimezone: true }),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    lastEventAt: timestamp("last_event_at", { withTimezone: true }),
    /** The inspection point the run waits at (done, not bought off), and when the student called for it. */
    waitingStepId: uuid("waiting_step_id"),
    calledAt: timestamp("called_at", { withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("runs_assignment_student_key").on(t.assignmentId, t.studentId),
    index("runs_student_idx").on(t.studentId, t.status),
    index("runs_status_idx").on(t.status),
  ],
);

/** What happened on a run, one row per event; the id is made on the cart, so a re-send is a no-op. */
export const runEvents = pgTable(
  "run_events",
  {
    id: uuid("id").primaryKey(),
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "restrict" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    type: text("type").notNull(),
    stepId: uuid("step_id"),
    payload: jsonb("payload")
      .notNull()
      .default(sql`'{}'::jsonb`),
    clientTime: timestamp("client_time", { withTimezone: true }).notNull(),
    serverTime: timestamp("server_time", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("run_events_run_idx").on(t.runId, t.clientTime)],
);

/** A photo of the work, stored through the object store; the id is made on the cart (idempotent upload). */
export const runPhotos = pgTable("run_photos", {
  id: uuid("id").primaryKey(),
  runId: uuid("run_id")
    .notNull()
    .references(() => runs.id, { onDelete: "restrict" }),
  stepId: uuid("step_id"),
  contentType: text("content_type").notNull(),
  bytes: integer("bytes").notNull(),
  uploadedBy: uuid("uploaded_by").references(() => users.id, { onDelete: "set null" }),
  ...timestamps,
});

/**
 * An instructor's sign-off of a run. Immutable: a trigger in db/migrations/0007_runs.sql refuses
 * any update or delete, and any run event written after it.
 */
export const signOffs = pgTable("sign_offs", {
  id: uuid("id").primaryKey().defaultRandom(),
  runId: uuid("run_id")
    .notNull()
    .unique()
    .references(() => runs.id, { onDelete: "restrict" }),
  instructorId: uuid("instructor_id")
    .notNull()
    .references(() => users.id, { onDelete: "restrict" }),
  signedAt: timestamp("signed_at", { withTimezone: true }).notNull().defaultNow(),
  versionId: uuid("version_id")
    .notNull()
    .references(() => taskCardVersions.id, { onDelete: "restrict" }),
  // [{ revisionId, manualTitle, label, pages }] as cited by the version when it was signed off.
  revisionsCited: jsonb("revisions_cited").notNull(),
  actualMinutes: integer("actual_minutes").notNull().default(0),
  comment: text("comment").notNull().default(""),
});

// The tool room (issue 19). Tools and kits are lent to students; a kit is counted back in tool by
// tool, and a tool not returned opens a hold that keeps the student's run from being handed in
// until an instructor clears it. A precision tool's calibration date decides whether a reading
// taken with it can be recorded.

export const toolKits = pgTable(
  "tool_kits",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    /** The number on the box and its label, such as K-03: what a scanner types. */
    number: text("number").notNull(),
    name: text("name").notNull(),
    location: text("location").notNull().default(""),
    ...timestamps,
  },
  (t) => [uniqueIndex("tool_kits_number_key").on(t.number)],
);

export const tools = pgTable(
  "tools",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    number: text("number").notNull(),
    description: text("description").notNull(),
    /** The kit it is kept in; null for a tool lent on its own. */
    kitId: uuid("kit_id").references(() => toolKits.id, { onDelete: "set null" }),
    /** A precision tool: recorded readings need it within calibration. */
    calibrated: boolean("calibrated").notNull().default(false),
    calibrationIntervalDays: integer("calibration_interval_days"),
    calibrationDueOn: date("calibration_due_on", { mode: "string" }),
    status: text("status").notNull().default("in_service"),
    outOfServiceReason: text("out_of_service_reason").notNull().default(""),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("tools_number_key").on(t.number),
    index("tools_kit_idx").on(t.kitId),
    check("tools_status", sql`${t.status} in ('in_service', 'out_of_service')`),
    check("tools_interval", sql`${t.calibrationIntervalDays} is null or ${t.calibrationIntervalDays} between 1 and 3660`),
  ],
);

/** A calibration as its certificate states it; the newest sets the tool's next due date. Never changed. */
export const toolCalibrations = pgTable(
  "tool_calibrations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    toolId: uuid("tool_id")
      .notNull()
      .references(() => tools.id, { onDelete: "restrict" }),
    calibratedOn: date("calibrated_on", { mode: "string" }).notNull(),
    calibratedBy: text("calibrated_by").notNull(),
    certificate: text("certificate").notNull(),
    nextDueOn: date("next_due_on", { mode: "string" }).notNull(),
    recordedBy: uuid("recorded_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("tool_calibrations_tool_idx").on(t.toolId, t.calibratedOn)],
);

/** A kit or a single tool lent to a student, for a run or for the day, until it is counted back in. */
export const toolCheckouts = pgTable(
  "tool_checkouts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    kitId: uuid("kit_id").references(() => toolKits.id, { onDelete: "restrict" }),
    toolId: uuid("tool_id").references(() => tools.id, { onDelete: "restrict" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    /** Team mates working with the same kit, named on the check-out; the student above answers for it. */
    teamNote: text("team_note").notNull().default(""),
    runId: uuid("run_id").references(() => runs.id, { onDelete: "restrict" }),
    /** The tools lent, listed when lent (a kit's contents at that moment). */
    toolIds: jsonb("tool_ids").$type<string[]>().notNull(),
    dueAt: timestamp("due_at", { withTimezone: true }).notNull(),
    checkedOutAt: timestamp("checked_out_at", { withTimezone: true }).notNull().defaultNow(),
    checkedOutBy: uuid("checked_out_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    returnedAt: timestamp("returned_at", { withTimezone: true }),
    returnedBy: uuid("returned_by").references(() => users.id, { onDelete: "restrict" }),
    overdueMailedAt: timestamp("overdue_mailed_at", { withTimezone: true }),
  },
  (t) => [
    index("tool_checkouts_user_idx").on(t.userId, t.returnedAt),
    index("tool_checkouts_open_idx")
      .on(t.dueAt)
      .where(sql`${t.returnedAt} is null`),
    check("tool_checkouts_what", sql`(${t.kitId} is null) <> (${t.toolId} is null)`),
  ],
);

/** A tool not counted back in: holds the student's run until an instructor says found or lost. */
export const toolHolds = pgTable(
  "tool_holds",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    checkoutId: uuid("checkout_id")
      .notNull()
      .references(() => toolCheckouts.id, { onDelete: "restrict" }),
    toolId: uuid("tool_id")
      .notNull()
      .references(() => tools.id, { onDelete: "restrict" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    runId: uuid("run_id").references(() => runs.id, { onDelete: "restrict" }),
    openedAt: timestamp("opened_at", { withTimezone: true }).notNull().defaultNow(),
    openedBy: uuid("opened_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    clearedAt: timestamp("cleared_at", { withTimezone: true }),
    clearedBy: uuid("cleared_by").references(() => users.id, { onDelete: "restrict" }),
    outcome: text("outcome"),
    note: text("note").notNull().default(""),
  },
  (t) => [
    index("tool_holds_open_idx")
      .on(t.userId)
      .where(sql`${t.clearedAt} is null`),
    check("tool_holds_outcome", sql`${t.outcome} is null or ${t.outcome} in ('found', 'lost')`),
    check("tool_holds_cleared", sql`(${t.clearedAt} is null) = (${t.outcome} is null)`),
  ],
);

// The mechanic certification standard (issue 20): the school's copy of its elements, imported
// from a CSV. An element is never deleted (cards and records point at its code); a later import
// updates its words.
export const standardElements = pgTable(
  "standard_elements",
  {
    code: text("code").primaryKey(),
    section: text("section").notNull(),
    areaLetter: text("area_letter").notNull(),
    areaTitle: text("area_title").notNull(),
    kind: text("kind").notNull(),
    number: integer("number").notNull(),
    title: text("title").notNull(),
    /** Seeded from the demo's excerpt (to be verified against the current standard), not imported by the school. */
    excerpt: boolean("excerpt").notNull().default(false),
    ...timestamps,
  },
  (t) => [check("standard_elements_kind", sql`${t.kind} in ('knowledge', 'risk', 'skill')`)],
);

/** A class's session on the timetable: when, how long, which section of the standard it counts to. */
export const classSessions = pgTable(
  "class_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    classId: uuid("class_id")
      .notNull()
      .references(() => classes.id, { onDelete: "restrict" }),
    startsAt: timestamp("starts_at", { withTimezone: true }).notNull(),
    minutes: integer("minutes").notNull(),
    section: text("section").notNull(),
    subject: text("subject").notNull(),
    createdBy: uuid("created_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    /** The register is closed: attendance changes only by a correction with its reason. */
    closedAt: timestamp("closed_at", { withTimezone: true }),
    closedBy: uuid("closed_by").references(() => users.id, { onDelete: "restrict" }),
  },
  (t) => [
    index("class_sessions_class_idx").on(t.classId, t.startsAt),
    check("class_sessions_minutes", sql`${t.minutes} between 1 and 720`),
    check("class_sessions_section", sql`${t.section} in ('General', 'Airframe', 'Powerplant')`),
  ],
);

/**
 * Attendance, one row per entry, never changed or removed (a trigger): the newest entry of a
 * student in a session counts, and an entry after the register closed carries why.
 */
export const attendanceEntries = pgTable(
  "attendance_entries",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => classSessions.id, { onDelete: "restrict" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    status: text("status").notNull(),
    minutes: integer("minutes").notNull(),
    /** Make-up work for a session missed: what, and the run it was done in when there is one. */
    makeup: text("makeup").notNull().default(""),
    makeupRunId: uuid("makeup_run_id").references(() => runs.id, { onDelete: "restrict" }),
    correctionReason: text("correction_reason").notNull().default(""),
    recordedBy: uuid("recorded_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("attendance_entries_session_idx").on(t.sessionId, t.userId, t.recordedAt),
    index("attendance_entries_user_idx").on(t.userId),
    check("attendance_entries_status", sql`${t.status} in ('present', 'late', 'absent', 'excused')`),
    check("attendance_entries_minutes", sql`${t.minutes} between 0 and 720`),
  ],
);

/**
 * The school's fleet: aircraft, engines, propellers and components the work is done on. The
 * identifier is the registration or the school's own number; assets are never deleted (runs and
 * findings name them), only put out of service.
 */
export const assets = pgTable(
  "assets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    identifier: text("identifier").notNull(),
    kind: text("kind").notNull(),
    model: text("model").notNull(),
    serial: text("serial").notNull().default(""),
    status: text("status").notNull().default("instructional"),
    statusReason: text("status_reason").notNull().default(""),
    location: text("location").notNull().default(""),
    /** Wingspan (or the widest dimension) in metres, checked against a place's width; null when not known. */
    spanMetres: real("span_metres"),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("assets_identifier_key").on(sql`lower(${t.identifier})`),
    check("assets_kind", sql`${t.kind} in ('aircraft', 'engine', 'propeller', 'component')`),
    check("assets_status", sql`${t.status} in ('airworthy', 'instructional', 'ground_run', 'out_of_service')`),
  ],
);

/**
 * What is installed on what (an engine on an airframe, a propeller on an engine), one row per
 * installation: the removal closes it. The run that did either is named when it came from a
 * signed-off run. Rows are never deleted; a trigger lets only the removal be written once.
 */
export const assetInstallations = pgTable(
  "asset_installations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assetId: uuid("asset_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    parentId: uuid("parent_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    position: text("position").notNull().default(""),
    installedAt: timestamp("installed_at", { withTimezone: true }).notNull().defaultNow(),
    installedBy: uuid("installed_by").references(() => users.id, { onDelete: "restrict" }),
    installedRunId: uuid("installed_run_id").references(() => runs.id, { onDelete: "restrict" }),
    removedAt: timestamp("removed_at", { withTimezone: true }),
    removedBy: uuid("removed_by").references(() => users.id, { onDelete: "restrict" }),
    removedRunId: uuid("removed_run_id").references(() => runs.id, { onDelete: "restrict" }),
  },
  (t) => [
    // An asset is on one thing at a time.
    uniqueIndex("asset_installations_current_key")
      .on(t.assetId)
      .where(sql`${t.removedAt} is null`),
    index("asset_installations_parent_idx").on(t.parentId),
    check("asset_installations_not_self", sql`${t.assetId} <> ${t.parentId}`),
  ],
);

/** The assets a run worked on, named at the cart; and the installation change the run makes, applied at sign-off. */
export const runAssets = pgTable(
  "run_assets",
  {
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "restrict" }),
    assetId: uuid("asset_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    namedBy: uuid("named_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    namedAt: timestamp("named_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.assetId] }), index("run_assets_asset_idx").on(t.assetId)],
);

export const runAssetChanges = pgTable(
  "run_asset_changes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    runId: uuid("run_id")
      .notNull()
      .references(() => runs.id, { onDelete: "restrict" }),
    action: text("action").notNull(),
    assetId: uuid("asset_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    parentId: uuid("parent_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    position: text("position").notNull().default(""),
    /** Set when the sign-off wrote it on the assets. */
    appliedAt: timestamp("applied_at", { withTimezone: true }),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("run_asset_changes_key").on(t.runId, t.assetId, t.action),
    check("run_asset_changes_action", sql`${t.action} in ('install', 'remove')`),
  ],
);

/** Places in the hangar: bays, engine stands, the NDT room, tie-downs; each takes some kinds of asset. */
export const places = pgTable(
  "places",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    name: text("name").notNull(),
    kind: text("kind").notNull(),
    takes: text("takes")
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    /** Widest span (metres) the place takes; null when any span fits. */
    maxSpanMetres: real("max_span_metres"),
    ...timestamps,
  },
  (t) => [
    uniqueIndex("places_name_key").on(sql`lower(${t.name})`),
    check("places_kind", sql`${t.kind} in ('bay', 'engine_stand', 'ndt_room', 'tie_down')`),
  ],
);

/**
 * An asset at a place for a time: a class's session on it, or a move in or out. Overlaps are
 * refused by the server under row locks of the asset and the place. A cancelled booking stays.
 */
export const bookings = pgTable(
  "bookings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assetId: uuid("asset_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    placeId: uuid("place_id")
      .notNull()
      .references(() => places.id, { onDelete: "restrict" }),
    classId: uuid("class_id").references(() => classes.id, { onDelete: "restrict" }),
    purpose: text("purpose").notNull().default("session"),
    note: text("note").notNull().default(""),
    startsAt: timestamp("starts_at", { withTimezone: true }).notNull(),
    endsAt: timestamp("ends_at", { withTimezone: true }).notNull(),
    createdBy: uuid("created_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    cancelledAt: timestamp("cancelled_at", { withTimezone: true }),
    cancelledBy: uuid("cancelled_by").references(() => users.id, { onDelete: "restrict" }),
    ...timestamps,
  },
  (t) => [
    index("bookings_asset_idx").on(t.assetId, t.startsAt),
    index("bookings_place_idx").on(t.placeId, t.startsAt),
    check("bookings_purpose", sql`${t.purpose} in ('session', 'move_in', 'move_out')`),
    check("bookings_order", sql`${t.endsAt} > ${t.startsAt}`),
  ],
);

/**
 * What a student (or instructor) found on an asset: a crack, a leak, a worn part. Filed at the cart
 * (its id made there, so a re-send is a no-op), decided and closed by an instructor.
 */
export const findings = pgTable(
  "findings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    assetId: uuid("asset_id")
      .notNull()
      .references(() => assets.id, { onDelete: "restrict" }),
    runId: uuid("run_id").references(() => runs.id, { onDelete: "restrict" }),
    stepId: uuid("step_id"),
    text: text("text").notNull(),
    photoKey: text("photo_key"),
    reportedBy: uuid("reported_by")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    /** When it was found, on the cart's clock held to the receipt window; and when the server got it. */
    foundAt: timestamp("found_at", { withTimezone: true }).notNull(),
    receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
    decision: text("decision"),
    decisionNote: text("decision_note").notNull().default(""),
    newAssignmentId: uuid("new_assignment_id").references(() => assignments.id, { onDelete: "restrict" }),
    closedBy: uuid("closed_by").references(() => users.id, { onDelete: "restrict" }),
    closedAt: timestamp("closed_at", { withTimezone: true }),
  },
  (t) => [
    index("findings_asset_idx").on(t.assetId, t.closedAt),
    index("findings_open_idx")
      .on(t.receivedAt)
      .where(sql`${t.closedAt} is null`),
    check("findings_decision", sql`${t.decision} is null or ${t.decision} in ('fixed_in_run', 'new_card', 'deferred', 'out_of_service')`),
  ],
);
