// The job card's words from the work order as its page loads it (server/completions/queries.ts):
// dates on the ship's calendar, hours and limits as Keelson writes them. Pure.
import type { WorkOrderWithDeferrals } from "@/server/deferrals/contract";
import { formatHours, formatManHours, formatShipDate } from "@/server/format/hours";
import { amountText } from "@/server/parts/contract";
import { CAUTION_WORDS, CAUTIONS_DEFER, NO_PARTICULAR_CAUTION } from "@/server/routines/caution-words";
import { intervalWords } from "@/server/routines/interval-words";
import type { RankWords } from "@/server/routines/rank-names";
import type { JobCard } from "./job-card";

/** Said on every engine-stop job, as the package sheet says it. */
export const ENGINE_STOP_WORDS =
  "Engine-stop work: the terminal’s or port authority’s permission to immobilise the main engine, the usual isolation, lock-out and permit to work.";

/** A limit as printed: "0.8 mm", or a dash where there is none. */
export function limitWords(value: number | null, unit: string): string {
  return value === null ? "—" : `${value.toLocaleString("en-GB", { maximumFractionDigits: 6 })} ${unit}`.trim();
}

export function jobCardOf(detail: WorkOrderWithDeferrals, imoNumber: string, ranks: RankWords): JobCard {
  const { workOrder: w, vessel, routine, deferrals } = detail;
  const tz = vessel.timeZone;
  const day = (iso: string | null) => (iso ? formatShipDate(new Date(iso), tz) : null);

  const limits = deferrals.current;
  const dueDay = day(limits.dueDate);
  const due = [
    dueDay && (limits.projected ? `≈ ${dueDay} (projected from the running hours)` : dueDay),
    limits.dueHours !== null && `at ${formatHours(limits.dueHours)}`,
  ].filter(Boolean);
  const windowDays = w.windowOpensAt || w.graceEndsAt ? `${day(w.windowOpensAt) ?? "—"} – ${day(w.graceEndsAt) ?? "—"}` : null;
  const windowHours =
    w.windowOpensHours !== null && w.graceEndsHours !== null
      ? `${formatHours(w.windowOpensHours)} – ${formatHours(w.graceEndsHours)}`
      : null;

  const team = w.team.length ? `${ranks.team(w.team)} for ${formatHours(w.elapsedHours)}` : ranks.label(w.rank);
  const flags = [
    w.critical && "Critical equipment",
    w.classRelated && "Class-related",
    w.needsEngineStop && "Main engine stopped",
    w.needsPort && "In port",
  ].filter((f): f is string => Boolean(f));

  const partsNeeded = detail.partsOnBoard.filter((p) => p.needed !== null);
  return {
    vessel: { name: vessel.name, code: vessel.code, imoNumber },
    number: w.number,
    title: w.title,
    component: { code: detail.component.code, name: detail.component.name },
    kind:
      w.kind === "corrective"
        ? `Corrective${detail.defect ? `: defect ${detail.defect.number}` : ""}`
        : `Planned maintenance, occurrence ${w.occurrence}`,
    due: due.length ? `${due.join(" · ")}${limits.deferred ? " (deferred)" : ""}` : "no due point yet",
    window: [windowDays, windowHours].filter(Boolean).join(" · ") || "—",
    interval: routine ? intervalWords(routine.intervalHours, routine.calendarRule, w.portEvent && w.portEventHours ? { event: w.portEvent, withinHours: w.portEventHours } : null) : null,
    counter: detail.counter?.name ?? null,
    plannedEffort: `${team} · ${formatManHours(w.estimatedManHours)}`,
    flags,
    description: routine?.description ?? "",
    defect: detail.defect
      ? {
          heading: `Defect ${detail.defect.number}: ${detail.defect.title}`,
          text: [
            detail.defect.description,
            `Found ${day(detail.defect.foundAt)}${detail.defect.reportedBy ? `, reported by ${detail.defect.reportedBy}` : ""}.`,
          ]
            .filter(Boolean)
            .join("\n"),
        }
      : null,
    cautions: (routine?.cautions ?? []).map((c) => CAUTION_WORDS[c]),
    cautionsFootnote: [
      ...(routine?.cautions.length ? [] : [NO_PARTICULAR_CAUTION]),
      ...(w.needsEngineStop ? [ENGINE_STOP_WORDS] : []),
      CAUTIONS_DEFER,
    ],
    checklist: routine?.checklist ?? [],
    measurements: (routine?.measurements ?? []).map((m) => ({
      name: m.name,
      unit: m.unit,
      lower: limitWords(m.lower, m.unit),
      upper: limitWords(m.upper, m.unit),
    })),
    partsNote: routine?.spareParts ?? "",
    parts: partsNeeded.map((p) => ({
      number: p.number,
      description: p.description,
      needed: amountText(p.needed ?? 0, p.unit),
    })),
  };
}
