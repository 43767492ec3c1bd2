import { sql } from "drizzle-orm";
import {
  index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid, date,
} from "drizzle-orm/pg-core";

export const userRole = pgEnum("user_role", ["student", "instructor", "librarian", "admin"]);
export const userStatus = pgEnum("user_status", ["invited", "active", "deactivated"]);
export const tokenPurpose = pgEnum("token_purpose", ["invitation", "password_reset"]);

const timestamps = {
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow().$onUpdate(() => new Date()),
};

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
    classId: uuid("class_id").notNull().references(() => classes.id, { onDelete: "cascade" }),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    ...timestamps,
  },
  (t) => [primaryKey({ columns: [t.classId, t.userId] }), index("class_members_user_idx").on(t.userId)],
);

export const accountTokens = pgTable(
  "account_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: uuid("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    purpose: tokenPurpose("purpose").notNull(),
    // Only the SHA-256 of the token is stored: a copy of the database opens no accounts.
    tokenHash: text("token_hash").notNull(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    ...timestamps,
  },
  (t) => [uniqueIndex("account_tokens_hash_key").on(t.tokenHash), index("account_tokens_user_idx").on(t.userId)],
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
    details: jsonb("details").$type<Record<string, unknown>>().notNull().default(sql`'{}'::jsonb`),
    ...timestamps,
  },
  (t) => [index("audit_events_created_idx").on(t.createdAt)],
);

export type User = typeof users.$inferSelect;
export type NewUser = typeof users.$inferInsert;
export type Class = typeof classes.$inferSelect;
export type NewClass = typeof classes.$inferInsert;
export type ClassMember = typeof classMembers.$inferSelect;
export type AccountToken = typeof accountTokens.$inferSelect;
export type AuditEvent = typeof auditEvents.$inferSelect;
