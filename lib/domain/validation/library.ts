import { z } from "zod";
import { documentTypes } from "@/lib/domain/vocabulary";
import { calendarDay } from "@/lib/domain/validation/dates";
import { ataChapterOf } from "@/lib/domain/validation/ata";

export const documentTypeLabels: Record<(typeof documentTypes)[number], string> = {
  maintenance_manual: "Maintenance manual",
  overhaul_manual: "Overhaul manual",
  parts_catalog: "Parts catalogue",
  service_bulletin: "Service bulletin",
  airworthiness_directive: "Airworthiness directive",
  handbook: "Handbook or advisory",
  school_procedure: "School procedure",
};

const list = (what: string, item: z.ZodString, max: number, read: (s: string) => string = (s) => s.trim()) =>
  z
    .string()
    .max(2000, `Use at most 2000 characters for ${what}.`)
    .optional()
    .transform((v) => [...new Set((v ?? "").split(",").map(read).filter(Boolean))])
    .pipe(z.array(item).max(max, `Give at most ${max} ${what}.`));

export const revisionFieldsSchema = z.object({
  revisionLabel: z
    .string({ error: "Give the revision label, as printed on the document (for example Rev 4)." })
    .trim()
    .min(1, "Give the revision label, as printed on the document (for example Rev 4).")
    .max(60, "Use at most 60 characters."),
  revisionDate: calendarDay("Give the revision date."),
});

export const manualFieldsSchema = z.object({
  title: z.string({ error: "Give the title." }).trim().min(1, "Give the title.").max(200, "Use at most 200 characters."),
  documentType: z.enum(documentTypes, { error: "Choose the document type." }),
  applicability: list("models", z.string().max(60, "A model name has at most 60 characters."), 50),
  ataChapters: list(
    "ATA chapters",
    z.string().regex(/^\d{2}$/, "ATA chapters are two digits, such as 32 (5 is read as 05)."),
    100,
    ataChapterOf,
  ),
});

export const manualUploadSchema = manualFieldsSchema.extend(revisionFieldsSchema.shape);
export type ManualUploadInput = z.input<typeof manualUploadSchema>;
export type RevisionUploadInput = z.input<typeof revisionFieldsSchema>;

export const pageNumberSchema = z.coerce
  .number({ error: "A page number is a whole number from 1." })
  .int("A page number is a whole number from 1.")
  .min(1, "A page number is a whole number from 1.")
  .max(1_000_000);
