// Keelson's one date style, "21 Jun 2026", for screens, mail and printouts alike (CSV keeps ISO
// days for spreadsheets). Pure and zone-free: the caller gives a ship's day key or a UTC instant.
const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** "2026-06-21" → "21 Jun 2026"; anything else is returned as it came. */
export function formatDayKey(day: string): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(day);
  if (!m) return day;
  return `${Number(m[3])} ${MONTHS[Number(m[2]) - 1]} ${m[1]}`;
}

/** An instant on the UTC clock: "21 Jun 2026 14:03 UTC". */
export function formatUtcTime(instant: Date | string): string {
  const iso = new Date(instant).toISOString();
  return `${formatDayKey(iso.slice(0, 10))} ${iso.slice(11, 16)} UTC`;
}

/** "2026-09-16" → "16 Sep": a chart's axis, where the year is said once beside it. */
export function formatDayMonth(day: string): string {
  return formatDayKey(day).replace(/ \d{4}$/, "");
}
