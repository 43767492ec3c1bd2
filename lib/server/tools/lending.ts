// Lending: a kit or a tool checked out to a student (for a run or for the day), counted back in
// tool by tool. A tool not counted in opens a hold: the student's run (the one it was lent for, or
// any open run of theirs when it was lent for the day) cannot be handed in until an instructor
// says found, or lost with a note. Rows are locked kit first, then tools, so two desks lending
// the same thing at once cannot both succeed.
import "server-only";
import { and, asc, desc, eq, inArray, isNull, lt, or, sql } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { getDb, type Db, type Tx } from "@/db";
import { assignments, runs, taskCardVersions, toolCheckouts, toolHolds, toolKits, tools, users } from "@/db/schema";
import type { CheckoutDto, RunToolsDto, ToolHoldDto } from "@/lib/contracts/tools";
import { isUuid } from "@/lib/contracts/endpoint";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import { dateTimeIn } from "@/lib/domain/time";
import {
  defaultLoanHours,
  isOverdue,
  readingDay,
  toolLineStatuses,
  toolRefusal,
  type HoldOutcome,
  type ToolStatus,
} from "@/lib/domain/tools/tool-room";
import type { checkoutSchema, clearHoldSchema } from "@/lib/domain/validation/tools";
import type { z } from "zod";
import { recordAudit } from "@/lib/server/audit";
import { getEnv } from "@/lib/server/env";
import { queueMail } from "@/lib/server/mail";
import { toolsOverdueMail } from "@/lib/server/mail/messages";
import { readsRecordOf } from "@/lib/server/runs/scope";
import { schoolTimeZone } from "@/lib/server/settings";

const checkedOutBy = alias(users, "checked_out_by_user");
const maxLoanDays = 30;

const checkoutNotFound = () => new AppError("not_found", "That check-out was not found.");
const holdNotFound = () => new AppError("not_found", "That hold was not found.");

/** Open check-outs holding any of these tools or this kit: what stands in the way of lending them again. */
async function openLoansOf(tx: Tx, toolIds: string[], kitId: string | null) {
  const held = toolIds.length
    ? sql`${toolCheckouts.toolIds} ?| array[${sql.join(
        toolIds.map((id) => sql`${id}`),
        sql`, `,
      )}]::text[]`
    : sql`false`;
  return tx
    .select({ id: toolCheckouts.id, toolIds: toolCheckouts.toolIds, userName: users.name, kitId: toolCheckouts.kitId })
    .from(toolCheckouts)
    .innerJoin(users, eq(users.id, toolCheckouts.userId))
    .where(and(isNull(toolCheckouts.returnedAt), or(held, kitId ? eq(toolCheckouts.kitId, kitId) : sql`false`)));
}

export async function createCheckout({ actor, input }: { actor: Actor; input: z.output<typeof checkoutSchema> }): Promise<CheckoutDto> {
  const id = await getDb().transaction(async (tx) => {
    const [student] = await tx.select().from(users).where(eq(users.id, input.userId));
    if (!student || student.role !== "student" || student.status !== "active")
      throw new AppError("invalid", "Tools are lent to an active student.", { fields: { userId: "Choose an active student." } });
    if (input.runId) {
      const [run] = await tx
        .select({ studentId: runs.studentId, status: runs.status, withdrawnAt: assignments.withdrawnAt })
        .from(runs)
        .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
        .where(eq(runs.id, input.runId));
      if (!run || run.studentId !== student.id)
        throw new AppError("invalid", "That run is not this student's.", {
          fields: { runId: "Choose one of the student's runs, or none." },
        });
      if (run.status === "signed_off" || run.withdrawnAt)
        throw new AppError("invalid", "That run is closed: lend for the day instead.", {
          fields: { runId: "Choose an open run, or none." },
        });
    }
    const now = Date.now();
    const dueAt = input.dueAt ? new Date(input.dueAt) : new Date(now + defaultLoanHours * 3_600_000);
    if (dueAt.getTime() <= now || dueAt.getTime() > now + maxLoanDays * 86_400_000)
      throw new AppError("invalid", `A loan is due back after now and within ${maxLoanDays} days.`, {
        fields: { dueAt: "Give a due time from now to 30 days ahead." },
      });

    let lent: { id: string; number: string }[];
    let kitId: string | null = null;
    if (input.kitId) {
      const [kit] = await tx.select().from(toolKits).where(eq(toolKits.id, input.kitId)).for("update");
      if (!kit) throw new AppError("not_found", "That kit was not found.");
      kitId = kit.id;
      const contents = await tx.select().from(tools).where(eq(tools.kitId, kit.id)).orderBy(asc(tools.number)).for("update");
      // An out-of-service tool stays on the shelf: it is not lent, so it is not counted back in.
      lent = contents.filter((t) => t.status === "in_service");
      if (!lent.length) throw new AppError("conflict", `Kit ${kit.number} has no tool in service to lend.`);
    } else {
      const [tool] = await tx.select().from(tools).where(eq(tools.id, input.toolId!));
      if (!tool) throw new AppError("not_found", "That tool was not found.");
      if (tool.kitId) await tx.select({ id: toolKits.id }).from(toolKits).where(eq(toolKits.id, tool.kitId)).for("update");
      await tx.select({ id: tools.id }).from(tools).where(eq(tools.id, tool.id)).for("update");
      if (tool.status === "out_of_service")
        throw new AppError(
          "conflict",
          `${tool.description} ${tool.number} is out of service${tool.outOfServiceReason ? ` (${tool.outOfServiceReason})` : ""}: it cannot be lent.`,
        );
      lent = [tool];
    }
    const busy = await openLoansOf(
      tx,
      lent.map((t) => t.id),
      kitId,
    );
    if (busy.length) {
      const taken = lent.filter((t) => busy.some((b) => b.toolIds.includes(t.id))).map((t) => t.number);
      const who = busy.map((b) => b.userName).join(", ");
      throw new AppError(
        "conflict",
        kitId && busy.some((b) => b.kitId === kitId)
          ? `That kit is out to ${who}: count it back in first.`
          : `${taken.join(", ")} ${taken.length === 1 ? "is" : "are"} out to ${who}: count ${taken.length === 1 ? "it" : "them"} back in first.`,
      );
    }
    const [row] = await tx
      .insert(toolCheckouts)
      .values({
        kitId,
        toolId: input.kitId ? null : input.toolId,
        userId: student.id,
        teamNote: input.teamNote,
        runId: input.runId,
        toolIds: lent.map((t) => t.id),
        dueAt,
        checkedOutBy: actor.id,
      })
      .returning({ id: toolCheckouts.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "tool.checked_out",
      subjectType: "checkout",
      subjectId: row!.id,
      details: { studentId: student.id, tools: lent.map((t) => t.number), runId: input.runId },
    });
    return row!.id;
  });
  return getCheckout(id);
}

async function checkoutRows(db: Db | Tx, where: ReturnType<typeof and>, limit = 1000) {
  const rows = await db
    .select({
      c: toolCheckouts,
      userName: users.name,
      byName: checkedOutBy.name,
      kitNumber: toolKits.number,
      kitName: toolKits.name,
      runTitle: taskCardVersions.title,
    })
    .from(toolCheckouts)
    .innerJoin(users, eq(users.id, toolCheckouts.userId))
    .innerJoin(checkedOutBy, eq(checkedOutBy.id, toolCheckouts.checkedOutBy))
    .leftJoin(toolKits, eq(toolKits.id, toolCheckouts.kitId))
    .leftJoin(runs, eq(runs.id, toolCheckouts.runId))
    .leftJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .where(where)
    .orderBy(asc(toolCheckouts.dueAt))
    .limit(limit);
  const ids = [...new Set(rows.flatMap((r) => r.c.toolIds))];
  const named = ids.length
    ? await db.select({ id: tools.id, number: tools.number, description: tools.description }).from(tools).where(inArray(tools.id, ids))
    : [];
  const byId = new Map(named.map((t) => [t.id, t]));
  const now = new Date();
  return rows.map(({ c, userName, byName, kitNumber, kitName, runTitle }): CheckoutDto => {
    const lent = c.toolIds.map((id) => byId.get(id)).filter((t): t is NonNullable<typeof t> => !!t);
    return {
      id: c.id,
      kit: c.kitId ? { id: c.kitId, number: kitNumber!, name: kitName! } : null,
      tool: c.toolId ? (lent[0] ?? null) : null,
      tools: lent,
      userId: c.userId,
      userName,
      teamNote: c.teamNote,
      runId: c.runId,
      runTitle,
      dueAt: c.dueAt.toISOString(),
      checkedOutAt: c.checkedOutAt.toISOString(),
      checkedOutByName: byName,
      returnedAt: c.returnedAt?.toISOString() ?? null,
      overdue: isOverdue(c, now),
    };
  });
}

export async function getCheckout(id: string, db: Db | Tx = getDb()): Promise<CheckoutDto> {
  const [row] = await checkoutRows(db, and(eq(toolCheckouts.id, id)));
  if (!row) throw checkoutNotFound();
  return row;
}

/** The tool room sees every loan; anyone else their own. */
export async function listCheckouts({
  actor,
  status = "open",
}: {
  actor: Actor;
  status?: "open" | "overdue" | "all";
}): Promise<CheckoutDto[]> {
  return checkoutRows(
    getDb(),
    and(
      can(actor, "tools:lend") ? undefined : eq(toolCheckouts.userId, actor.id),
      status === "all" ? undefined : isNull(toolCheckouts.returnedAt),
      status === "overdue" ? lt(toolCheckouts.dueAt, new Date()) : undefined,
    ),
    status === "all" ? 500 : 1000,
  );
}

/** Counts a loan back in. Every tool named missing opens a hold; the rest are back on the shelf. */
export async function returnCheckout({
  actor,
  id,
  missingToolIds,
}: {
  actor: Actor;
  id: string;
  missingToolIds: string[];
}): Promise<{ checkout: CheckoutDto; holds: ToolHoldDto[] }> {
  const holdIds = await getDb().transaction(async (tx) => {
    const [checkout] = await tx.select().from(toolCheckouts).where(eq(toolCheckouts.id, id)).for("update");
    if (!checkout) throw checkoutNotFound();
    if (checkout.returnedAt) throw new AppError("conflict", "This loan was already counted back in.");
    const missing = [...new Set(missingToolIds)];
    const strangers = missing.filter((t) => !checkout.toolIds.includes(t));
    if (strangers.length)
      throw new AppError("invalid", "A tool named missing was not lent on this check-out.", {
        fields: { missingToolIds: "Name only tools of this loan." },
      });
    await tx.update(toolCheckouts).set({ returnedAt: new Date(), returnedBy: actor.id }).where(eq(toolCheckouts.id, id));
    const opened = missing.length
      ? await tx
          .insert(toolHolds)
          .values(missing.map((toolId) => ({ checkoutId: id, toolId, userId: checkout.userId, runId: checkout.runId, openedBy: actor.id })))
          .returning({ id: toolHolds.id })
      : [];
    const numbers = missing.length ? await tx.select({ number: tools.number }).from(tools).where(inArray(tools.id, missing)) : [];
    await recordAudit(tx, {
      actorId: actor.id,
      action: missing.length ? "tool.missing" : "tool.checked_in",
      subjectType: "checkout",
      subjectId: id,
      details: { studentId: checkout.userId, missing: numbers.map((n) => n.number), runId: checkout.runId },
    });
    return opened.map((h) => h.id);
  });
  const checkout = await getCheckout(id);
  const holds = holdIds.length ? (await holdRows(getDb(), inArray(toolHolds.id, holdIds))).filter(Boolean) : [];
  return { checkout, holds };
}

const openedBy = alias(users, "hold_opened_by");
const clearedBy = alias(users, "hold_cleared_by");

async function holdRows(db: Db | Tx, where: ReturnType<typeof and>): Promise<ToolHoldDto[]> {
  const rows = await db
    .select({
      h: toolHolds,
      toolNumber: tools.number,
      toolDescription: tools.description,
      userName: users.name,
      openedByName: openedBy.name,
      clearedByName: clearedBy.name,
      runTitle: taskCardVersions.title,
    })
    .from(toolHolds)
    .innerJoin(tools, eq(tools.id, toolHolds.toolId))
    .innerJoin(users, eq(users.id, toolHolds.userId))
    .innerJoin(openedBy, eq(openedBy.id, toolHolds.openedBy))
    .leftJoin(clearedBy, eq(clearedBy.id, toolHolds.clearedBy))
    .leftJoin(runs, eq(runs.id, toolHolds.runId))
    .leftJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .where(where)
    .orderBy(desc(toolHolds.openedAt))
    .limit(500);
  return rows.map(({ h, toolNumber, toolDescription, userName, openedByName, clearedByName, runTitle }) => ({
    id: h.id,
    checkoutId: h.checkoutId,
    tool: { id: h.toolId, number: toolNumber, description: toolDescription },
    userId: h.userId,
    userName,
    runId: h.runId,
    runTitle,
    openedAt: h.openedAt.toISOString(),
    openedByName,
    clearedAt: h.clearedAt?.toISOString() ?? null,
    clearedByName: clearedByName ?? null,
    outcome: (h.outcome as HoldOutcome | null) ?? null,
    note: h.note,
  }));
}

/** Students of the actor's classes, as for records (lib/server/runs/scope.ts). */
const studentsOf = (actor: Actor) =>
  sql`${toolHolds.userId} in (select s.user_id from class_members s join class_members me on me.class_id = s.class_id where me.user_id = ${actor.id})`;

/** Open holds (or all, newest first): the tool room and admins see all, instructors their students', students their own. */
export async function listHolds({ actor, open = true }: { actor: Actor; open?: boolean }): Promise<ToolHoldDto[]> {
  const scope =
    can(actor, "tools:lend") || can(actor, "classes:view-all")
      ? undefined
      : can(actor, "tools:clear-holds")
        ? studentsOf(actor)
        : eq(toolHolds.userId, actor.id);
  return holdRows(getDb(), and(scope, open ? isNull(toolHolds.clearedAt) : undefined));
}

/**
 * An instructor of the student says what became of a missing tool. A lost tool is taken out of
 * service with the note, so it is never lent or used for a reading again until it is found.
 */
export async function clearHold({
  actor,
  id,
  input,
}: {
  actor: Actor;
  id: string;
  input: z.output<typeof clearHoldSchema>;
}): Promise<ToolHoldDto> {
  await getDb().transaction(async (tx) => {
    const [hold] = await tx.select().from(toolHolds).where(eq(toolHolds.id, id)).for("update");
    if (!hold || hold.userId === actor.id || !(await readsRecordOf(tx, actor, hold.userId))) throw holdNotFound();
    if (hold.clearedAt) throw new AppError("conflict", "This hold was already cleared.");
    await tx
      .update(toolHolds)
      .set({ clearedAt: new Date(), clearedBy: actor.id, outcome: input.outcome, note: input.note })
      .where(eq(toolHolds.id, id));
    if (input.outcome === "lost")
      await tx
        .update(tools)
        .set({ status: "out_of_service", outOfServiceReason: `Lost: ${input.note}`.slice(0, 300), updatedAt: new Date() })
        .where(eq(tools.id, hold.toolId));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "tool.hold_cleared",
      subjectType: "tool_hold",
      subjectId: id,
      details: { outcome: input.outcome, note: input.note, studentId: hold.userId, toolId: hold.toolId },
    });
  });
  const [hold] = await holdRows(getDb(), eq(toolHolds.id, id));
  return hold!;
}

/** Open holds that keep this run from being handed in: lent for it, or lent to its student for the day. */
export async function holdsOnRun(db: Db | Tx, run: { id: string; studentId: string }): Promise<ToolHoldDto[]> {
  return holdRows(
    db,
    and(isNull(toolHolds.clearedAt), eq(toolHolds.userId, run.studentId), or(eq(toolHolds.runId, run.id), isNull(toolHolds.runId))),
  );
}

/** The 409 a hand-in meets while a hold is open, naming the tools. */
export function handInHeld(holds: readonly ToolHoldDto[]): AppError {
  const named = holds.map((h) => `${h.tool.description} ${h.tool.number}`).join(", ");
  return new AppError(
    "conflict",
    `${named} ${holds.length === 1 ? "was" : "were"} not counted back in at the tool room: the run cannot be handed in until your instructor clears the missing-tool hold.`,
  );
}

/** What the student has out now, each tool once (a tool in a lent kit included). */
async function toolsOutTo(db: Db | Tx, studentId: string) {
  const loans = await db
    .select({ toolIds: toolCheckouts.toolIds, kitNumber: toolKits.number })
    .from(toolCheckouts)
    .leftJoin(toolKits, eq(toolKits.id, toolCheckouts.kitId))
    .where(and(eq(toolCheckouts.userId, studentId), isNull(toolCheckouts.returnedAt)));
  const ids = [...new Set(loans.flatMap((l) => l.toolIds))];
  const rows = ids.length
    ? await db
        .select({ tool: tools, kitNumber: toolKits.number })
        .from(tools)
        .leftJoin(toolKits, eq(toolKits.id, tools.kitId))
        .where(inArray(tools.id, ids))
        .orderBy(asc(tools.number))
    : [];
  return { rows, kitNumbers: new Set(loans.map((l) => l.kitNumber).filter((n): n is string => !!n)) };
}

/** The run screen's tools: what the student has out, the card's tool lines against it, and open holds. */
export async function runTools(db: Db | Tx, run: { id: string; studentId: string }, lines: readonly string[]): Promise<RunToolsDto> {
  const [{ rows, kitNumbers }, holds] = await Promise.all([toolsOutTo(db, run.studentId), holdsOnRun(db, run)]);
  return {
    checkedOut: rows.map(({ tool, kitNumber }) => ({
      id: tool.id,
      number: tool.number,
      description: tool.description,
      calibrated: tool.calibrated,
      calibrationDueOn: tool.calibrationDueOn,
      status: tool.status as ToolStatus,
      kitNumber,
    })),
    lines: toolLineStatuses(lines, { toolNumbers: new Set(rows.map((r) => r.tool.number)), kitNumbers }),
    holds,
  };
}

/**
 * Readings taken with a tool (`payload.toolId`), and readings of steps that need a calibrated
 * tool, are checked here before they are stored: a 422 naming the tool when it was out of service
 * or past its calibration on the day the reading counts as taken (the cart's stamp, believed only
 * inside what the server saw). The stored payload gets the tool's number from the tool room, not
 * from the cart.
 */
export async function checkReadingTools<
  E extends { type: string; stepId: string | null; clientTime: string; payload: Record<string, unknown> },
>(db: Db | Tx, events: E[], steps: readonly { id: string; calibratedTool?: boolean }[], receivedAt: Date): Promise<E[]> {
  const readings = events.filter((e) => e.type === "value.recorded");
  if (!readings.length) return events;
  const needs = new Map(steps.map((s, i) => [s.id, { number: i + 1, calibrated: !!s.calibratedTool }]));
  const ids = [...new Set(readings.map((e) => e.payload.toolId).filter((v): v is string => typeof v === "string"))];
  const named = ids.filter(isUuid).map((id) => id.toLowerCase());
  const found = named.length ? await db.select().from(tools).where(inArray(tools.id, named)) : [];
  const byId = new Map(found.map((t) => [t.id, t]));
  const zone = await schoolTimeZone();
  return events.map((e) => {
    if (e.type !== "value.recorded") return e;
    const step = e.stepId ? needs.get(e.stepId) : undefined;
    const toolId = e.payload.toolId;
    if (toolId === undefined || toolId === null || toolId === "") {
      if (step?.calibrated)
        throw new AppError("invalid", `Step ${step.number} needs the calibrated tool the reading was taken with: choose it by its number.`);
      return e;
    }
    const tool = typeof toolId === "string" ? byId.get(toolId.toLowerCase()) : undefined;
    if (!tool) throw new AppError("invalid", "The tool named with this reading is not in the tool room.");
    const why = toolRefusal(
      {
        number: tool.number,
        description: tool.description,
        calibrated: tool.calibrated,
        calibrationDueOn: tool.calibrationDueOn,
        status: tool.status as ToolStatus,
      },
      readingDay(zone, e.clientTime, receivedAt),
    );
    if (why) throw new AppError("invalid", why);
    return { ...e, payload: { ...e.payload, toolId: tool.id, toolNumber: tool.number } };
  });
}

/**
 * Mails each loan not counted back in by its due time once: to the student and to the
 * instructors of their classes. Run by the worker's sweep; rows are claimed with SKIP LOCKED so
 * two workers never mail the same loan.
 */
export async function mailOverdueLoans(): Promise<number> {
  const db = getDb();
  const zone = await schoolTimeZone();
  const link = `${getEnv().APP_URL.replace(/\/$/, "")}/tools`;
  return db.transaction(async (tx) => {
    const due = await tx
      .select({ id: toolCheckouts.id })
      .from(toolCheckouts)
      .where(and(isNull(toolCheckouts.returnedAt), isNull(toolCheckouts.overdueMailedAt), lt(toolCheckouts.dueAt, new Date())))
      .limit(50)
      .for("update", { skipLocked: true });
    for (const { id } of due) {
      const loan = await getCheckout(id, tx);
      const [student] = await tx.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, loan.userId));
      const instructors = await tx.execute<{ email: string; name: string }>(
        sql`select u.email, u.name from users u where u.status = 'active' and u.role = 'instructor'
            and u.id in (select me.user_id from class_members me join class_members s on s.class_id = me.class_id where s.user_id = ${loan.userId})`,
      );
      const what = loan.kit
        ? `kit ${loan.kit.number} (${loan.kit.name})`
        : `${loan.tool?.description ?? "a tool"} ${loan.tool?.number ?? ""}`.trim();
      const common = {
        studentName: loan.userName,
        what,
        dueAt: dateTimeIn(zone, loan.dueAt),
        tools: loan.tools.map((t) => `${t.number} ${t.description}`),
        link,
      };
      if (student) await queueMail(toolsOverdueMail({ ...common, to: student.email, name: student.name, forStudent: true }));
      for (const to of instructors.rows) await queueMail(toolsOverdueMail({ ...common, to: to.email, name: to.name, forStudent: false }));
      await tx.update(toolCheckouts).set({ overdueMailedAt: new Date() }).where(eq(toolCheckouts.id, id));
    }
    return due.length;
  });
}

/** Who the desk can lend to: active students, each with their open runs (a loan may be for one of them). */
export async function lendingChoices(): Promise<{ id: string; name: string; runs: { id: string; title: string }[] }[]> {
  const db = getDb();
  const students = await db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(and(eq(users.role, "student"), eq(users.status, "active")))
    .orderBy(asc(users.name))
    .limit(2000);
  const open = await db
    .select({ id: runs.id, studentId: runs.studentId, title: taskCardVersions.title })
    .from(runs)
    .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .where(and(sql`${runs.status} <> 'signed_off'`, isNull(assignments.withdrawnAt)))
    .orderBy(asc(taskCardVersions.title));
  return students.map((s) => ({ ...s, runs: open.filter((r) => r.studentId === s.id).map((r) => ({ id: r.id, title: r.title })) }));
}
