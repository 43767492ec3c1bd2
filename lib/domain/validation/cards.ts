// The task card as the editor, the API and the database see it. One schema for the form and the
// handler; a draft may be unfinished, publishing asks for the rest (publishableCardSchema).
import { z } from "zod";
import { calculatorSlugs } from "@/lib/domain/calc";
import { resolveUnit } from "@/lib/domain/calc/units";

export const noticeKinds = ["warning", "caution", "note"] as const;
export type NoticeKind = (typeof noticeKinds)[number];
export const noticeLabels: Record<NoticeKind, string> = { warning: "WARNING", caution: "CAUTION", note: "NOTE" };

const shortText = (what: string, max: number) =>
  z
    .string({ error: `Give ${what}.` })
    .trim()
    .max(max, `Use at most ${max} characters for ${what}.`);

const textList = (what: string, maxItems: number) =>
  z
    .array(z.string().trim().max(200, `Each of the ${what} has at most 200 characters.`))
    .max(maxItems, `List at most ${maxItems} ${what}.`)
    .default([])
    .transform((items) => [...new Set(items.filter(Boolean))]);

export const noticeSchema = z.object({
  kind: z.enum(noticeKinds, { error: "A notice is a WARNING, CAUTION or NOTE." }),
  text: shortText("the notice text", 1000).min(1, "Write what the notice says."),
});

export const referenceSchema = z.object({
  revisionId: z.uuid("A reference names a revision."),
  page: z.number({ error: "A reference names a page." }).int("A page is a whole number.").min(1, "Pages start at 1.").max(1_000_000),
  quote: z.string().trim().max(300, "Quote at most 300 characters.").optional().default(""),
});

const finite = z.number().finite().nullable().optional();

export const measurementSchema = z
  .object({
    label: shortText("what is measured", 120).min(1, "Say what is measured."),
    unit: z
      .string()
      .trim()
      .refine((u) => resolveUnit(u) !== null, "That unit is not known (try in, mm, in-lb, N·m, °F, psi, lb)."),
    min: finite,
    max: finite,
    nominal: finite,
    tolerance: finite,
  })
  .refine((m) => m.min != null || m.max != null || (m.nominal != null && m.tolerance != null), {
    message: "Give a minimum, a maximum, or a nominal value with its tolerance.",
  })
  .refine((m) => m.min == null || m.max == null || m.min <= m.max, { message: "The minimum is above the maximum." })
  .transform((m) => ({ ...m, unit: resolveUnit(m.unit)! }));

export const stepSchema = z.object({
  id: z.uuid("Each step has an id."),
  text: z.string().max(5000, "A step has at most 5000 characters.").default(""),
  notices: z.array(noticeSchema).max(10, "At most 10 notices on one step.").default([]),
  references: z.array(referenceSchema).max(20, "At most 20 references on one step.").default([]),
  measurement: measurementSchema.nullable().optional().default(null),
  calculator: z.enum(calculatorSlugs).nullable().optional().default(null),
  inspectionPoint: z.boolean().default(false),
  timerMinutes: z
    .number()
    .min(0.5, "A timer runs at least half a minute.")
    .max(600, "A timer runs at most 600 minutes.")
    .nullable()
    .optional()
    .default(null),
});

export const cardContentSchema = z.object({
  title: shortText("a title", 160).min(1, "Give the card a title."),
  applicability: textList("models", 20),
  ataChapter: z.union([z.literal(""), z.string().regex(/^\d{2}$/, "An ATA chapter is two digits, such as 27.")]).default(""),
  subjectId: z.uuid("Choose a curriculum subject.").nullable().default(null),
  estimatedMinutes: z
    .number()
    .int("Whole minutes.")
    .min(1, "At least one minute.")
    .max(6000, "At most 6000 minutes.")
    .nullable()
    .default(null),
  tools: textList("tools", 40),
  consumables: textList("consumables", 40),
  protectiveEquipment: textList("items of protective equipment", 20),
  steps: z
    .array(stepSchema)
    .max(100, "A card has at most 100 steps.")
    .default([])
    .refine((steps) => new Set(steps.map((s) => s.id)).size === steps.length, "Two steps share an id."),
});
export type CardContent = z.output<typeof cardContentSchema>;
export type CardContentInput = z.input<typeof cardContentSchema>;
export type Step = z.output<typeof stepSchema>;
export type StepReference = z.output<typeof referenceSchema>;
export type Measurement = z.output<typeof measurementSchema>;

/** What publishing adds to a draft: a subject, a chapter, and steps that say something. */
export const publishableCardSchema = cardContentSchema.superRefine((card, ctx) => {
  if (!card.subjectId) ctx.addIssue({ code: "custom", path: ["subjectId"], message: "Choose a curriculum subject before publishing." });
  if (!card.ataChapter) ctx.addIssue({ code: "custom", path: ["ataChapter"], message: "Give the ATA chapter before publishing." });
  if (card.steps.length === 0) ctx.addIssue({ code: "custom", path: ["steps"], message: "Add at least one step before publishing." });
  card.steps.forEach((step, i) => {
    if (!step.text.trim()) ctx.addIssue({ code: "custom", path: ["steps"], message: `Step ${i + 1} has no instruction.` });
  });
});

export const saveDraftSchema = z.object({
  content: cardContentSchema,
  /** The editCount the editor loaded; a save from an older copy is refused. */
  editCount: z.number().int().min(0).optional(),
});

export const createCardSchema = z.object({ content: cardContentSchema });

export const citePageSchema = z.object({
  stepId: z.uuid("Choose the step to add the page to."),
  revisionId: z.uuid("A citation names a revision."),
  page: z.number().int().min(1, "Pages start at 1.").max(1_000_000),
  quote: z.string().trim().max(300, "Quote at most 300 characters.").optional().default(""),
});

export const archiveSchema = z.object({ archived: z.boolean({ error: "Say archived: true or false." }) });

export const cardStatuses = ["draft", "published", "archived"] as const;
export const cardListQuerySchema = z.object({
  status: z.enum(cardStatuses).optional().catch(undefined),
  subject: z.uuid().optional().catch(undefined),
  ata: z
    .string()
    .regex(/^\d{2}$/)
    .optional()
    .catch(undefined),
  model: z.string().trim().max(60).optional().catch(undefined),
  q: z.string().trim().max(200).optional().catch(undefined),
});

export const subjectSchema = z.object({
  name: z.string({ error: "Give the subject a name." }).trim().min(1, "Give the subject a name.").max(120, "Use at most 120 characters."),
});

export const versionNumberSchema = z.coerce.number().int().min(1).max(100_000);

/** The order the trade shows notices in: warning (injury), caution (damage), note (information). */
export function sortNotices<T extends { kind: NoticeKind }>(notices: readonly T[]): T[] {
  return [...notices].sort((a, b) => noticeKinds.indexOf(a.kind) - noticeKinds.indexOf(b.kind));
}

export const recheckDecisionsSchema = z.object({
  decisions: z
    .array(
      z.object({
        id: z.uuid("Each decision names a recheck."),
        action: z.enum(["accept", "relink", "drop"], { error: "Decide accept, relink or drop." }),
        page: z.number().int().min(1).max(1_000_000).optional(),
      }),
    )
    .min(1, "Decide at least one citation.")
    .max(200),
});

export const coauthorsSchema = z.object({
  userIds: z
    .array(z.uuid("Each co-author is named by their account id."), { error: "Send { userIds: [...] }." })
    .max(20, "At most 20 co-authors."),
});
