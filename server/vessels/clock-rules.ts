// The ship's clock on passage (issue 14): which zones may be kept and how they are said. Pure.
// A ship sets its clocks to the zone of the waters it is in (common practice: whole hours, usually
// at night, an hour at a time), so the form offers whole-hour offsets; a zone name such as
// Asia/Kolkata (UTC+5:30) is taken too.

/** Whole-hour offsets from UTC−12 to UTC+14, the range of the world's zones. */
export const CLOCK_OFFSETS = Array.from({ length: 27 }, (_, i) => i - 12);

/** "UTC+7" → "Etc/GMT-7" (the IANA name's sign is the other way round); "UTC" → "UTC". */
export function offsetZone(hours: number): string {
  if (hours === 0) return "UTC";
  return `Etc/GMT${hours > 0 ? "-" : "+"}${Math.abs(hours)}`;
}

function knownZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat("en", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/**
 * The zone a person typed or picked: "UTC", "UTC+7", "UTC-3", "utc +10" or an IANA name
 * ("Asia/Singapore"); null when it is neither.
 */
export function zoneFromInput(text: string): string | null {
  const t = text.trim();
  const offset = /^(?:UTC|GMT)\s*([+-−])\s*(\d{1,2})(?::00)?$/i.exec(t);
  if (offset) {
    const hours = Number(offset[2]) * (offset[1] === "+" ? 1 : -1);
    return hours >= -12 && hours <= 14 ? offsetZone(hours) : null;
  }
  if (/^(UTC|GMT|Z)$/i.test(t)) return "UTC";
  // The name as the person wrote it: ICU would turn Asia/Kolkata back into Asia/Calcutta.
  return /^[A-Za-z][A-Za-z0-9_+\-/]{1,63}$/.test(t) && knownZone(t) ? t : null;
}

/** "Etc/GMT-7" → "UTC+7"; "UTC" → "UTC"; a zone name stays as it is. */
export function zoneWords(zone: string): string {
  const m = /^Etc\/GMT([+-])(\d{1,2})$/.exec(zone);
  if (m) return `UTC${m[1] === "-" ? "+" : "−"}${m[2]}`;
  if (zone === "Etc/UTC" || zone === "Etc/GMT") return "UTC";
  return zone;
}

/** The zone's offset from UTC at an instant, in minutes (east positive). */
export function offsetMinutes(zone: string, at: Date): number {
  const parts = new Intl.DateTimeFormat("en-US", {
    timeZone: zone,
    hourCycle: "h23",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
  }).formatToParts(at);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value);
  const local = Date.UTC(get("year"), get("month") - 1, get("day"), get("hour"), get("minute"));
  return Math.round((local - Math.floor(at.getTime() / 60_000) * 60_000) / 60_000);
}

/** "Clocks go back 1 h", "Clocks go forward 30 min", "Same time, another zone". */
export function clockMoveWords(fromZone: string, toZone: string, at: Date): string {
  const minutes = offsetMinutes(toZone, at) - offsetMinutes(fromZone, at);
  if (minutes === 0) return "Same time, another zone";
  const size = Math.abs(minutes);
  const amount = size % 60 === 0 ? `${size / 60} h` : size > 60 ? `${Math.floor(size / 60)} h ${size % 60} min` : `${size} min`;
  return `Clocks go ${minutes > 0 ? "forward" : "back"} ${amount}`;
}

export type ClockChangePoint = { effectiveAt: Date; fromTimeZone: string; timeZone: string };

/**
 * The zone the ship kept at each instant, from its clock changes (any order) and the zone it keeps
 * now: the zone of the last change at or before the instant; before the first change, the zone
 * that change left. A past reading is shown on the clock it was read by.
 */
export function zoneAtFrom(changes: readonly ClockChangePoint[], zoneNow: string): (at: Date) => string {
  const sorted = [...changes].sort((a, b) => a.effectiveAt.getTime() - b.effectiveAt.getTime());
  if (sorted.length === 0) return () => zoneNow;
  return (at) => {
    let zone = sorted[0]!.fromTimeZone;
    for (const c of sorted) {
      if (c.effectiveAt <= at) zone = c.timeZone;
      else break;
    }
    return zone;
  };
}
