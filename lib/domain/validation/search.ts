import { z } from "zod";
import { documentTypes } from "@/lib/domain/vocabulary";

const flag = z
  .enum(["1", "0", "true", "false"], { error: "Use 1 or 0." })
  .optional()
  .transform((v) => v === "1" || v === "true");

export const searchParamsSchema = z.object({
  q: z.string({ error: "Type what to search for." }).trim().min(1, "Type what to search for.").max(500, "Use at most 500 characters."),
  manual: z.uuid("manual is a manual id.").optional(),
  revision: z.uuid("revision is a revision id.").optional(),
  type: z.enum(documentTypes, { error: "That is not a document type." }).optional(),
  model: z.string().trim().min(1).max(60).optional(),
  // "5" is chapter 05, as people say it.
  ata: z
    .string()
    .trim()
    .regex(/^\d{1,2}$/, "An ATA chapter is one or two digits, e.g. 32 or 5.")
    .transform((v) => v.padStart(2, "0"))
    .optional(),
  includeSuperseded: flag,
  limit: z.coerce
    .number({ error: "limit is a number." })
    .int("limit is a whole number.")
    .min(1, "limit is 1 to 50.")
    .max(50, "limit is 1 to 50.")
    .default(10),
  offset: z.coerce
    .number({ error: "offset is a number." })
    .int()
    .min(0, "offset is 0 or more.")
    .max(1000, "offset is at most 1000.")
    .default(0),
});
export type SearchParams = z.infer<typeof searchParamsSchema>;
