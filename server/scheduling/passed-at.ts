// When a counter passed a value of hours, from its readings: the due date of hours-based work past
// its due point is the day the counter passed the due hours, and it stays there — projecting it
// back from the latest reading at the running rate moved it with every reading (issue 14).
export type ReadingPoint = { at: Date; totalHours: number };

/**
 * The instant the counter reached `hours`, between the last reading below it and the first at or
 * above it, on the straight line between the two (the hours ran evenly between two rounds: the
 * same assumption as the running rate). No reading below it: the first reading at or above it.
 */
export function passedAt(hours: number, below: ReadingPoint | null, reached: ReadingPoint | null): Date | null {
  if (!reached) return null;
  if (!below || reached.totalHours <= below.totalHours) return reached.at;
  const share = (hours - below.totalHours) / (reached.totalHours - below.totalHours);
  return new Date(below.at.getTime() + Math.round(share * (reached.at.getTime() - below.at.getTime())));
}

/** The key of one question "when did this counter pass these hours". */
export const passedKey = (counterId: string, hours: number) => `${counterId}:${hours.toFixed(1)}`;
