import { z } from "zod";
import { calendarDay } from "@/lib/domain/validation/dates";

const day = calendarDay();

// null too: the form sends its own parsed output, where an empty day is already null.
const optionalDay = z
  .union([z.literal(""), day])
  .nullish()
  .transform((v) => (v ? v : null));

export const classFieldsSchema = z.object({
  name: z.string({ error: "Enter a name." }).trim().min(1, "Enter a name.").max(120, "Use at most 120 characters."),
  description: z.string().trim().max(2000, "Use at most 2000 characters.").optional().default(""),
  startsOn: optionalDay,
  endsOn: optionalDay,
});

export const createClassSchema = classFieldsSchema.refine((v) => !v.startsOn || !v.endsOn || v.startsOn <= v.endsOn, {
  message: "The class cannot end before it starts.",
  path: ["endsOn"],
});
export type CreateClassInput = z.input<typeof createClassSchema>;

export const updateClassSchema = classFieldsSchema.partial();

export const addMembersSchema = z.object({
  userIds: z.array(z.uuid("Each member is an account id.")).min(1, "Choose at least one person.").max(500),
});
