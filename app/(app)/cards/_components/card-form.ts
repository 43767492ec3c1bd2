// The editor's form values and their conversion to the API's card content and to a preview.
// Form fields are strings (what inputs hold); numbers are read on the way out.
import type { CalculatorSlug } from "@/lib/domain/calc";
import { parseNumber } from "@/lib/domain/calc/units";
import type { CardVersionDto, StepDto } from "@/lib/contracts/cards";
import type { CardContentInput, NoticeKind } from "@/lib/domain/validation/cards";

export interface ReferenceField {
  revisionId: string;
  page: number;
  quote: string;
  // For showing only; the server looks these up again.
  manualId: string;
  manualTitle: string;
  revisionLabel: string;
  current: boolean;
}

export interface StepField {
  // Not "id": react-hook-form's field arrays keep their own key under that name.
  uid: string;
  text: string;
  notices: { kind: NoticeKind; text: string }[];
  references: ReferenceField[];
  hasMeasurement: boolean;
  measurement: { label: string; unit: string; mode: "range" | "tolerance"; min: string; max: string; nominal: string; tolerance: string };
  calculator: CalculatorSlug | "";
  inspectionPoint: boolean;
  calibratedTool: boolean;
  /** The standard's element codes, comma-separated as typed. */
  elements: string;
  timerMinutes: string;
}

export interface CardForm {
  title: string;
  applicability: string;
  ataChapter: string;
  subjectId: string;
  estimatedMinutes: string;
  tools: string;
  consumables: string;
  protectiveEquipment: string;
  steps: StepField[];
}

const lines = (text: string) =>
  text
    .split("\n")
    .map((s) => s.trim())
    .filter(Boolean);
const codesOf = (text: string) =>
  text
    .split(/[,\s]+/)
    .map((c) => c.trim().toUpperCase())
    .filter(Boolean);
const numberOrNull = (text: string) => (text.trim() ? parseNumber(text) : null);

export function emptyStep(): StepField {
  return {
    uid: crypto.randomUUID(),
    text: "",
    notices: [],
    references: [],
    hasMeasurement: false,
    measurement: { label: "", unit: "in", mode: "range", min: "", max: "", nominal: "", tolerance: "" },
    calculator: "",
    inspectionPoint: false,
    calibratedTool: false,
    elements: "",
    timerMinutes: "",
  };
}

export function fromVersion(v: CardVersionDto): CardForm {
  return {
    title: v.title,
    applicability: v.applicability.join(", "),
    ataChapter: v.ataChapter,
    subjectId: v.subjectId ?? "",
    estimatedMinutes: v.estimatedMinutes?.toString() ?? "",
    tools: v.tools.join("\n"),
    consumables: v.consumables.join("\n"),
    protectiveEquipment: v.protectiveEquipment.join("\n"),
    steps: v.steps.map((s) => {
      const m = s.measurement;
      const tolerance = m?.nominal != null && m.tolerance != null;
      return {
        uid: s.id,
        text: s.text,
        notices: s.notices,
        references: s.references.map((r) => ({ ...r })),
        hasMeasurement: !!m,
        measurement: {
          label: m?.label ?? "",
          unit: m?.unit ?? "in",
          mode: tolerance ? "tolerance" : "range",
          min: m?.min?.toString() ?? "",
          max: m?.max?.toString() ?? "",
          nominal: m?.nominal?.toString() ?? "",
          tolerance: m?.tolerance?.toString() ?? "",
        },
        calculator: s.calculator ?? "",
        inspectionPoint: s.inspectionPoint,
        calibratedTool: s.calibratedTool,
        elements: s.elements.join(", "),
        timerMinutes: s.timerMinutes?.toString() ?? "",
      };
    }),
  };
}

function measurementOf(s: StepField) {
  if (!s.hasMeasurement) return null;
  const m = s.measurement;
  return m.mode === "tolerance"
    ? { label: m.label, unit: m.unit, nominal: numberOrNull(m.nominal), tolerance: numberOrNull(m.tolerance) }
    : { label: m.label, unit: m.unit, min: numberOrNull(m.min), max: numberOrNull(m.max) };
}

export function toContent(form: CardForm): CardContentInput {
  return {
    title: form.title,
    applicability: form.applicability
      .split(",")
      .map((s) => s.trim())
      .filter(Boolean),
    ataChapter: form.ataChapter.trim(),
    subjectId: form.subjectId || null,
    estimatedMinutes: form.estimatedMinutes.trim() ? Math.round(Number(form.estimatedMinutes)) : null,
    tools: lines(form.tools),
    consumables: lines(form.consumables),
    protectiveEquipment: lines(form.protectiveEquipment),
    steps: form.steps.map((s) => ({
      id: s.uid,
      text: s.text,
      notices: s.notices.filter((n) => n.text.trim()),
      references: s.references.map((r) => ({ revisionId: r.revisionId, page: r.page, quote: r.quote })),
      measurement: measurementOf(s),
      calculator: s.calculator || null,
      inspectionPoint: s.inspectionPoint,
      calibratedTool: s.calibratedTool,
      elements: codesOf(s.elements),
      timerMinutes: numberOrNull(s.timerMinutes),
    })),
  };
}

/** What the student will see, built from the form without a round trip. */
export function toPreview(form: CardForm, base: CardVersionDto, subjectName: string | null): CardVersionDto {
  const content = toContent(form);
  return {
    ...base,
    status: "draft",
    title: content.title ?? "",
    applicability: content.applicability ?? [],
    ataChapter: content.ataChapter ?? "",
    subjectId: content.subjectId ?? null,
    subjectName,
    estimatedMinutes: content.estimatedMinutes ?? null,
    tools: content.tools ?? [],
    consumables: content.consumables ?? [],
    protectiveEquipment: content.protectiveEquipment ?? [],
    steps: form.steps.map((s): StepDto => {
      const m = measurementOf(s);
      const usable =
        m &&
        m.unit &&
        ((m.min ?? null) !== null || (m.max ?? null) !== null || ((m.nominal ?? null) !== null && (m.tolerance ?? null) !== null));
      return {
        id: s.uid,
        text: s.text,
        notices: s.notices.filter((n) => n.text.trim()),
        references: s.references.map((r) => ({ ...r })),
        measurement: usable
          ? {
              label: m.label || "Measured value",
              unit: m.unit,
              min: m.min ?? null,
              max: m.max ?? null,
              nominal: m.nominal ?? null,
              tolerance: m.tolerance ?? null,
            }
          : null,
        calculator: s.calculator || null,
        inspectionPoint: s.inspectionPoint,
        calibratedTool: s.calibratedTool,
        elements: codesOf(s.elements),
        timerMinutes: numberOrNull(s.timerMinutes),
        underRecheck: base.steps.find((b) => b.id === s.uid)?.underRecheck ?? false,
      };
    }),
  };
}
