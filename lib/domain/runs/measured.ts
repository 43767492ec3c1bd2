// What a record says of a run's measured steps: the reading that counts, the limit as the card
// version states it, and the verdict. Pure: the server folds the run, this reads the fold.
import { describeLimit, type Judgement } from "@/lib/domain/calc/limits";
import type { Measurement } from "@/lib/domain/validation/cards";
import type { StepState } from "@/lib/domain/runs/fold";

export type Verdict = "within_limits" | "out_of_limits" | "not_understood" | "not_recorded";

/** The verdict in the words the cart and the review screen use. */
export const verdictWords: Record<Verdict, string> = {
  within_limits: "within limits",
  out_of_limits: "OUT OF LIMITS",
  not_understood: "not understood",
  not_recorded: "no reading recorded",
};

export function verdictOf(judgement: Judgement | null | undefined): Verdict {
  if (!judgement) return "not_recorded";
  return judgement.status === "in" ? "within_limits" : judgement.status === "out" ? "out_of_limits" : "not_understood";
}

export interface MeasuredValue {
  stepId: string;
  /** 1-based, as the card numbers its steps. */
  stepNumber: number;
  /** The step's instruction as plain text. */
  stepText: string;
  /** What is measured, as the card version says it. */
  label: string;
  /** The limit exactly as the card version's measurement states it, and in words. */
  limit: { unit: string; nominal: number | null; tolerance: number | null; min: number | null; max: number | null; text: string };
  /** The reading that counts, as typed on the cart; null when none was recorded. */
  value: string | null;
  /** When the cart recorded it (the cart's clock). */
  recordedAt: string | null;
  /** The precision tool it was taken with, by its tool-room number: which wrench torqued this nut. */
  toolNumber: string | null;
  verdict: Verdict;
}

/** One line per step that measures something, in step order; `steps` are the card version's. */
export function measuredValues(
  steps: readonly { id: string; text: string; measurement: Measurement | null }[],
  states: Readonly<Record<string, StepState | undefined>>,
): MeasuredValue[] {
  return steps.flatMap((step, i) => {
    const m = step.measurement;
    if (!m) return [];
    const reading = states[step.id]?.value ?? null;
    return [
      {
        stepId: step.id,
        stepNumber: i + 1,
        stepText: step.text,
        label: m.label,
        limit: {
          unit: m.unit,
          nominal: m.nominal ?? null,
          tolerance: m.tolerance ?? null,
          min: m.min ?? null,
          max: m.max ?? null,
          text: describeLimit(m),
        },
        value: reading?.text ?? null,
        recordedAt: reading?.at ?? null,
        toolNumber: reading?.tool ?? null,
        verdict: verdictOf(reading?.judgement),
      },
    ];
  });
}

/** "Step 3, Edge distance: 0.375 in (limits 0.25 to 0.5 in), within limits": one measured value in a line. */
export function measuredValueLine(m: MeasuredValue): string {
  const tool = m.toolNumber ? `, with ${m.toolNumber}` : "";
  return `Step ${m.stepNumber}, ${m.label}: ${m.value ?? "-"} (limits ${m.limit.text}), ${verdictWords[m.verdict]}${tool}`;
}
