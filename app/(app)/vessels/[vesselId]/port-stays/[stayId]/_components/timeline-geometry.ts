// Where things sit on the stay's timeline: time runs across, each ship's day's working hours wide
// and the hours outside them narrow (nothing is planned there, but watches and the engine stop may
// run through them), one lane per person. Pure, so it is tested on its own (timeline-geometry.test.ts).
import type { CrewOnBoard } from "@/db/schema/port-stays";
import { instantOfShipTime } from "@/server/format/hours";
import { RANK_LABEL } from "@/app/_components/rank-words";

export const HOUR_PX = 44;
/** An hour outside the working day: wide enough to see a watch, too narrow to read. */
export const OFF_HOUR_PX = 3;

export type AxisPiece = { day: string; from: number; to: number; x: number; width: number; working: boolean };
export type Axis = { pieces: AxisPiece[]; width: number; from: number; to: number };

type AxisInput = { days: string[]; workdayFrom: string; workdayTo: string; arrivesAt: string; departsAt: string; timeZone: string };

/** The stay's time, arrival to departure, as pieces of the x axis: off-hours, working day, off-hours per day. */
export function buildAxis(stay: AxisInput, hourPx = HOUR_PX, offHourPx = OFF_HOUR_PX): Axis {
  const start = Date.parse(stay.arrivesAt);
  const end = Date.parse(stay.departsAt);
  const pieces: AxisPiece[] = [];
  let x = 0;
  for (const day of stay.days) {
    const at = (clock: string) => instantOfShipTime(day, clock, stay.timeZone).getTime();
    const marks = [at("00:00"), at(stay.workdayFrom), at(stay.workdayTo), at("24:00")];
    for (let i = 0; i < 3; i += 1) {
      const from = Math.max(marks[i]!, start);
      const to = Math.min(marks[i + 1]!, end);
      if (to <= from) continue;
      const working = i === 1;
      const width = ((to - from) / 3_600_000) * (working ? hourPx : offHourPx);
      pieces.push({ day, from, to, x, width, working });
      x += width;
    }
  }
  return { pieces, width: x, from: start, to: end };
}

/** The x position of an instant (ms), clamped to the stay. */
export function xOf(axis: Axis, instant: number): number {
  for (const p of axis.pieces) {
    if (instant <= p.to) return p.x + (Math.max(instant - p.from, 0) / (p.to - p.from)) * p.width;
  }
  return axis.width;
}

/**
 * Where a job dropped at `x` starts: the instant under it, on a slot boundary, and inside a working
 * day — a drop on the narrow hours outside one goes to the start of the next working day (or the
 * last slot of the one before, at the stay's end). Null when the stay has no working hours at all.
 */
export function dropStart(axis: Axis, x: number, slotMinutes: number): number | null {
  const working = workingPieces(axis);
  if (!working.length) return null;
  const slot = slotMinutes * 60_000;
  const piece = axis.pieces.find((p) => x < p.x + p.width) ?? axis.pieces.at(-1)!;
  if (!piece.working) {
    const next = working.find((p) => p.from >= piece.to);
    if (next) return next.from;
    const last = working.at(-1)!;
    return Math.max(last.from, last.to - slot);
  }
  const instant = piece.from + ((Math.max(x, piece.x) - piece.x) / piece.width) * (piece.to - piece.from);
  const snapped = piece.from + Math.round((instant - piece.from) / slot) * slot;
  return Math.min(Math.max(snapped, piece.from), Math.max(piece.from, piece.to - slot));
}

/** Left and width of a period; at least 2 px so that a short job stays visible. */
export function spanOf(axis: Axis, from: string, to: string): { left: number; width: number } {
  const left = xOf(axis, Date.parse(from));
  return { left, width: Math.max(xOf(axis, Date.parse(to)) - left, 2) };
}

/** Each day's working hours on the axis, for the day labels and the hour ticks. */
export function workingPieces(axis: Axis): AxisPiece[] {
  return axis.pieces.filter((p) => p.working);
}

/**
 * One lane per person on board ("motorman#2"), ranks in the order of the engine department; people a
 * job names that the crew list lacks get a lane at the end, so nothing is hidden.
 */
export function laneKeys(crew: CrewOnBoard[], named: Iterable<string> = []): string[] {
  // The rank words list the ranks in the department's order (chief engineer first).
  const ranks = Object.keys(RANK_LABEL);
  const order = (rank: string) => {
    const i = ranks.indexOf(rank);
    return i < 0 ? ranks.length : i;
  };
  const keys = [...crew]
    .sort((a, b) => order(a.rank) - order(b.rank))
    .flatMap((c) => Array.from({ length: c.count }, (_, n) => `${c.rank}#${n + 1}`));
  const extra = [...new Set(named)].filter((k) => !keys.includes(k)).sort();
  return [...keys, ...extra];
}

const SHIP_TIME = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/** A ship's clock value moved by some minutes, as wall-clock arithmetic ("2026-12-04T16:30" + 60 → "…T17:30"). */
export function shiftLocal(local: string, minutes: number): string {
  const m = SHIP_TIME.exec(local);
  if (!m) return local;
  const t = new Date(Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!) + minutes * 60_000);
  return t.toISOString().slice(0, 16);
}

/** How far a key moves a job's start: a slot, an hour with Shift, a day with PageUp/PageDown; null for other keys. */
export function moveMinutes(key: string, shift: boolean, slotMinutes: number): number | null {
  switch (key) {
    case "ArrowLeft":
      return shift ? -60 : -slotMinutes;
    case "ArrowRight":
      return shift ? 60 : slotMinutes;
    case "PageUp":
      return -24 * 60;
    case "PageDown":
      return 24 * 60;
    default:
      return null;
  }
}

/**
 * A moved job's reason: why it is in the package stays, when and by whom is the chief's choice now
 * ("Out of tolerance since 26 Sep; motorman from 9 Dec 11:00 …" → "Out of tolerance since 26 Sep;
 * moved on the timeline by hand.").
 */
export function movedReason(reason: string | undefined): string | undefined {
  if (!reason) return reason;
  const why = reason.split("; ")[0]!.replace(/\.$/, "");
  return why.endsWith("by hand") ? `${why}.` : `${why}; moved on the timeline by hand.`;
}
