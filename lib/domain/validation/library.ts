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

export const withdrawManualSchema = z.object({
  reason: z
    .string({ error: "Say why the manual is withdrawn." })
    .trim()
    .min(1, "Say why the manual is withdrawn: readers of its pages see it.")
    .max(300, "Keep the reason to 300 characters."),
});

export const markKinds = ["bookmark", "note"] as const;
export type MarkKind = (typeof markKinds)[number];

export const createMarkSchema = z
  .object({
    revisionId: z.uuid("Name the revision the page is in."),
    page: z.number({ error: "Name the page." }).int("A page is a whole number.").min(1, "Pages start at 1.").max(1_000_000),
    kind: z.enum(markKinds, { error: "A mark is a bookmark or a note." }),
    text: z.string().trim().max(2000, "Keep a note to 2000 characters.").optional().default(""),
    /** A note shown to this class (its instructors and admins only). */
    classId: z.uuid("Choose one of your classes.").nullable().optional().default(null),
  })
  .refine((m) => m.kind !== "note" || m.text.length > 0, { message: "Write the note.", path: ["text"] })
  .refine((m) => m.kind !== "bookmark" || m.classId === null, {
    message: "A bookmark is your own; a note can be shown to a class.",
    path: ["classId"],
  });
