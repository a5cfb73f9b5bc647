// Fast ship's-day arithmetic for loops over many instants: one cached Intl formatter per time
// zone instead of a TZDate per step (ten times faster on a 90-day series).

type Parts = { y: number; m: number; d: number; h: number; mi: number; s: number };

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-CA", {
      timeZone,
      hourCycle: "h23",
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      second: "2-digit",
    });
    formatters.set(timeZone, f);
  }
  return f;
}

function localParts(ms: number, timeZone: string): Parts {
  const p: Record<string, number> = {};
  for (const part of formatter(timeZone).formatToParts(ms)) {
    if (part.type !== "literal") p[part.type] = Number(part.value);
  }
  return { y: p.year!, m: p.month!, d: p.day!, h: p.hour!, mi: p.minute!, s: p.second! };
}

/** "YYYY-MM-DD" of the ship's day an instant falls on. */
export function shipDayKey(ms: number, timeZone: string): string {
  const { y, m, d } = localParts(ms, timeZone);
  return `${y}-${String(m).padStart(2, "0")}-${String(d).padStart(2, "0")}`;
}

/** The instant of the ship's midnight that starts the day `ms` falls on, across DST changes. */
export function startOfShipDay(ms: number, timeZone: string): number {
  const p = localParts(ms, timeZone);
  let candidate = ms - ((p.h * 60 + p.mi) * 60 + p.s) * 1000 - (((ms % 1000) + 1000) % 1000);
  // A clock change since midnight leaves the candidate an hour off: correct it to 00:00.
  const q = localParts(candidate, timeZone);
  const minutes = q.h * 60 + q.mi;
  if (minutes !== 0) candidate += (q.h >= 12 ? 24 * 60 - minutes : -minutes) * 60_000;
  return candidate;
}

/** The ship's midnight that ends the day `ms` falls on (days are 23, 24 or 25 hours long). */
export function endOfShipDay(ms: number, timeZone: string): number {
  return startOfShipDay(startOfShipDay(ms, timeZone) + 25 * 3_600_000, timeZone);
}
