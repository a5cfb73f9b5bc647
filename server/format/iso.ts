/** An instant as JSON carries it; null stays null. */
export function isoInstant(at: Date | null): string | null {
  return at ? at.toISOString() : null;
}
