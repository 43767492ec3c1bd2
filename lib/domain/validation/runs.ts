// What carts and review screens send about runs. One schema per body; the events API takes only
// what happens at the aircraft (return and sign-off have their own routes, made on the server).
import { z } from "zod";
import { runEventTypes } from "@/lib/domain/runs/fold";
import { earliestToday } from "@/lib/domain/validation/dates";

// What a cart may send. Buy-off, return and sign-off are made on the server by their own routes,
// after their checks (the step is done, the run is handed in) and with an audit entry.
export const cartEventTypes = runEventTypes.filter(
  (t) => t !== "run.returned" && t !== "run.signed_off" && t !== "inspection.bought_off" && t !== "run.moved",
);
export const maxEventsPerBatch = 500;
const maxPayloadChars = 4000;

/** PostgreSQL text and jsonb cannot hold a NUL character: refused here as a 422, not a 500 later. */
const noNul = (value: string) => !value.includes("\u0000");

/**
 * A cart's clock may be wrong, but not by weeks: a time far away would sort the run's events
 * around the instructor's review, so it is refused and the cart is told to set its clock.
 */
export const clientTimeWindow = { pastDays: 60, futureHours: 24 };
const plausibleTime = (iso: string) => {
  const t = Date.parse(iso);
  return t > Date.now() - clientTimeWindow.pastDays * 86_400_000 && t < Date.now() + clientTimeWindow.futureHours * 3_600_000;
};

export const runEventInputSchema = z.object({
  id: z.uuid("Each event has an id made on the cart (a UUID)."),
  type: z.enum(cartEventTypes as [string, ...string[]], {
    error: "That kind of event is not known here. Return and sign-off go through the review screen.",
  }),
  stepId: z.uuid("A step id is a UUID.").nullable().optional().default(null),
  payload: z
    .record(z.string(), z.unknown())
    .optional()
    .default({})
    .refine((p) => JSON.stringify(p).length <= maxPayloadChars, `An event carries at most ${maxPayloadChars} characters of detail.`)
    // JSON writes a NUL as \u0000.
    .refine((p) => !JSON.stringify(p).includes("\\u0000"), "An event's detail cannot hold a NUL character."),
  clientTime: z.iso
    .datetime({ offset: true, error: "clientTime is an ISO date and time, such as 2026-12-02T09:30:00Z." })
    .refine(plausibleTime, "The laptop's clock is far from the school's: set its date and time, then send again."),
});
export type RunEventInput = z.output<typeof runEventInputSchema>;

export const eventBatchSchema = z.object({
  events: z
    .array(runEventInputSchema, { error: "Send { events: [...] }." })
    .min(1, "Send at least one event.")
    .max(maxEventsPerBatch, `Send at most ${maxEventsPerBatch} events at a time.`),
});

const optionalDate = z
  .union([z.literal(""), z.iso.date("A due date is a date, such as 2026-12-18.")])
  .nullable()
  .optional()
  .transform((d) => d || null)
  // Read when the request is parsed: a card due yesterday would be overdue the moment it is given.
  .refine((d) => !d || d >= earliestToday(), "A due date cannot be in the past.");

export const createAssignmentSchema = z
  .object({
    cardId: z.uuid("Choose a task card."),
    /** A published version; the newest one when left out. */
    versionNumber: z.number().int().min(1).optional(),
    classId: z.uuid("Choose a class.").nullable().optional().default(null),
    studentIds: z.array(z.uuid()).max(500, "At most 500 students at a time.").optional().default([]),
    dueOn: optionalDate,
    note: z
      .string()
      .trim()
      .max(300, "Keep the note to 300 characters (an aircraft or a station).")
      .refine(noNul, "A NUL character cannot be stored.")
      .optional()
      .default(""),
    /** The hangar booking the card is done in (its asset is named on each run). */
    bookingId: z.uuid("Choose a booking.").nullable().optional().default(null),
    /** Assign even to students who already have this card open (otherwise 409 names them). */
    confirmDuplicates: z.boolean().optional().default(false),
  })
  .refine((a) => a.classId || a.studentIds.length, { message: "Choose a class or at least one student.", path: ["classId"] });

/** The whole of what may change (the edit form sends both): `dueOn` null or "" takes the due date away. */
export const updateAssignmentSchema = z.object({
  dueOn: optionalDate,
  note: z
    .string({ error: "Send the note (empty for none)." })
    .trim()
    .max(300, "Keep the note to 300 characters (an aircraft or a station).")
    .refine(noNul, "A NUL character cannot be stored."),
});

export const withdrawAssignmentSchema = z.object({
  reason: z
    .string({ error: "Say why the assignment is withdrawn." })
    .trim()
    .min(1, "Say why the assignment is withdrawn: the students see it.")
    .max(300, "Keep the reason to 300 characters.")
    .refine(noNul, "A NUL character cannot be stored."),
});

export const reviewCommentSchema = z.object({
  comment: z
    .string()
    .trim()
    .max(2000, "Keep the comment to 2000 characters.")
    .refine(noNul, "A NUL character cannot be stored.")
    .optional()
    .default(""),
});
export const returnRunSchema = z.object({
  comment: z
    .string({ error: "Say what the student should fix." })
    .trim()
    .min(1, "Say what the student should fix.")
    .max(2000, "Keep the comment to 2000 characters.")
    .refine(noNul, "A NUL character cannot be stored."),
  /** The steps to do again: they are reopened, bought-off ones included. */
  reopenStepIds: z
    .array(z.uuid("A step id is a UUID."), { error: "Name the steps to do again as a list." })
    .max(500, "A card has at most 500 steps.")
    .optional()
    .default([]),
});
/** A sign-off is permanent: the instructor types their password again. */
export const signOffSchema = reviewCommentSchema.extend({
  password: z
    .string({ error: "Type your password to sign off." })
    .min(1, "Type your password to sign off.")
    .max(200, "That is not your password."),
});
export const moveRunsSchema = z.object({
  runIds: z
    .array(z.uuid("A run id is a UUID."), { error: "Name the runs to move as a list." })
    .min(1, "Choose at least one student's run to move.")
    .max(500, "At most 500 runs at a time."),
});
export const buyOffSchema = z.object({ stepId: z.uuid("Name the inspection point's step.") });

export const keepOnCartsSchema = z.object({ keepOnCarts: z.boolean({ error: "Say keepOnCarts: true or false." }) });

/** Photos of the work: pictures only, sniffed from their first bytes, not trusted from the header. */
export const photoTypes = ["image/jpeg", "image/png", "image/webp"] as const;
export const maxPhotoBytes = 8 * 1024 * 1024;
export function sniffImage(head: Uint8Array): (typeof photoTypes)[number] | null {
  if (head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return "image/jpeg";
  if (head[0] === 0x89 && head[1] === 0x50 && head[2] === 0x4e && head[3] === 0x47) return "image/png";
  const ascii = (from: number, to: number) => String.fromCharCode(...head.slice(from, to));
  if (ascii(0, 4) === "RIFF" && ascii(8, 12) === "WEBP") return "image/webp";
  return null;
}
