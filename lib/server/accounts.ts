import "server-only";
import { and, asc, eq, gt, inArray, isNull, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { accountTokens, classes, classMembers, users } from "@/db/schema";
import type { Tx } from "@/db";
import { recordAudit } from "@/lib/server/audit";
import { hashPassword } from "@/lib/server/auth/password";
import { roleLabels, type Actor, type Role } from "@/lib/domain/access/permissions";
import { createLinkToken, hashLinkToken, tokenLifetimeSeconds } from "@/lib/server/auth/tokens";
import { getEnv } from "@/lib/server/env";
import { AppError } from "@/lib/domain/errors";
import { queueMail } from "@/lib/server/mail";
import { invitationMail, passwordResetMail } from "@/lib/server/mail/messages";

/** What an account looks like outside this module: never a hash or a token. */
const publicColumns = {
  id: users.id,
  email: users.email,
  name: users.name,
  role: users.role,
  status: users.status,
  lastSignInAt: users.lastSignInAt,
  createdAt: users.createdAt,
};

export async function listUsers() {
  const rows = await getDb()
    .select({
      ...publicColumns,
      classNames: sql<
        string[]
      >`coalesce(array_agg(${classes.name} order by ${classes.name}) filter (where ${classes.id} is not null), '{}')`,
    })
    .from(users)
    .leftJoin(classMembers, eq(classMembers.userId, users.id))
    .leftJoin(classes, eq(classes.id, classMembers.classId))
    .groupBy(users.id)
    .orderBy(asc(users.name));
  return rows;
}
export type AccountRow = Awaited<ReturnType<typeof listUsers>>[number];

/** Active instructors and admins by name: whom a card's owner may name as co-authors. */
export async function listColleagues(): Promise<{ id: string; name: string }[]> {
  return getDb()
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(inArray(users.role, ["instructor", "admin"]), eq(users.status, "active")))
    .orderBy(asc(users.name));
}

export async function getUserById({ id }: { id: string }) {
  const [row] = await getDb().select(publicColumns).from(users).where(eq(users.id, id)).limit(1);
  if (!row) throw new AppError("not_found", "That account was not found.");
  return row;
}

async function issueToken(tx: Tx, userId: string, purpose: "invitation" | "password_reset") {
  const { token, hash } = createLinkToken();
  const expiresAt = new Date(Date.now() + tokenLifetimeSeconds[purpose] * 1000);
  // A new link replaces the older ones of the same purpose.
  await tx
    .update(accountTokens)
    .set({ usedAt: sql`now()` })
    .where(and(eq(accountTokens.userId, userId), eq(accountTokens.purpose, purpose), isNull(accountTokens.usedAt)));
  await tx.insert(accountTokens).values({ userId, purpose, tokenHash: hash, expiresAt });
  return `${getEnv().APP_URL}/set-password/${token}`;
}

export async function createUser({
  actor,
  actorName,
  input,
}: {
  actor: Actor;
  actorName: string;
  input: { name: string; email: string; role: Role; password?: string };
}) {
  const password = input.password ? await hashPassword(input.password) : null;
  const db = getDb();
  const { user, link } = await db.transaction(async (tx) => {
    const [existing] = await tx.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1);
    if (existing) throw new AppError("conflict", `An account for ${input.email} already exists.`, { fields: { email: "Already in use." } });
    const [created] = await tx
      .insert(users)
      .values({
        email: input.email,
        name: input.name,
        role: input.role,
        status: password ? "active" : "invited",
        passwordHash: password,
      })
      .returning(publicColumns);
    if (!created) throw new AppError("internal");
    const invitation = password ? null : await issueToken(tx, created.id, "invitation");
    await recordAudit(tx, {
      actorId: actor.id,
      action: password ? "account.created" : "account.invited",
      subjectType: "user",
      subjectId: created.id,
      details: { email: created.email, role: created.role },
    });
    return { user: created, link: invitation };
  });
  if (link) {
    await queueMail(invitationMail({ to: user.email, name: user.name, invitedBy: actorName, link, role: roleLabels[user.role] }));
  }
  return user;
}

export async function resendInvitation({ actor, actorName, id }: { actor: Actor; actorName: string; id: string }) {
  const db = getDb();
  const { user, link } = await db.transaction(async (tx) => {
    const [row] = await tx.select(publicColumns).from(users).where(eq(users.id, id)).for("update");
    if (!row) throw new AppError("not_found", "That account was not found.");
    if (row.status !== "invited") {
      throw new AppError("conflict", "This account has already chosen a password; send a password reset instead.");
    }
    const invitation = await issueToken(tx, row.id, "invitation");
    await recordAudit(tx, { actorId: actor.id, action: "account.invitation_resent", subjectType: "user", subjectId: row.id });
    return { user: row, link: invitation };
  });
  await queueMail(invitationMail({ to: user.email, name: user.name, invitedBy: actorName, link, role: roleLabels[user.role] }));
  return user;
}

export async function updateUser({
  actor,
  id,
  changes,
}: {
  actor: Actor;
  id: string;
  changes: { name?: string; role?: Role; status?: "active" | "deactivated" };
}) {
  return getDb().transaction(async (tx) => {
    const [row] = await tx
      .select({ ...publicColumns, passwordHash: users.passwordHash })
      .from(users)
      .where(eq(users.id, id))
      .for("update");
    if (!row) throw new AppError("not_found", "That account was not found.");
    if (row.id === actor.id && changes.role && changes.role !== row.role) {
      throw new AppError("conflict", "You cannot change your own role; ask another admin.");
    }
    if (row.id === actor.id && changes.status === "deactivated") {
      throw new AppError("conflict", "You cannot deactivate your own account.");
    }
    // Reactivating an account that never chose a password puts it back to "invited".
    const status =
      changes.status === undefined ? row.status : changes.status === "active" && !row.passwordHash ? "invited" : changes.status;
    const roleChanged = changes.role !== undefined && changes.role !== row.role;
    const statusChanged = status !== row.status;
    const [updated] = await tx
      .update(users)
      .set({
        name: changes.name ?? row.name,
        role: changes.role ?? row.role,
        status,
        // Ends the sessions of a deactivated or re-roled account.
        ...(roleChanged || statusChanged ? { sessionVersion: sql`${users.sessionVersion} + 1` } : {}),
      })
      .where(eq(users.id, id))
      .returning(publicColumns);
    if (!updated) throw new AppError("internal");
    await recordAudit(tx, {
      actorId: actor.id,
      action: "account.updated",
      subjectType: "user",
      subjectId: id,
      details: {
        ...(changes.name && changes.name !== row.name ? { name: [row.name, changes.name] } : {}),
        ...(roleChanged ? { role: [row.role, changes.role] } : {}),
        ...(statusChanged ? { status: [row.status, status] } : {}),
      },
    });
    return updated;
  });
}

/** Always succeeds from the caller's view; a mail goes only to an existing, usable account. */
export async function requestPasswordReset({ email }: { email: string }): Promise<void> {
  const db = getDb();
  const result = await db.transaction(async (tx) => {
    const [row] = await tx
      .select({ id: users.id, name: users.name, email: users.email, status: users.status })
      .from(users)
      .where(eq(users.email, email))
      .limit(1);
    if (!row || row.status === "deactivated") return null;
    // An invited account that asks for a reset gets a fresh invitation link instead.
    const purpose = row.status === "invited" ? "invitation" : "password_reset";
    const link = await issueToken(tx, row.id, purpose);
    await recordAudit(tx, { actorId: null, action: "account.password_reset_requested", subjectType: "user", subjectId: row.id });
    return { row, link };
  });
  if (result) await queueMail(passwordResetMail({ to: result.row.email, name: result.row.name, link: result.link }));
}

export async function describeLinkToken({ token }: { token: string }) {
  const [row] = await getDb()
    .select({ purpose: accountTokens.purpose, name: users.name, email: users.email })
    .from(accountTokens)
    .innerJoin(users, eq(users.id, accountTokens.userId))
    .where(
      and(
        eq(accountTokens.tokenHash, hashLinkToken(token)),
        isNull(accountTokens.usedAt),
        gt(accountTokens.expiresAt, sql`now()`),
        sql`${users.status} <> 'deactivated'`,
      ),
    )
    .limit(1);
  return row ?? null;
}

const badLink = "This link has expired or was already used. Ask for a new one from the sign-in page.";

export async function setPasswordWithToken({ token, password }: { token: string; password: string }) {
  const passwordHash = await hashPassword(password);
  return getDb().transaction(async (tx) => {
    const [found] = await tx
      .select({
        id: accountTokens.id,
        userId: accountTokens.userId,
        purpose: accountTokens.purpose,
        expiresAt: accountTokens.expiresAt,
        usedAt: accountTokens.usedAt,
      })
      .from(accountTokens)
      .where(eq(accountTokens.tokenHash, hashLinkToken(token)))
      .for("update");
    if (!found || found.usedAt || found.expiresAt.getTime() <= Date.now()) {
      throw new AppError("invalid", badLink, { fields: { token: badLink } });
    }
    const [user] = await tx.select({ status: users.status }).from(users).where(eq(users.id, found.userId)).for("update");
    if (!user || user.status === "deactivated") throw new AppError("invalid", badLink, { fields: { token: badLink } });
    await tx
      .update(accountTokens)
      .set({ usedAt: sql`now()` })
      .where(and(eq(accountTokens.userId, found.userId), isNull(accountTokens.usedAt)));
    const [updated] = await tx
      .update(users)
      .set({ passwordHash, status: "active", sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, found.userId))
      .returning({ id: users.id, email: users.email });
    await recordAudit(tx, {
      actorId: found.userId,
      action: found.purpose === "invitation" ? "account.invitation_accepted" : "account.password_reset",
      subjectType: "user",
      subjectId: found.userId,
    });
    return updated;
  });
}
