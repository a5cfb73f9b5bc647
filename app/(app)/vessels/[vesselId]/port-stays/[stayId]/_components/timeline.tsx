"use client";
// The stay as a timeline: ship's days across (working hours wide, the rest narrow), one lane per
// person, the engine-stop slot as a band over all lanes, port watches hatched, jobs as blocks.
import { useRankWords } from "@/app/_components/rank-words-provider";
import { shipClock, shipDay } from "@/server/format/hours";
import type { PlacedView, PortStayView } from "@/server/port-stays/contract";
import { dayLabel, personLabel } from "../../_components/stay-words";
import { fillOf, JobBlock } from "./job-block";
import { buildAxis, dropStart, laneKeys, moveMinutes, spanOf, workingPieces } from "./timeline-geometry";

const LANE_PX = 34;
const HEAD_PX = 40;
const HATCH = "repeating-linear-gradient(135deg, rgb(79 95 113 / 0.55) 0 3px, transparent 3px 7px)";

export type TimelineJob = { job: PlacedView; wanted: string; problem?: string };

type Props = {
  stay: PortStayView;
  timeZone: string;
  jobs: TimelineJob[];
  slotMinutes?: number;
  /** Absent for an accepted package: it is read-only until re-planned. */
  onMove?: (workOrderId: string, minutes: number) => void;
  /** A job dragged to start at a ship's clock time. */
  onMoveTo?: (workOrderId: string, startLocal: string) => void;
  label: string;
};

export function Timeline({ stay, timeZone, jobs, slotMinutes = 30, onMove, onMoveTo, label }: Props) {
  const ranks = useRankWords();
  const axis = buildAxis({ ...stay, timeZone });
  const lanes = laneKeys(stay.crew, jobs.flatMap((j) => j.job.people));
  const laneTop = (key: string) => HEAD_PX + Math.max(lanes.indexOf(key), 0) * LANE_PX;
  const height = HEAD_PX + lanes.length * LANE_PX;
  const stop = stay.engineStop && spanOf(axis, stay.engineStop.from, stay.engineStop.to);

  return (
    <figure className="grid gap-2" aria-label={label}>
      <div className="flex overflow-hidden rounded-md border border-ink-200 dark:border-ink-800">
        <ul className="w-48 shrink-0 border-r border-ink-200 bg-ink-50 text-sm dark:border-ink-800 dark:bg-ink-900" aria-label="People">
          <li style={{ height: HEAD_PX }} className="px-2 pt-2 text-xs text-ink-600 dark:text-ink-300">
            Ship’s time
          </li>
          {lanes.map((key) => (
            <li key={key} style={{ height: LANE_PX }} className="truncate border-t border-ink-200 px-2 leading-8 dark:border-ink-800">
              {personLabel(key, ranks, stay.crew)}
            </li>
          ))}
        </ul>
        {/* Focusable so that the keyboard can scroll a long stay sideways (an accepted package has no buttons). */}
        <div className="min-w-0 flex-1 overflow-x-auto" tabIndex={0} role="group" aria-label="Timeline, scrolls sideways">
          <div className="relative" style={{ width: axis.width, height }}>
            {axis.pieces.map((p) => (
              <div
                key={`${p.day}-${p.from}`}
                aria-hidden="true"
                className={p.working ? "absolute border-l border-ink-200 dark:border-ink-800" : "absolute bg-ink-200 dark:bg-ink-800"}
                style={{ left: p.x, width: p.width, top: 0, height }}
              />
            ))}
            {workingPieces(axis).map((p) => (
              <div key={`head-${p.day}-${p.from}`} aria-hidden="true" className="absolute text-xs text-ink-700 dark:text-ink-200" style={{ left: p.x, width: p.width, top: 2 }}>
                <div className="truncate px-1 font-semibold">{dayLabel(p.day)}</div>
                <HourTicks from={p.from} to={p.to} width={p.width} timeZone={timeZone} />
              </div>
            ))}
            {lanes.map((key, i) => (
              <div key={key} aria-hidden="true" className="absolute right-0 left-0 border-t border-ink-200 dark:border-ink-800" style={{ top: HEAD_PX + i * LANE_PX }} />
            ))}
            {stop && stay.engineStop && (
              <div
                className="absolute border-x-2 border-dashed border-brass-600 bg-brass-400/20 dark:border-brass-400 dark:bg-brass-400/15"
                style={{ left: stop.left, width: stop.width, top: HEAD_PX, height: height - HEAD_PX }}
                data-engine-stop-band=""
                data-from={stay.engineStop.from}
                data-to={stay.engineStop.to}
                role="img"
                aria-label="Engine-stop slot"
              />
            )}
            {stay.watches.map((w, i) => {
              const s = spanOf(axis, w.from, w.to);
              return (
                <div
                  key={i}
                  className="absolute rounded-sm border border-ink-600 dark:border-ink-300"
                  style={{ left: s.left, width: s.width, top: laneTop(`${w.rank}#${w.person}`) + 4, height: LANE_PX - 8, backgroundImage: HATCH }}
                  title={`Port watch: ${w.label}`}
                  role="img"
                  aria-label={`${personLabel(`${w.rank}#${w.person}`, ranks, stay.crew)} on port watch: ${w.label}`}
                  data-watch=""
                />
              );
            })}
            {jobs.map(({ job, wanted, problem }, n) => (
              <JobBlock
                key={job.workOrderId}
                job={job}
                wanted={wanted}
                problem={problem}
                colour={fillOf(n)}
                places={job.people.flatMap((person) =>
                  job.segments.map((seg) => ({ ...spanOf(axis, seg.from, seg.to), top: laneTop(person) + 3, height: LANE_PX - 6 })),
                )}
                onDrop={
                  onMoveTo &&
                  ((left) => {
                    const at = dropStart(axis, left, slotMinutes);
                    if (at !== null) onMoveTo(job.workOrderId, `${shipDay(new Date(at), timeZone)}T${shipClock(new Date(at), timeZone)}`);
                  })
                }
                onKey={
                  onMove &&
                  ((key, shift) => {
                    const minutes = moveMinutes(key, shift, slotMinutes);
                    if (minutes === null) return false;
                    onMove(job.workOrderId, minutes);
                    return true;
                  })
                }
              />
            ))}
          </div>
        </div>
      </div>
      <Legend />
    </figure>
  );
}

function HourTicks({ from, to, width, timeZone }: { from: number; to: number; width: number; timeZone: string }) {
  const hours: { x: number; label: string }[] = [];
  const perMs = width / (to - from);
  for (let t = Math.ceil(from / 3_600_000) * 3_600_000; t < to; t += 3_600_000) {
    const label = new Intl.DateTimeFormat("en-GB", { hour: "2-digit", hourCycle: "h23", timeZone }).format(t);
    hours.push({ x: (t - from) * perMs, label });
  }
  return (
    <div className="relative h-4 tabular-nums">
      {hours.map((h) => (
        <span key={h.x} className="absolute pl-0.5" style={{ left: h.x }}>
          {h.label}
        </span>
      ))}
    </div>
  );
}

function Legend() {
  return (
    <figcaption className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-700 dark:text-ink-200">
      <span className="flex items-center gap-1">
        <span aria-hidden="true" className="inline-block h-3 w-5 border-x-2 border-dashed border-brass-600 bg-brass-400/20" />
        Engine-stop slot
      </span>
      <span className="flex items-center gap-1">
        <span aria-hidden="true" className="inline-block h-3 w-5 border border-ink-600" style={{ backgroundImage: HATCH }} />
        Port watch
      </span>
      <span className="flex items-center gap-1">
        <span aria-hidden="true" className="inline-block h-3 w-5 bg-ink-200 dark:bg-ink-800" />
        Outside the working day (narrowed)
      </span>
      <span>⚠ the server refuses the job there · hover or focus a job for its title</span>
    </figcaption>
  );
}
