// The task card as the editor, the API and the database see it. One schema for the form and the
// handler; a draft may be unfinished, publishing asks for the rest (publishableCardSchema).
import { z } from "zod";
import { calculatorSlugs } from "@/lib/domain/calc";
import { resolveUnit } from "@/lib/domain/calc/units";
import { ataChapterOf } from "@/lib/domain/validation/ata";
import { elementCodePattern } from "@/lib/domain/standard/elements";

export { ataChapterOf };

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

// A draft keeps whatever the author has typed so far: only what could never be stored (sizes,
// counts, ids) is refused here. What a card needs before students run it is checked by
// cardProblems, which the editor shows as a list and publishing requires to be empty.

export const noticeSchema = z.object({
  kind: z.enum(noticeKinds, { error: "A notice is a WARNING, CAUTION or NOTE." }),
  text: shortText("the notice text", 1000).default(""),
});

export const referenceSchema = z.object({
  revisionId: z.uuid("A reference names a revision."),
  page: z.number({ error: "A reference names a page." }).int("A page is a whole number.").min(1, "Pages start at 1.").max(1_000_000),
  quote: z.string().trim().max(300, "Quote at most 300 characters.").optional().default(""),
});

const finite = z.number().finite().nullable().optional();

/** A measured value as drafted: the unit as typed when it is not one we know (cardProblems says so). */
export const measurementSchema = z
  .object({
    label: shortText("what is measured", 120).default(""),
    unit: z.string().trim().max(40, "A unit has at most 40 characters.").default(""),
    min: finite,
    max: finite,
    nominal: finite,
    tolerance: finite,
  })
  .transform((m) => ({ ...m, unit: resolveUnit(m.unit) ?? m.unit }));

export const stepSchema = z.object({
  id: z.uuid("Each step has an id."),
  text: z.string().max(5000, "A step has at most 5000 characters.").default(""),
  notices: z.array(noticeSchema).max(10, "At most 10 notices on one step.").default([]),
  references: z.array(referenceSchema).max(20, "At most 20 references on one step.").default([]),
  measurement: measurementSchema.nullable().optional().default(null),
  calculator: z.enum(calculatorSlugs).nullable().optional().default(null),
  inspectionPoint: z.boolean().default(false),
  /** The certification standard's elements this step shows (AM.II.C.S2): a signed-off run demonstrates them. */
  elements: z
    .array(z.string().trim().toUpperCase().max(20, "An element code is short, such as AM.I.A.K1."))
    .max(20, "At most 20 standard elements on one step.")
    .default([])
    .transform((codes) => [...new Set(codes.filter(Boolean))]),
  /** The reading is taken with a precision tool (torque wrench, micrometer): the cart asks which one, within calibration. */
  calibratedTool: z.boolean().default(false),
  timerMinutes: z.number().finite().nullable().optional().default(null),
});

export const cardContentSchema = z.object({
  title: shortText("a title", 160).default(""),
  applicability: textList("models", 20),
  ataChapter: z.string().trim().max(2, "An ATA chapter is two digits, such as 27.").default("").transform(ataChapterOf),
  subjectId: z.uuid("Choose a curriculum subject.").nullable().default(null),
  estimatedMinutes: z.number().int("Whole minutes.").min(-1_000_000).max(1_000_000).nullable().default(null),
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

/**
 * One thing to finish before a card can be published. `field` is where the editor shows it:
 * "title", "subjectId", "ataChapter", "estimatedMinutes", "steps", or "steps.N.<part>" (N from 1).
 */
export interface CardProblem {
  field: string;
  message: string;
}

function measurementProblems(m: Measurement): string[] {
  const out: string[] = [];
  if (!m.label) out.push("say what is measured");
  if (!m.unit) out.push("give the unit");
  else if (resolveUnit(m.unit) === null) out.push(`the unit "${m.unit}" is not known (try in, mm, in-lb, N·m, °F, psi, lb)`);
  const range = m.min != null || m.max != null;
  const tolerance = m.nominal != null && m.tolerance != null;
  if (!range && !tolerance) out.push("give a minimum, a maximum, or a nominal value with its tolerance");
  if (m.min != null && m.max != null && m.min > m.max) out.push("the minimum is above the maximum");
  if (m.tolerance != null && m.tolerance < 0) out.push("a tolerance is not negative");
  return out;
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** Everything a draft still needs before students may run it, in the order of the editor. Pure. */
export function cardProblems(card: CardContent): CardProblem[] {
  const out: CardProblem[] = [];
  if (!card.title) out.push({ field: "title", message: "Give the card a title." });
  if (!card.subjectId) out.push({ field: "subjectId", message: "Choose a curriculum subject." });
  if (!card.ataChapter) out.push({ field: "ataChapter", message: "Give the ATA chapter." });
  else if (!/^\d{2}$/.test(card.ataChapter)) out.push({ field: "ataChapter", message: "An ATA chapter is two digits, such as 27." });
  if (card.estimatedMinutes != null && (card.estimatedMinutes < 1 || card.estimatedMinutes > 6000))
    out.push({ field: "estimatedMinutes", message: "The estimated time is from 1 to 6000 minutes." });
  if (card.steps.length === 0) out.push({ field: "steps", message: "Add at least one step." });
  card.steps.forEach((step, i) => {
    const n = i + 1;
    if (!step.text.trim()) out.push({ field: `steps.${n}.text`, message: `Step ${n}: write the instruction.` });
    step.notices.forEach((notice) => {
      if (!notice.text) out.push({ field: `steps.${n}.notices`, message: `Step ${n}: a ${noticeLabels[notice.kind]} has no text.` });
    });
    if (step.measurement) {
      const missing = measurementProblems(step.measurement);
      if (missing.length) out.push({ field: `steps.${n}.measurement`, message: `Step ${n}: ${capital(missing.join("; "))}.` });
    }
    const badCodes = step.elements.filter((c) => !elementCodePattern.test(c));
    if (badCodes.length)
      out.push({
        field: `steps.${n}.elements`,
        message: `Step ${n}: ${badCodes.join(", ")} ${badCodes.length === 1 ? "is not an element code" : "are not element codes"} (such as AM.I.A.K1).`,
      });
    if (step.calibratedTool && !step.measurement)
      out.push({
        field: `steps.${n}.calibratedTool`,
        message: `Step ${n}: a calibrated tool is asked for with a measured value; add what is measured.`,
      });
    if (step.timerMinutes != null && (step.timerMinutes < 0.5 || step.timerMinutes > 600))
      out.push({ field: `steps.${n}.timerMinutes`, message: `Step ${n}: a timer runs from half a minute to 600 minutes.` });
  });
  return out;
}

/** A card ready for students: the draft's schema and no problem left. */
export const publishableCardSchema = cardContentSchema.superRefine((card, ctx) => {
  for (const p of cardProblems(card)) ctx.addIssue({ code: "custom", path: p.field.split("."), message: p.message });
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
