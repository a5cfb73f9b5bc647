// Stock on board is the sum of its movements (nothing is edited in place): the rules that keep it
// so, pure. A movement that would take a location below zero is refused with the words that send
// the person to count it; a count is stored as the difference it makes.
import type { PartUnit } from "@/db/schema/parts";
import { amountText, WHOLE_UNITS } from "./contract";

export type Movement = { locationId: string; quantity: number };

/** Rounded to the thousandth the columns keep, so 0.1 + 0.2 is 0.3. */
export const q3 = (n: number) => Math.round(n * 1000) / 1000;

/** What each location holds: the sum of its movements. */
export function stockByLocation(movements: readonly Movement[]): Map<string, number> {
  const out = new Map<string, number>();
  for (const m of movements) out.set(m.locationId, q3((out.get(m.locationId) ?? 0) + m.quantity));
  return out;
}

export function onBoard(movements: readonly Movement[]): number {
  return q3(movements.reduce((sum, m) => sum + m.quantity, 0));
}

/** Under the minimum the company set; a part with no minimum is never low. */
export function isLow(quantity: number, minimum: number): boolean {
  return minimum > 0 && quantity < minimum;
}

export type Refusal = { field: string; message: string };

/** Why this unit cannot hold this quantity, or null. */
export function unitProblem(unit: PartUnit, quantity: number, field: string): Refusal | null {
  if (WHOLE_UNITS.includes(unit) && !Number.isInteger(quantity)) {
    return { field, message: `This part is counted in whole ${unit === "set" ? "sets" : "pieces"}; enter a whole number.` };
  }
  return null;
}

/** Taking `quantity` out of a location holding `available`: refused, never silently below zero. */
export function takeProblem(available: number, quantity: number, place: string, unit: PartUnit, field = "quantity"): Refusal | null {
  if (quantity <= available) return null;
  return {
    field,
    message:
      available > 0
        ? `Only ${amountText(available, unit)} recorded at ${place}, not ${quantity}. If more is on the shelf, count it first (a count correction with its reason).`
        : `Nothing is recorded at ${place}. If the part is on the shelf, count it first (a count correction with its reason).`,
  };
}

/** The movement a count makes: the difference from what was recorded, or null when they agree. */
export function countDifference(recorded: number, counted: number): number | null {
  const diff = q3(counted - recorded);
  return diff === 0 ? null : diff;
}

/**
 * Where `amount` is taken from when a job uses it: the locations holding most first, each emptied
 * before the next, so a job's parts come off as few shelves as possible. Takes no more than is held;
 * what is left over is the caller's refusal.
 */
export function drawFrom(held: ReadonlyMap<string, number>, amount: number): { locationId: string; quantity: number }[] {
  const out: { locationId: string; quantity: number }[] = [];
  let left = q3(amount);
  const shelves = [...held].filter(([, q]) => q > 0).sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]));
  for (const [locationId, quantity] of shelves) {
    if (left <= 0) break;
    const take = q3(Math.min(quantity, left));
    out.push({ locationId, quantity: take });
    left = q3(left - take);
  }
  return out;
}
