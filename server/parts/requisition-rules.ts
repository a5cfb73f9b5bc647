// A requisition's flow and a port stay's parts, pure. The chief engineer drafts and sends; the
// office orders; the parts are received on board line by line (then it is delivered); the one who
// holds it may cancel it. What a stay's jobs need is set against what is on board and on order.
import type { RequisitionState } from "@/db/schema/parts";
import { isLow, q3 } from "./stock";

export type Holder = { plan: boolean; order: boolean };

/** The moves a person may make by hand (delivered comes from receiving the parts). */
const MOVES: Record<RequisitionState, Partial<Record<RequisitionState, keyof Holder | "either">>> = {
  drafted: { sent: "plan", cancelled: "plan" },
  sent: { ordered: "order", cancelled: "either" },
  ordered: { cancelled: "order" },
  delivered: {},
  cancelled: {},
};

export const STATE_WORDS: Record<RequisitionState, string> = {
  drafted: "Drafted on board",
  sent: "Sent to the office",
  ordered: "Ordered by the office",
  delivered: "Delivered",
  cancelled: "Cancelled",
};

export const OPEN_REQUISITION_STATES: readonly RequisitionState[] = ["drafted", "sent", "ordered"];

/** Why this person cannot move it from one state to the other, or null. */
export function moveProblem(from: RequisitionState, to: RequisitionState, may: Holder): string | null {
  const who = MOVES[from][to];
  if (!who) {
    if (to === "delivered") return "A requisition is delivered by receiving its parts into the stores.";
    return `A requisition ${STATE_WORDS[from].toLowerCase()} cannot become ${STATE_WORDS[to].toLowerCase()}.`;
  }
  if (who === "either" ? may.plan || may.order : may[who]) return null;
  return who === "order" ? "The office orders it (superintendent or administrator)." : "The vessel’s chief engineer does that.";
}

/** Received in full on every line (more than asked counts as in full). */
export function fullyReceived(lines: readonly { quantity: number; received: number }[]): boolean {
  return lines.length > 0 && lines.every((l) => l.received >= l.quantity);
}

export type Need = { partId: string; quantity: number; job: string };
export type PartFacts = { minimumOnBoard: number };
export type ShortLine = {
  partId: string;
  /** The stay's jobs that need it, by number. */
  jobs: string[];
  needed: number;
  onBoard: number;
  onOrder: number;
  /** Needed and not on board. */
  short: number;
  /** Short, or under its minimum after the jobs, less what is already on order: what to ask for. */
  toOrder: number;
  /** On board below the minimum the company set. */
  low: boolean;
};

/**
 * The parts a stay's jobs need against what is on board and what open requisitions already ask
 * for; with `keepMinimum`, what brings each part back to its minimum after the jobs is asked too.
 */
export function stayShortfalls(
  needs: readonly Need[],
  parts: ReadonlyMap<string, PartFacts>,
  onBoard: ReadonlyMap<string, number>,
  onOrder: ReadonlyMap<string, number>,
  keepMinimum: boolean,
): ShortLine[] {
  const byPart = new Map<string, { needed: number; jobs: string[] }>();
  for (const n of needs) {
    const at = byPart.get(n.partId) ?? { needed: 0, jobs: [] };
    at.needed = q3(at.needed + n.quantity);
    if (!at.jobs.includes(n.job)) at.jobs.push(n.job);
    byPart.set(n.partId, at);
  }
  if (keepMinimum) {
    for (const [partId, p] of parts) {
      if (!byPart.has(partId) && isLow(onBoard.get(partId) ?? 0, p.minimumOnBoard)) byPart.set(partId, { needed: 0, jobs: [] });
    }
  }
  return [...byPart].map(([partId, { needed, jobs }]) => {
    const held = Math.max(0, onBoard.get(partId) ?? 0);
    const ordered = onOrder.get(partId) ?? 0;
    const minimum = keepMinimum ? (parts.get(partId)?.minimumOnBoard ?? 0) : 0;
    const short = Math.max(0, q3(needed - held));
    const wanted = Math.max(0, q3(needed + minimum - held));
    return { partId, jobs, needed, onBoard: held, onOrder: ordered, short, toOrder: Math.max(0, q3(wanted - ordered)), low: isLow(held, parts.get(partId)?.minimumOnBoard ?? 0) };
  });
}
