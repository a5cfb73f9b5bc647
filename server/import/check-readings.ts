// The readings history of an import, checked under the Hour log's rules (server/readings/rules.ts)
// together with the readings the vessel already holds: on one meter a reading is never lower than
// the one before nor more hours ahead than the clock allows, one reading per instant, none in the
// future. A reading the vessel already has with the same value is left alone (a second import of
// the same file adds nothing); the same instant with another value is a problem, never an overwrite.
//
// Meters: `meter` 1 is the first meter fitted, 2 the one after a replacement. On a counter the file
// creates, a higher meter number starts a new meter just after the last reading of the one before,
// counting from 0 h (or from its first value, when that is more than the clock allows since). On a
// counter the vessel has, readings go on its meters as they are: a new meter is fitted in the Hour log.
import { formatHours, formatShipTime } from "@/server/format/hours";
import { MeterValue } from "@/server/readings/contract";
import { elapsedHours, isInFuture, readingProblem } from "@/server/readings/rules";
import { instantCell, numberCell } from "./cells";
import type { ImportRow, ImportSheet } from "./read-file";

/** What a counter of the vessel holds: its meters and every reading (read only when an import has readings). */
export type CounterReadings = {
  currentSegment: number;
  segments: { segment: number; startedAt: Date; offsetHours: number }[];
  readings: { readAt: Date; meterValue: number; segment: number }[];
};

export type ReadingCandidate = { readAt: Date; meterValue: number; segment: number; remark: string | null };
/** A new meter the import fits on a counter it creates. */
export type SegmentCandidate = { segment: number; startedAt: Date; startMeter: number; offsetHours: number };
export type CounterReadingsImport = {
  counterName: string;
  readings: ReadingCandidate[];
  /** Meters after the first, on a counter the import creates. */
  segments: SegmentCandidate[];
  /** Readings the vessel already has, unchanged. */
  same: number;
};

type At = (s: ImportSheet, row: ImportRow, column: string | null) => (message: string) => void;
type Pending = { row: ImportRow; readAt: Date; meterValue: number; meter: number | null; remark: string | null };

/** More meters than this on one counter is a typo, not a history. */
const MAX_METERS = 99;

export function checkReadings(
  s: ImportSheet | undefined,
  counters: { fromFile: Map<string, string>; onVessel: Map<string, CounterReadings & { name: string }> },
  vessel: { timeZone: string; clock: Date },
  at: At,
): CounterReadingsImport[] {
  if (!s) return [];
  const byCounter = new Map<string, Pending[]>();
  for (const row of s.rows) {
    const v = row.values;
    const name = (v.counter ?? "").trim();
    const key = name.toLowerCase();
    let ok = true;
    const fail = (column: string) => (message: string) => {
      ok = false;
      at(s, row, column)(message);
    };
    if (!name) fail("counter")("Enter the counter's name.");
    else if (!counters.fromFile.has(key) && !counters.onVessel.has(key)) fail("counter")(`“${name}”: no such counter in the counters file or on the vessel.`);
    const readAt = instantCell(v.read_at, vessel.timeZone);
    if ("problem" in readAt) fail("read_at")(readAt.problem);
    else if (isInFuture(readAt.value, vessel.clock)) fail("read_at")(`${formatShipTime(readAt.value, vessel.timeZone)} is still to come on the ship's clock.`);
    const value = MeterValue.safeParse(numberCell(v.value, s.decimalComma) ?? "");
    if (!value.success) fail("value")(value.error.issues[0]?.message ?? "Enter the meter value in hours.");
    const meterText = (v.meter ?? "").trim();
    const meter = meterText ? Number(meterText) : null;
    if (meter !== null && !(Number.isInteger(meter) && meter >= 1 && meter <= MAX_METERS)) {
      fail("meter")(`“${meterText}”: the meter is a whole number, 1 for the first meter fitted, 2 after one replacement…`);
    }
    const remark = (v.remark ?? "").trim();
    if (remark.length > 500) fail("remark")("Keep the remark under 500 characters.");
    if (!ok || "problem" in readAt || !value.success) continue;
    const list = byCounter.get(key) ?? [];
    list.push({ row, readAt: readAt.value, meterValue: value.data, meter, remark: remark || null });
    byCounter.set(key, list);
  }
  return [...byCounter].map(([key, all]) => {
    const held = counters.onVessel.get(key);
    const name = held?.name ?? counters.fromFile.get(key)!;
    const series = onePerInstant(s, name, all, vessel.timeZone, at);
    return held ? onExisting(s, name, series, held, vessel.timeZone, at) : onNew(s, name, series, vessel.timeZone, at);
  });
}

/** The series in time order, each instant once: a second row at the same instant is a problem of its own. */
function onePerInstant(s: ImportSheet, counterName: string, series: Pending[], timeZone: string, at: At): Pending[] {
  const first = new Map<number, Pending>();
  for (const p of series.sort(byTime)) {
    const twin = first.get(p.readAt.getTime());
    if (twin) at(s, p.row, "read_at")(`${counterName} already has a reading at ${formatShipTime(p.readAt, timeZone)} (${rowOf(twin)}).`);
    else first.set(p.readAt.getTime(), p);
  }
  return [...first.values()];
}

/** Where the earlier row is, said from a later one. */
const rowOf = (p: Pending) => `row ${p.row.line}`;
const byTime = (a: Pending, b: Pending) => a.readAt.getTime() - b.readAt.getTime() || a.row.line - b.row.line;

/** A counter the file creates: its meters follow one another in time; each reading fits its meter's series. */
function onNew(s: ImportSheet, counterName: string, series: Pending[], timeZone: string, at: At): CounterReadingsImport {
  const out: CounterReadingsImport = { counterName, readings: [], segments: [], same: 0 };
  let previous: (Pending & { segment: number }) | null = null;
  let offset = 0;
  for (const p of series) {
    const segment: number = p.meter ?? previous?.segment ?? 1;
    const problem = (column: string, message: string) => at(s, p.row, column)(message);
    if (!previous && segment !== 1) {
      problem("meter", `The first reading of ${counterName} is on meter ${segment}: its history starts with meter 1.`);
      continue;
    }
    if (previous && segment < previous.segment) {
      problem("meter", `Meter ${segment} comes after meter ${previous.segment} (${rowOf(previous)}): a replaced meter does not come back.`);
      continue;
    }
    if (previous && segment > previous.segment + 1) {
      problem("meter", `Meter ${segment} follows meter ${previous.segment} (${rowOf(previous)}): number the meters one after another.`);
      continue;
    }
    if (previous && segment === previous.segment + 1) {
      // A new meter fitted straight after the old one's last reading, from 0 h unless it already shows more than has passed.
      const startMeter = p.meterValue > elapsedHours(previous.readAt, p.readAt) ? p.meterValue : 0;
      offset = previous.meterValue + offset - startMeter;
      out.segments.push({ segment, startedAt: new Date(previous.readAt.getTime() + 1000), startMeter, offsetHours: round1(offset) });
    } else if (previous) {
      const words = readingProblem({ name: counterName, segmentStartedAt: null, previous, next: null, existingAtSameInstant: null }, p.meterValue, p.readAt, timeZone);
      if (words) {
        problem("value", `${words.replace(/\.$/, "")} — ${rowOf(previous)}.`);
        continue;
      }
    }
    previous = { ...p, segment };
    out.readings.push({ readAt: p.readAt, meterValue: p.meterValue, segment, remark: p.remark });
  }
  return out;
}

/** A counter the vessel has: each reading against its meter's readings, the vessel's and the file's. */
function onExisting(s: ImportSheet, counterName: string, series: Pending[], held: CounterReadings, timeZone: string, at: At): CounterReadingsImport {
  const out: CounterReadingsImport = { counterName, readings: [], segments: [], same: 0 };
  const existing = new Map(held.readings.map((r) => [r.readAt.getTime(), r]));
  const fresh: (Pending & { segment: number })[] = [];
  for (const p of series) {
    const segment = p.meter ?? held.currentSegment;
    const problem = (column: string, message: string) => at(s, p.row, column)(message);
    const was = existing.get(p.readAt.getTime());
    if (was) {
      if (was.meterValue === p.meterValue && was.segment === segment) out.same += 1;
      else problem("value", `${counterName} already shows ${formatHours(was.meterValue)} at ${formatShipTime(p.readAt, timeZone)} on the vessel: correct it in the Hour log, not by import.`);
      continue;
    }
    // A counter made before meters were recorded has its first meter from the start.
    const meter = held.segments.find((m) => m.segment === segment) ?? (segment === 1 ? { segment: 1, startedAt: new Date(0), offsetHours: 0 } : undefined);
    if (!meter) {
      problem("meter", `${counterName} has no meter ${segment} (it has ${held.currentSegment}): fit a new meter in the Hour log first.`);
      continue;
    }
    const nextMeter = held.segments.find((m) => m.segment === segment + 1);
    if (p.readAt < meter.startedAt || (nextMeter && p.readAt >= nextMeter.startedAt)) {
      problem("meter", `${formatShipTime(p.readAt, timeZone)} is outside the time meter ${segment} of ${counterName} was fitted.`);
      continue;
    }
    fresh.push({ ...p, segment });
  }
  // Each new reading between its neighbours on the same meter, the vessel's and the file's together.
  const all = [...held.readings.map((r) => ({ ...r, fromFile: null as Pending | null })), ...fresh.map((p) => ({ readAt: p.readAt, meterValue: p.meterValue, segment: p.segment, fromFile: p as Pending | null }))];
  all.sort((a, b) => a.readAt.getTime() - b.readAt.getTime());
  const refused = new Set<Pending>();
  for (const [i, r] of all.entries()) {
    if (!r.fromFile) continue;
    const neighbour = (step: -1 | 1) => {
      for (let j = i + step; j >= 0 && j < all.length; j += step) {
        const n = all[j]!;
        if (n.segment === r.segment && !(n.fromFile && refused.has(n.fromFile))) return n;
      }
      return null;
    };
    const words = readingProblem({ name: counterName, segmentStartedAt: null, previous: neighbour(-1), next: neighbour(1), existingAtSameInstant: null }, r.meterValue, r.readAt, timeZone);
    if (words) {
      refused.add(r.fromFile);
      at(s, r.fromFile.row, "value")(words);
      continue;
    }
    out.readings.push({ readAt: r.readAt, meterValue: r.meterValue, segment: r.segment, remark: r.fromFile.remark });
  }
  return out;
}

function round1(value: number): number {
  return Math.round(value * 10) / 10;
}
