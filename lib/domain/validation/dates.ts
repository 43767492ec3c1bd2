import { z } from "zod";

/**
 * The earliest day that is still today somewhere (UTC−12, the last zone to leave a day). Until the
 * school's time zone is a setting, a day before this one is past for every school, wherever it is.
 */
export function earliestToday(now = Date.now()): string {
  return new Date(now - 12 * 60 * 60 * 1000).toISOString().slice(0, 10);
}

/** A calendar day as YYYY-MM-DD that exists (no 31 February). */
export const calendarDay = (message = "Give the date.") =>
  z
    .string({ error: message })
    .min(1, message)
    .regex(/^\d{4}-\d{2}-\d{2}$/, "Use the form YYYY-MM-DD.")
    .refine((v) => {
      const d = new Date(`${v}T00:00:00Z`);
      return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === v;
    }, "That day does not exist.");
