// What goes into each reminder and who gets it. Pure: the run (run.ts) loads the rows, these
// functions choose.
import { asksAttention, type WorkOrderState } from "@/db/schema/work-order-states";
import type { Role } from "@/server/auth/roles";
import { shipDayKey } from "@/server/format/ship-day";
import type { DigestOccasion, MissingReadingsStep } from "./schedule";

export type { WorkOrderState };

export type Member = {
  userId: string;
  email: string;
  name: string;
  role: Role;
  /** A disabled user (better-auth's ban) gets nothing. */
  banned: boolean;
  /** The vessels the user is assigned to (seagoing roles); office roles see the whole fleet anyway. */
  vesselIds: string[];
};

export type DigestWorkOrder = {
  id: string;
  number: string;
  title: string;
  state: WorkOrderState;
  dueDate: Date | null;
  deferredDueDate: Date | null;
  deferredDueHours: number | null;
  critical: boolean;
  classRelated: boolean;
};

export type StateChangeRow = { workOrderId: string; toState: WorkOrderState; changedAt: Date };

export type DigestItem = DigestWorkOrder & {
  /** The ship's day the work is due ("2026-12-04"), or null for work due by hours only. */
  dueDay: string | null;
};

export type DigestSelection = {
  outOfTolerance: DigestItem[];
  late: DigestItem[];
  windowOpen: DigestItem[];
  /** Open work due on the digest's day or the 6 after it, not already listed above. */
  dueSoon: DigestItem[];
};

/**
 * The limit the work is due by: an approved deferral's date replaces the computed one; a deferral
 * to running hours only leaves no date (the computed one no longer binds).
 */
export function effectiveDueDate(w: Pick<DigestWorkOrder, "dueDate" | "deferredDueDate" | "deferredDueHours">) {
  if (w.deferredDueDate) return w.deferredDueDate;
  if (w.deferredDueHours !== null) return null;
  return w.dueDate;
}

export function toDigestItem(w: DigestWorkOrder, timeZone: string): DigestItem {
  const due = effectiveDueDate(w);
  return { ...w, dueDay: due ? shipDayKey(due.getTime(), timeZone) : null };
}

function byDueThenNumber(a: DigestItem, b: DigestItem): number {
  const da = a.dueDay ?? "9999-12-31";
  const db = b.dueDay ?? "9999-12-31";
  return da < db ? -1 : da > db ? 1 : a.number.localeCompare(b.number);
}

/**
 * A vessel's digest for one ship's day:
 * - each work order whose state changed into window-open, late or out-of-tolerance after the
 *   previous digest's cut-off and up to this one's (so every change is in exactly one digest),
 *   listed under the state of its latest such change, provided it still asks for attention now
 *   (work done or deferred since is not news any more);
 * - open work (not done) due on the digest's ship's day or the six after it, unless listed above.
 */
export function selectDigest(input: {
  occasion: DigestOccasion;
  timeZone: string;
  changes: StateChangeRow[];
  workOrders: DigestWorkOrder[];
}): DigestSelection {
  const { occasion, timeZone } = input;
  const from = occasion.previousCutOff.getTime();
  const until = occasion.cutOff.getTime();
  const latestChange = new Map<string, StateChangeRow>();
  for (const c of input.changes) {
    const at = c.changedAt.getTime();
    if (at <= from || at > until || !asksAttention(c.toState)) continue;
    const seen = latestChange.get(c.workOrderId);
    if (!seen || seen.changedAt.getTime() < at) latestChange.set(c.workOrderId, c);
  }

  const selection: DigestSelection = { outOfTolerance: [], late: [], windowOpen: [], dueSoon: [] };
  for (const w of input.workOrders) {
    const item = toDigestItem(w, timeZone);
    const change = latestChange.get(w.id);
    if (change && asksAttention(w.state)) {
      if (change.toState === "out-of-tolerance") selection.outOfTolerance.push(item);
      else if (change.toState === "late") selection.late.push(item);
      else selection.windowOpen.push(item);
      continue;
    }
    if (w.state !== "done" && item.dueDay && item.dueDay >= occasion.dueFrom && item.dueDay <= occasion.dueUntil) {
      selection.dueSoon.push(item);
    }
  }
  for (const list of Object.values(selection)) list.sort(byDueThenNumber);
  return selection;
}

export function isEmptyDigest(selection: DigestSelection): boolean {
  return Object.values(selection).every((list) => list.length === 0);
}

export type EscalationCandidate = {
  id: string;
  changedAt: Date;
  /** The work order's state now. */
  workOrderState: WorkOrderState;
};

/** Escalations are sent for changes at most this old; older ones are only marked handled. */
export const ESCALATION_MAX_AGE_DAYS = 7;

/**
 * Splits unhandled changes into out-of-tolerance into those to send and those only to mark:
 * - older than 7 days: the change happened before mail was switched on (or while the worker was
 *   down for a week); a message about it now would be stale news, a flood on the first run over a
 *   database with history, and the digest and the Backlog show the work anyway;
 * - the work order is no longer out of tolerance (done or deferred since): nothing to act on.
 * Changes stamped after `now` are left for a later run.
 */
export function splitEscalations(
  candidates: EscalationCandidate[],
  now: Date,
): { send: EscalationCandidate[]; markOnly: EscalationCandidate[] } {
  const oldest = now.getTime() - ESCALATION_MAX_AGE_DAYS * 86_400_000;
  const send: EscalationCandidate[] = [];
  const markOnly: EscalationCandidate[] = [];
  for (const c of candidates) {
    const at = c.changedAt.getTime();
    if (at > now.getTime()) continue;
    if (at < oldest || c.workOrderState !== "out-of-tolerance") markOnly.push(c);
    else send.push(c);
  }
  return { send, markOnly };
}

const active = (members: Member[]) => members.filter((m) => !m.banned);
const assignedTo = (vesselId: string) => (m: Member) => m.vesselIds.includes(vesselId);

/** The vessel's engineers and chief engineers (assigned to it). */
export function digestRecipients(members: Member[], vesselId: string): Member[] {
  return active(members).filter(
    (m) => (m.role === "engineer" || m.role === "chief-engineer") && assignedTo(vesselId)(m),
  );
}

/** Step 1: the vessel's engineers; step 2: its chief engineer(s); step 3: the superintendents. */
export function missingReadingsRecipients(members: Member[], vesselId: string, step: MissingReadingsStep): Member[] {
  const people = active(members);
  if (step === 1) return people.filter((m) => m.role === "engineer" && assignedTo(vesselId)(m));
  if (step === 2) return people.filter((m) => m.role === "chief-engineer" && assignedTo(vesselId)(m));
  return people.filter((m) => m.role === "superintendent");
}

/** The chief engineer(s) assigned to the vessel and every superintendent. */
export function escalationRecipients(members: Member[], vesselId: string): Member[] {
  return active(members).filter(
    (m) => m.role === "superintendent" || (m.role === "chief-engineer" && assignedTo(vesselId)(m)),
  );
}

export function fleetSummaryRecipients(members: Member[]): Member[] {
  return active(members).filter((m) => m.role === "superintendent");
}
