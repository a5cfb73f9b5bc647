import { format, parseISO } from "date-fns";
import { formatHours } from "@/server/format/hours";

/** "2027-01-15" → "15 Jan 2027": a ship's day key has no zone, so it is read and written as is. */
export function dayWords(key: string): string {
  return format(parseISO(key), "d MMM yyyy");
}

/** The proposed limits of a request in words: "15 Jan 2027 · 24,500 h". */
export function proposedWords(d: { proposedDueDay: string | null; proposedDueHours: number | null }): string {
  return [
    d.proposedDueDay && dayWords(d.proposedDueDay),
    d.proposedDueHours !== null && formatHours(d.proposedDueHours),
  ]
    .filter(Boolean)
    .join(" · ");
}
