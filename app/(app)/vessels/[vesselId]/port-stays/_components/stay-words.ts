// How the port-stay pages write a stay's dates, hours, engine stop, crew and people.
import { format, parseISO } from "date-fns";
import type { CrewOnBoard } from "@/db/schema/port-stays";
import { formatShipTime } from "@/server/format/hours";
import type { PortStayView } from "@/server/port-stays/contract";
import type { RankWords } from "@/server/routines/rank-names";

/** "4 Dec 2026 07:00 – 5 Dec 2026 19:00 (ship's time)" */
export function stayPeriod(arrivesAt: string, departsAt: string, timeZone: string): string {
  return `${formatShipTime(new Date(arrivesAt), timeZone)} – ${formatShipTime(new Date(departsAt), timeZone)}`;
}

/** A ship's day "2026-12-04" → "Fri 4 Dec". */
export function dayLabel(day: string): string {
  return format(parseISO(day), "EEE d MMM");
}

/** A ship's clock value "2026-12-04T07:00" → "Fri 4 Dec 07:00". */
export function shipClockLabel(local: string): string {
  return `${dayLabel(local.slice(0, 10))} ${local.slice(11, 16)}`;
}

export function engineStopWords(stop: PortStayView["engineStop"]): string {
  return stop
    ? `may be immobilised ${shipClockLabel(stop.fromLocal)} – ${shipClockLabel(stop.toLocal)}`
    : "on standby throughout (no engine-stop work)";
}

export function crewWords(crew: CrewOnBoard[], { label }: RankWords): string {
  const on = crew.filter((c) => c.count > 0);
  return on.length === 0 ? "none entered: nothing can be planned" : on.map((c) => `${c.count} × ${label(c.rank)}`).join(" · ");
}

/** A person key "motorman#2" → "Motorman 2"; the only one of a rank keeps the bare rank. */
export function personLabel(key: string, { label }: RankWords, crew?: CrewOnBoard[]): string {
  const [rank = key, n = "1"] = key.split("#");
  const heads = crew?.find((c) => c.rank === rank)?.count ?? 2;
  return heads <= 1 ? label(rank) : `${label(rank)} ${n}`;
}

/** The caution every engine-stop job carries, in the words of the routine cautions. */
export const ENGINE_STOP_CAUTION =
  "Engine-stop work needs the usual isolation, lock-out and permit to work; the maker’s instruction manual, company procedures and class requirements prevail.";
