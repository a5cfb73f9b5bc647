// A defect's state, pure: it follows its work, never typed in. Closed once the chief engineer has
// closed it with its cause and action; done while the repair's completion waits for the chief (or
// was approved); planned once it has a target day; reported before that. A completion returned for
// correction puts it back to planned.
import type { DefectState } from "./contract";

export type DefectFacts = {
  closedAt: Date | null;
  /** The work order's due instant: set when the defect is planned. */
  dueDate: Date | null;
  completion: "awaiting-approval" | "approved" | "returned" | null;
};

export function defectState(f: DefectFacts): DefectState {
  if (f.closedAt) return "closed";
  if (f.completion === "awaiting-approval" || f.completion === "approved") return "done";
  if (f.dueDate) return "planned";
  return "reported";
}

/** Why the chief cannot close it yet, or null: the repair is recorded, the cause and action said. */
export function closeProblems(input: { cause: string; action: string }): { field: string; message: string }[] {
  const problems = [];
  if (input.cause.trim().length < 3) problems.push({ field: "cause", message: "Say what caused the defect before closing it (ISM Code §9: the cause is found)." });
  if (input.action.trim().length < 3) problems.push({ field: "action", message: "Say what was done to prevent it again before closing it." });
  return problems;
}
