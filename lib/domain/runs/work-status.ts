// "My work" status (pure): a run not yet handed in whose due date has passed is overdue.
import type { WorkStatus } from "@/lib/contracts/runs";
import type { RunStatus } from "@/lib/domain/runs/fold";

export function workStatusOf(status: RunStatus, dueOn: string | null, today = new Date().toISOString().slice(0, 10)): WorkStatus {
  const handedIn = status === "submitted" || status === "signed_off";
  return !handedIn && dueOn && dueOn < today ? "overdue" : status;
}
