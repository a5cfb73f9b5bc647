// What a reading is checked against (rules.ts): the counter's meter fitted now, and the readings of
// that meter just before and just after the instant. Shared by a new reading and a corrected or
// removed one, which leaves itself out.
import "server-only";
import { sql } from "drizzle-orm";
import type { Tx } from "@/db/client";
import { counter, reading } from "@/db/schema";
import type { CounterContext, Neighbour } from "./rules";

type NeighbourRow = {
  id: string;
  name: string;
  segment: number;
  started_at: Date | null;
  start_meter: string | null;
  offset_hours: string | null;
  prev_at: Date | null;
  prev_meter: string | null;
  next_at: Date | null;
  next_meter: string | null;
  same_meter: string | null;
};

export type CounterNeighbours = {
  id: string;
  name: string;
  /** The meter fitted now. */
  segment: number;
  /** Added to the meter value to give `total_hours`. */
  offsetHours: number;
  /** What `readingProblem` checks a value at the instant against. */
  context: CounterContext;
};

/**
 * The neighbours at `readAt` of each counter in `counterIds` (of the company; the caller has
 * locked them). `except` is a reading to leave out: the one being corrected or removed.
 */
export async function loadNeighbours(
  tx: Tx,
  companyId: string,
  counterIds: string[],
  readAt: Date,
  except: string | null = null,
): Promise<Map<string, CounterNeighbours>> {
  if (counterIds.length === 0) return new Map();
  // A uuid no reading has, so the filter needs no second form of the query.
  const skip = except ?? "00000000-0000-0000-0000-000000000000";
  const result = await tx.execute<NeighbourRow>(sql`
    select c.id, c.name, c.current_segment as segment,
           s.started_at, s.start_meter, s.offset_hours,
           p.read_at as prev_at, p.meter_value as prev_meter,
           n.read_at as next_at, n.meter_value as next_meter,
           e.meter_value as same_meter
    from ${counter} c
    left join counter_segment s on s.counter_id = c.id and s.segment = c.current_segment
    left join lateral (select read_at, meter_value from ${reading} r
                       where r.counter_id = c.id and r.segment = c.current_segment and r.read_at < ${readAt}
                         and r.id <> ${skip}
                       order by r.read_at desc limit 1) p on true
    left join lateral (select read_at, meter_value from ${reading} r
                       where r.counter_id = c.id and r.segment = c.current_segment and r.read_at > ${readAt}
                         and r.id <> ${skip}
                       order by r.read_at asc limit 1) n on true
    left join lateral (select meter_value from ${reading} r
                       where r.counter_id = c.id and r.read_at = ${readAt} and r.id <> ${skip} limit 1) e on true
    where c.company_id = ${companyId} and c.id in ${counterIds}
  `);
  return new Map(result.rows.map((row) => [row.id, toNeighbours(row, readAt)]));
}

function toNeighbours(c: NeighbourRow, readAt: Date): CounterNeighbours {
  // Segment 1 starts when the counter was set up, not at a meter change: readings may predate it.
  const fittedAt = c.segment > 1 && c.started_at ? new Date(c.started_at) : null;
  const segmentStart: Neighbour | null = fittedAt ? { readAt: fittedAt, meterValue: Number(c.start_meter) } : null;
  return {
    id: c.id,
    name: c.name,
    segment: c.segment,
    offsetHours: Number(c.offset_hours ?? 0),
    context: {
      name: c.name,
      segmentStartedAt: fittedAt,
      previous: c.prev_at ? { readAt: new Date(c.prev_at), meterValue: Number(c.prev_meter) } : segmentStart,
      next: c.next_at ? { readAt: new Date(c.next_at), meterValue: Number(c.next_meter) } : null,
      existingAtSameInstant: c.same_meter !== null ? { readAt, meterValue: Number(c.same_meter) } : null,
    },
  };
}
