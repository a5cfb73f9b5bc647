// The work package's words from the stay as its page loads it (server/port-stays): the accepted
// package, or the planner's proposal when none was accepted. Pure.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { formatHours, formatManHours, formatShipTime, shipDay } from "@/server/format/hours";
import type { PlacedView, PortStayDetail, ProposalView } from "@/server/port-stays/contract";
import type { RankWords } from "@/server/routines/rank-names";
import { CAUTIONS_DEFER } from "@/server/routines/caution-words";
import type { PackageJobLine, WorkPackage } from "./work-package";

const ENGINE_STOP =
  "Engine-stop work needs the usual isolation, lock-out and permit to work, and the terminal’s or port authority’s permission to immobilise the main engine.";

/** "Fri 4 Dec 2026" of a ship's day "2026-12-04". */
function dayWords(day: string): string {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  return format(new Date(y, m - 1, d), "EEE d MMM yyyy");
}

const clock = (iso: string, tz: string) => format(new TZDate(new Date(iso), tz), "HH:mm");
const hoursBetween = (from: string, to: string) => (new Date(to).getTime() - new Date(from).getTime()) / 3_600_000;

/** "motorman#2" → "Motorman 2"; the only one of a rank on board keeps the bare rank. */
function personWords(key: string, ranks: RankWords, crew: PortStayDetail["stay"]["crew"]): string {
  const [rank = key, n = "1"] = key.split("#");
  const heads = crew.find((c) => c.rank === rank)?.count ?? 2;
  return heads <= 1 ? ranks.label(rank) : `${ranks.label(rank)} ${n}`;
}

export function workPackageOf(
  detail: PortStayDetail,
  imoNumber: string,
  ranks: RankWords,
  proposal: ProposalView | null,
): WorkPackage {
  const { stay, vessel } = detail;
  const tz = vessel.timeZone;
  const items: PlacedView[] = detail.items.length ? detail.items : (proposal?.items ?? []);
  const status = detail.items.length
    ? `Accepted ${stay.packageAcceptedAt ? formatShipTime(new Date(stay.packageAcceptedAt), tz) : ""}${stay.packageAcceptedBy ? ` by ${stay.packageAcceptedBy}` : ""}`.trim()
    : proposal
      ? "Proposed by Keelson from the due work: not accepted yet"
      : "No package accepted yet";

  const when = (job: PlacedView, day: string) =>
    job.segments
      .map((s) => `${shipDay(new Date(s.from), tz) === day ? "" : `${dayWords(shipDay(new Date(s.from), tz)).slice(0, -5)} `}${clock(s.from, tz)}–${clock(s.to, tz)}`)
      .join("\n");
  const line = (job: PlacedView, day: string): PackageJobLine => ({
    when: when(job, day),
    number: job.number,
    title: job.title,
    component: `${job.componentCode} ${job.componentName}`,
    flags: [job.needsEngineStop && "engine stopped", job.critical && "critical", job.classRelated && "class-related"]
      .filter(Boolean)
      .join(" · "),
    reason: job.reason,
    team: `${ranks.team(job.team)}, ${formatHours(job.elapsedHours)}`,
    people: job.people.map((p) => personWords(p, ranks, stay.crew)).join(", "),
    manHours: formatHours(job.manHours),
  });

  const days = stay.days.map((day) => {
    const jobs = items.filter((j) => shipDay(new Date(j.start), tz) === day);
    const manHours = jobs.reduce((n, j) => n + j.manHours, 0);
    return {
      label: dayWords(day),
      summary: jobs.length ? `${jobs.length} job${jobs.length === 1 ? "" : "s"} · ${formatManHours(manHours)}` : "no work",
      jobs: jobs.map((j) => line(j, day)),
    };
  });

  // Each person's hours: a job's working periods count for everyone on it.
  const hours = new Map<string, Map<string, number>>();
  for (const job of items) {
    for (const person of job.people) {
      const byDay = hours.get(person) ?? new Map<string, number>();
      for (const s of job.segments) {
        const day = shipDay(new Date(s.from), tz);
        byDay.set(day, (byDay.get(day) ?? 0) + hoursBetween(s.from, s.to));
      }
      hours.set(person, byDay);
    }
  }
  const people = [...hours.entries()]
    .sort(([a], [b]) => a.localeCompare(b, "en", { numeric: true }))
    .map(([person, byDay]) => ({
      name: personWords(person, ranks, stay.crew),
      byDay: [...byDay.entries()]
        .sort(([a], [b]) => a.localeCompare(b))
        .map(([day, h]) => `${dayWords(day).slice(0, -5)} ${formatHours(h)}`)
        .join(" · "),
      total: formatHours([...byDay.values()].reduce((n, h) => n + h, 0)),
    }));

  const totalManHours = items.reduce((n, j) => n + j.manHours, 0);
  const crew = stay.crew.filter((c) => c.count > 0);
  return {
    vessel: { name: vessel.name, code: vessel.code, imoNumber },
    port: stay.port,
    status,
    facts: [
      ["Arrival (ship’s time)", formatShipTime(new Date(stay.arrivesAt), tz)],
      ["Departure (ship’s time)", formatShipTime(new Date(stay.departsAt), tz)],
      ["Ship’s time zone", tz],
      ["Working day", `${stay.workdayFrom}–${stay.workdayTo}`],
      [
        "Main engine",
        stay.engineStop
          ? `may be immobilised ${formatShipTime(new Date(stay.engineStop.from), tz)} – ${formatShipTime(new Date(stay.engineStop.to), tz)}`
          : "on standby throughout: no engine-stop work",
      ],
      ["Work", `${items.length} job${items.length === 1 ? "" : "s"} · ${formatManHours(totalManHours)} over ${stay.days.length} day${stay.days.length === 1 ? "" : "s"}`],
    ],
    crew: crew.length ? crew.map((c) => `${c.count} × ${ranks.label(c.rank)}`).join(" · ") : "none entered",
    watches: stay.watches.map(
      (w) => `${w.label}: ${personWords(`${w.rank}#${w.person}`, ranks, stay.crew)}, ${formatShipTime(new Date(w.from), tz)} – ${formatShipTime(new Date(w.to), tz)}`,
    ),
    cautions: [
      "Isolate and lock out before opening any machinery; keep to the permit to work and the ship’s safety management system.",
      ENGINE_STOP,
      CAUTIONS_DEFER,
      "Print each job’s card from its work order for the checklist, measurements and sign-off.",
    ],
    days: items.length ? days : [],
    people,
    leftOut: detail.items.length ? [] : (proposal?.leftOut ?? []).map((l) => ({ number: l.number, title: l.title, why: l.message })),
    empty: items.length
      ? null
      : proposal
        ? "The planner placed no work in this stay."
        : "No work package was accepted for this stay.",
  };
}
