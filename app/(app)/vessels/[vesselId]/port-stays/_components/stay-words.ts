// How the port-stay pages write a stay's dates, hours and ranks.
import { format, parseISO } from "date-fns";
import { formatHours, formatShipTime } from "@/server/format/hours";

export { rankLabel } from "@/app/_components/rank-words";

/** "4 Dec 2026 07:00 – 5 Dec 2026 19:00 (ship's time)" */
export function stayPeriod(arrivesAt: string, departsAt: string, timeZone: string): string {
  return `${formatShipTime(new Date(arrivesAt), timeZone)} – ${formatShipTime(new Date(departsAt), timeZone)}`;
}

/** A ship's day "2026-12-04" → "Fri 4 Dec". */
export function dayLabel(day: string): string {
  return format(parseISO(day), "EEE d MMM");
}

export function immobilisationWords(engineMayStop: boolean, hours: number): string {
  return engineMayStop ? `main engine may be immobilised for ${formatHours(hours)}` : "main engine on standby throughout";
}
