import { z } from "zod";
import { attendanceStatuses, sectionNames } from "@/lib/domain/attendance";

export const createSessionSchema = z.object({
  classId: z.uuid("Choose the class."),
  startsAt: z.iso.datetime({ offset: true, error: "Give the date and time the session starts." }),
  minutes: z
    .number({ error: "Give the session's length in minutes." })
    .int("Whole minutes.")
    .min(1, "At least a minute.")
    .max(720, "At most 12 hours."),
  section: z.enum(sectionNames as [string, ...string[]], { error: "Choose General, Airframe or Powerplant." }),
  subject: z
    .string({ error: "Say what the session covers." })
    .trim()
    .min(1, "Say what the session covers.")
    .max(120, "Use at most 120 characters."),
});

export const attendanceSchema = z.object({
  entries: z
    .array(
      z.object({
        userId: z.uuid("Each entry names a student."),
        status: z.enum(attendanceStatuses, { error: "A student is present, late, absent or excused." }),
        /** Left out: the whole session when present, none when absent or excused. */
        minutes: z.number().int("Whole minutes.").min(0).max(720).optional(),
        makeup: z.string().trim().max(300, "Describe the make-up work in at most 300 characters.").optional().default(""),
        makeupRunId: z.uuid("A make-up run is named by its id.").nullable().optional().default(null),
      }),
      { error: "Send { entries: [...] }." },
    )
    .min(1, "Send at least one entry.")
    .max(500, "At most 500 entries at a time."),
  /** Why the register changes after it was closed: needed then. */
  reason: z.string().trim().max(300, "Use at most 300 characters.").optional().default(""),
});

export const sessionListQuerySchema = z.object({ classId: z.uuid().optional().catch(undefined) });
