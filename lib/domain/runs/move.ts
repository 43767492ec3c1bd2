// Moving an open run to a newer version of its card, after a recheck: work on a step that did not
// change is kept, a step that changed is done again. Pure: the caller reads the two versions and
// the rechecks the new manual revision raised on the old one.
import type { Step } from "@/lib/domain/validation/cards";

/** What a student follows on a step, apart from where its citations point. */
const whatIsDone = (s: Step) =>
  JSON.stringify([s.text, s.notices, s.measurement, s.calculator, s.inspectionPoint, s.timerMinutes, s.references.map((r) => r.quote)]);

export interface StepMove {
  /** Steps of the new version whose work on the old one stands. */
  kept: string[];
  /** Steps of both versions that changed (their words, limits, notices, or a cited page's content): done again. */
  restarted: string[];
  /** Steps only the new version has. */
  added: string[];
  /** Steps only the old version had: their work no longer counts. */
  removed: string[];
}

/**
 * Compares two versions step by step (a step keeps its id from version to version). `recheckedSteps`
 * are the old version's steps whose cited page changed or went in a newer manual revision: those are
 * done again even when the card's words did not change, since the manual they follow did. A citation
 * that only followed an unchanged or moved page to the new revision does not restart its step.
 */
export function compareSteps(oldSteps: readonly Step[], newSteps: readonly Step[], recheckedSteps: ReadonlySet<string>): StepMove {
  const before = new Map(oldSteps.map((s) => [s.id, s]));
  const after = new Set(newSteps.map((s) => s.id));
  const move: StepMove = { kept: [], restarted: [], added: [], removed: oldSteps.filter((s) => !after.has(s.id)).map((s) => s.id) };
  for (const step of newSteps) {
    const old = before.get(step.id);
    if (!old) move.added.push(step.id);
    else if (recheckedSteps.has(step.id) || whatIsDone(old) !== whatIsDone(step)) move.restarted.push(step.id);
    else move.kept.push(step.id);
  }
  return move;
}
