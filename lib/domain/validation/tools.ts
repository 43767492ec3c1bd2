// What the tool room's forms and routes take. One schema per body, shared by the form and the handler.
import { z } from "zod";
import { holdOutcomes, readCode, toolStatuses } from "@/lib/domain/tools/tool-room";
import { calendarDay } from "@/lib/domain/validation/dates";

const numberField = (what: string) =>
  z
    .string({ error: `Give the ${what} number.` })
    .trim()
    .max(40, `A ${what} number is short, such as T-104.`)
    .transform((v, ctx) => {
      const code = readCode(v);
      if (!code) {
        ctx.addIssue({
          code: "custom",
          message: `A ${what} number is letters, a dash and digits, such as ${what === "kit" ? "K-03" : "T-104"}.`,
        });
        return z.NEVER;
      }
      return code;
    });

const words = (what: string, max: number) =>
  z
    .string({ error: `Give ${what}.` })
    .trim()
    .min(1, `Give ${what}.`)
    .max(max, `Use at most ${max} characters for ${what}.`);

const optionalText = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).optional().default("");

const intervalDays = z
  .number({ error: "The calibration interval is a number of days." })
  .int("Whole days.")
  .min(1, "At least one day.")
  .max(3660, "At most ten years.")
  .nullable()
  .optional()
  .default(null);

export const createToolSchema = z
  .object({
    number: numberField("tool"),
    description: words("what the tool is", 200),
    kitId: z.uuid("Choose a kit, or none.").nullable().optional().default(null),
    calibrated: z.boolean().optional().default(false),
    calibrationIntervalDays: intervalDays,
    calibrationDueOn: calendarDay("Give the calibration due date.").nullable().optional().default(null),
  })
  .refine((t) => t.calibrated || (!t.calibrationDueOn && !t.calibrationIntervalDays), {
    message: "Only a precision tool has a calibration date and interval: tick “calibrated tool”.",
    path: ["calibrated"],
  });

export const updateToolSchema = z
  .object({
    description: words("what the tool is", 200).optional(),
    kitId: z.uuid("Choose a kit, or none.").nullable().optional(),
    status: z.enum(toolStatuses, { error: "A tool is in_service or out_of_service." }).optional(),
    outOfServiceReason: optionalText(300),
  })
  .refine((t) => t.status !== "out_of_service" || t.outOfServiceReason, {
    message: "Say why the tool is out of service.",
    path: ["outOfServiceReason"],
  });

export const createKitSchema = z.object({
  number: numberField("kit"),
  name: words("the kit's name", 120),
  location: optionalText(120),
});

export const calibrationSchema = z
  .object({
    calibratedOn: calendarDay("Give the day it was calibrated."),
    calibratedBy: words("who calibrated it", 120),
    certificate: words("the certificate number", 80),
    /** Left out: the day of calibration plus the tool's interval. */
    nextDueOn: calendarDay("Give the next due date.").optional(),
  })
  .refine((c) => !c.nextDueOn || c.nextDueOn > c.calibratedOn, {
    message: "The next due date comes after the calibration.",
    path: ["nextDueOn"],
  });

export const checkoutSchema = z
  .object({
    kitId: z.uuid("A kit is named by its id.").nullable().optional().default(null),
    toolId: z.uuid("A tool is named by its id.").nullable().optional().default(null),
    userId: z.uuid("Choose the student."),
    runId: z.uuid("A run is named by its id.").nullable().optional().default(null),
    /** When it is due back; a school day from now when left out. */
    dueAt: z.iso.datetime({ offset: true, error: "dueAt is a date and time, such as 2026-12-03T16:00:00Z." }).optional(),
    teamNote: optionalText(200),
  })
  .refine((c) => !!c.kitId !== !!c.toolId, { message: "Lend one kit or one tool at a time.", path: ["kitId"] });

export const returnSchema = z.object({
  missingToolIds: z
    .array(z.uuid("Each missing tool is named by its id."), { error: "Send { missingToolIds: [...] } (empty when all came back)." })
    .max(200)
    .optional()
    .default([]),
});

export const clearHoldSchema = z
  .object({
    outcome: z.enum(holdOutcomes, { error: "Say found or lost." }),
    note: optionalText(500),
  })
  .refine((c) => c.outcome === "found" || c.note, { message: "Say what was done about the lost tool.", path: ["note"] });

export const checkoutListQuerySchema = z.object({
  status: z.enum(["open", "overdue", "all"]).optional().catch(undefined),
});

export const toolListQuerySchema = z.object({
  /** Precision tools due for calibration within this many days (0 = past due only). */
  dueWithin: z.coerce.number().int().min(0).max(366).optional().catch(undefined),
});
