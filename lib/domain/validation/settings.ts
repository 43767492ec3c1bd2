import { z } from "zod";
import { isTimeZone } from "@/lib/domain/time";

export const schoolSettingsSchema = z.object({
  timeZone: z
    .string({ error: "Choose the school's time zone." })
    .trim()
    .refine(isTimeZone, "Choose a time zone from the list, such as America/Denver or Europe/Oslo."),
});
