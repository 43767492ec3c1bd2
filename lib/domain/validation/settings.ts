import { z } from "zod";
import { sections } from "@/lib/domain/standard/elements";
import { isTimeZone } from "@/lib/domain/time";

const sectionNames = Object.values(sections) as [string, ...string[]];

const hoursOfSection = z
  .number({ error: "Hours are a whole number." })
  .int("Hours are a whole number.")
  .min(0, "Hours cannot be below 0.")
  .max(10_000, "Over 10,000 hours for one section is not a plan.")
  .nullable();

/** Either part or both; `null` for a section removes its plan. */
export const schoolSettingsSchema = z
  .object({
    timeZone: z
      .string({ error: "Choose the school's time zone." })
      .trim()
      .refine(isTimeZone, "Choose a time zone from the list, such as America/Denver or Europe/Oslo.")
      .optional(),
    plannedHours: z
      .partialRecord(z.enum(sectionNames, { error: `A section is one of ${sectionNames.join(", ")}.` }), hoursOfSection)
      .optional(),
  })
  .strict()
  .refine((s) => s.timeZone !== undefined || s.plannedHours !== undefined, "Send the time zone, the planned hours, or both.");
