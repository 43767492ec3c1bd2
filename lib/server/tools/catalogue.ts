// The tool room's catalogue: tools, kits and calibrations. Each write and its audit entry share a
// transaction; a calibration is never changed (a trigger in 0015_tool_room.sql), a newer one
// corrects it and sets the tool's next due date.
import "server-only";
import { and, asc, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { getDb, type Db, type Tx } from "@/db";
import { toolCalibrations, toolCheckouts, toolKits, tools, users } from "@/db/schema";
import type { CalibrationDto, KitDto, ToolDto } from "@/lib/contracts/tools";
import type { Actor } from "@/lib/domain/access/permissions";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import { dayIn } from "@/lib/domain/time";
import { addDays, calibrationState, type ToolStatus } from "@/lib/domain/tools/tool-room";
import type { calibrationSchema, createKitSchema, createToolSchema, updateToolSchema } from "@/lib/domain/validation/tools";
import type { z } from "zod";
import { recordAudit } from "@/lib/server/audit";
import { schoolTimeZone } from "@/lib/server/settings";

type Out = { checkoutId: string; userName: string; dueAt: string } | null;

/** Open check-outs by the tools and kits they hold. */
async function openLoans(db: Db | Tx) {
  const rows = await db
    .select({
      id: toolCheckouts.id,
      kitId: toolCheckouts.kitId,
      toolIds: toolCheckouts.toolIds,
      dueAt: toolCheckouts.dueAt,
      userName: users.name,
    })
    .from(toolCheckouts)
    .innerJoin(users, eq(users.id, toolCheckouts.userId))
    .where(isNull(toolCheckouts.returnedAt));
  const byTool = new Map<string, NonNullable<Out>>();
  const byKit = new Map<string, NonNullable<Out>>();
  for (const r of rows) {
    const out = { checkoutId: r.id, userName: r.userName, dueAt: r.dueAt.toISOString() };
    for (const id of r.toolIds) byTool.set(id, out);
    if (r.kitId) byKit.set(r.kitId, out);
  }
  return { byTool, byKit };
}

/** A tool joins a kit of the tool room or none: 422 beside the field otherwise. */
async function assertKit(db: Db | Tx, kitId: string | null | undefined) {
  if (kitId && !(await db.select({ id: toolKits.id }).from(toolKits).where(eq(toolKits.id, kitId))).length)
    throw new AppError("invalid", "That kit is not in the tool room.", { fields: { kitId: "Choose a kit of the tool room." } });
}

const toolNotFound = () => new AppError("not_found", "That tool was not found.");

function duplicateNumber(error: unknown, what: string, number: string): never {
  if (databaseErrorCode(error) === "23505") throw new AppError("conflict", `The tool room already has a ${what} numbered ${number}.`);
  throw error;
}

/** Every tool, or the precision tools due within `dueWithin` days (past due included), by number. */
export async function listTools({ dueWithin, id }: { dueWithin?: number; id?: string } = {}): Promise<ToolDto[]> {
  const db = getDb();
  const today = dayIn(await schoolTimeZone());
  const rows = await db
    .select({ tool: tools, kitNumber: toolKits.number })
    .from(tools)
    .leftJoin(toolKits, eq(toolKits.id, tools.kitId))
    .where(
      and(
        id ? eq(tools.id, id) : undefined,
        dueWithin === undefined
          ? undefined
          : and(
              eq(tools.calibrated, true),
              sql`coalesce(${tools.calibrationDueOn}, '-infinity'::date) <= ${addDays(today, dueWithin)}::date`,
            ),
      ),
    )
    .orderBy(dueWithin === undefined ? asc(tools.number) : asc(tools.calibrationDueOn))
    .limit(5000);
  const loans = await openLoans(db);
  return rows.map(({ tool, kitNumber }) => ({
    id: tool.id,
    number: tool.number,
    description: tool.description,
    kitId: tool.kitId,
    kitNumber,
    calibrated: tool.calibrated,
    calibrationIntervalDays: tool.calibrationIntervalDays,
    calibrationDueOn: tool.calibrationDueOn,
    calibration: calibrationState(tool, today),
    status: tool.status as ToolStatus,
    outOfServiceReason: tool.outOfServiceReason,
    out: loans.byTool.get(tool.id) ?? null,
  }));
}

export async function getTool(id: string): Promise<ToolDto & { calibrations: CalibrationDto[] }> {
  const [tool] = await listTools({ id });
  if (!tool) throw toolNotFound();
  const calibrations = await getDb()
    .select({ c: toolCalibrations, recordedByName: users.name })
    .from(toolCalibrations)
    .innerJoin(users, eq(users.id, toolCalibrations.recordedBy))
    .where(eq(toolCalibrations.toolId, id))
    .orderBy(desc(toolCalibrations.calibratedOn), desc(toolCalibrations.createdAt));
  return {
    ...tool,
    calibrations: calibrations.map(({ c, recordedByName }) => ({
      id: c.id,
      calibratedOn: c.calibratedOn,
      calibratedBy: c.calibratedBy,
      certificate: c.certificate,
      nextDueOn: c.nextDueOn,
      recordedByName,
      createdAt: c.createdAt.toISOString(),
    })),
  };
}

export async function listKits(): Promise<KitDto[]> {
  const db = getDb();
  const kits = await db.select().from(toolKits).orderBy(asc(toolKits.number)).limit(1000);
  const contents = kits.length
    ? await db
        .select({ id: tools.id, number: tools.number, description: tools.description, status: tools.status, kitId: tools.kitId })
        .from(tools)
        .where(
          inArray(
            tools.kitId,
            kits.map((k) => k.id),
          ),
        )
        .orderBy(asc(tools.number))
    : [];
  const loans = await openLoans(db);
  return kits.map((k) => ({
    id: k.id,
    number: k.number,
    name: k.name,
    location: k.location,
    tools: contents
      .filter((t) => t.kitId === k.id)
      .map((t) => ({ id: t.id, number: t.number, description: t.description, status: t.status as ToolStatus })),
    out: loans.byKit.get(k.id) ?? null,
  }));
}

export async function createTool({ actor, input }: { actor: Actor; input: z.output<typeof createToolSchema> }): Promise<{ id: string }> {
  try {
    return await getDb().transaction(async (tx) => {
      await assertKit(tx, input.kitId);
      const [row] = await tx
        .insert(tools)
        .values({
          number: input.number,
          description: input.description,
          kitId: input.kitId,
          calibrated: input.calibrated,
          calibrationIntervalDays: input.calibrationIntervalDays,
          calibrationDueOn: input.calibrationDueOn,
        })
        .returning({ id: tools.id });
      await recordAudit(tx, {
        actorId: actor.id,
        action: "tool.created",
        subjectType: "tool",
        subjectId: row!.id,
        details: { number: input.number },
      });
      return row!;
    });
  } catch (error) {
    duplicateNumber(error, "tool", input.number);
  }
}

export async function updateTool({ actor, id, input }: { actor: Actor; id: string; input: z.output<typeof updateToolSchema> }) {
  return getDb().transaction(async (tx) => {
    const [tool] = await tx.select().from(tools).where(eq(tools.id, id)).for("update");
    if (!tool) throw toolNotFound();
    await assertKit(tx, input.kitId);
    const status = input.status ?? tool.status;
    await tx
      .update(tools)
      .set({
        description: input.description ?? tool.description,
        kitId: input.kitId === undefined ? tool.kitId : input.kitId,
        status,
        outOfServiceReason: status === "out_of_service" ? input.outOfServiceReason || tool.outOfServiceReason : "",
        updatedAt: new Date(),
      })
      .where(eq(tools.id, id));
    const action = status !== tool.status ? (status === "out_of_service" ? "tool.out_of_service" : "tool.in_service") : "tool.changed";
    await recordAudit(tx, {
      actorId: actor.id,
      action,
      subjectType: "tool",
      subjectId: id,
      details: { number: tool.number, ...(status === "out_of_service" ? { reason: input.outOfServiceReason } : {}) },
    });
    return { id };
  });
}

export async function createKit({ actor, input }: { actor: Actor; input: z.output<typeof createKitSchema> }): Promise<{ id: string }> {
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx.insert(toolKits).values(input).returning({ id: toolKits.id });
      await recordAudit(tx, {
        actorId: actor.id,
        action: "kit.created",
        subjectType: "kit",
        subjectId: row!.id,
        details: { number: input.number },
      });
      return row!;
    });
  } catch (error) {
    duplicateNumber(error, "kit", input.number);
  }
}

/**
 * Records a calibration from its certificate. The next due date is the certificate's, or the day
 * of calibration plus the tool's interval; the tool takes it when this is its newest calibration.
 */
export async function recordCalibration({
  actor,
  toolId,
  input,
}: {
  actor: Actor;
  toolId: string;
  input: z.output<typeof calibrationSchema>;
}) {
  const today = dayIn(await schoolTimeZone());
  if (input.calibratedOn > today)
    throw new AppError("invalid", "A calibration is recorded once it is done.", {
      fields: { calibratedOn: "The day it was calibrated is not in the future." },
    });
  return getDb().transaction(async (tx) => {
    const [tool] = await tx.select().from(tools).where(eq(tools.id, toolId)).for("update");
    if (!tool) throw toolNotFound();
    if (!tool.calibrated) throw new AppError("invalid", `${tool.number} is not a precision tool: it has no calibration to record.`);
    const nextDueOn = input.nextDueOn ?? (tool.calibrationIntervalDays ? addDays(input.calibratedOn, tool.calibrationIntervalDays) : null);
    if (!nextDueOn)
      throw new AppError("invalid", "Give the next due date: this tool has no calibration interval.", {
        fields: { nextDueOn: "Give the next due date from the certificate." },
      });
    const [row] = await tx
      .insert(toolCalibrations)
      .values({
        toolId,
        calibratedOn: input.calibratedOn,
        calibratedBy: input.calibratedBy,
        certificate: input.certificate,
        nextDueOn,
        recordedBy: actor.id,
      })
      .returning({ id: toolCalibrations.id });
    const [newest] = await tx
      .select({ nextDueOn: toolCalibrations.nextDueOn })
      .from(toolCalibrations)
      .where(eq(toolCalibrations.toolId, toolId))
      .orderBy(desc(toolCalibrations.calibratedOn), desc(toolCalibrations.createdAt))
      .limit(1);
    await tx.update(tools).set({ calibrationDueOn: newest!.nextDueOn, updatedAt: new Date() }).where(eq(tools.id, toolId));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "tool.calibrated",
      subjectType: "tool",
      subjectId: toolId,
      details: { number: tool.number, certificate: input.certificate, calibratedOn: input.calibratedOn, nextDueOn },
    });
    return { id: row!.id, nextDueOn: newest!.nextDueOn };
  });
}
