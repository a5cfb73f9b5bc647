// The overdue list's words from the Fleet board's list (server/fleet/overdue.ts). Pure.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import type { FleetOverdue, FleetOverdueFilter, FleetOverdueItem } from "@/server/fleet/overdue-contract";
import { formatHours } from "@/server/format/hours";
import type { RankWords } from "@/server/routines/rank-names";
import type { OverdueList } from "./overdue-list";

/** A ship's day "2026-12-04" → "4 Dec 2026". */
export function dayKeyWords(day: string): string {
  const [y, m, d] = day.split("-").map(Number) as [number, number, number];
  return format(new Date(y, m - 1, d), "d MMM yyyy");
}

function overdueWords(i: FleetOverdueItem): string {
  const days =
    i.daysOverdue === null ? "" : i.daysOverdue === 0 ? "under a day" : `${i.daysOverdue} day${i.daysOverdue === 1 ? "" : "s"}`;
  const parts = [days, i.hoursOverdue !== null ? formatHours(i.hoursOverdue) : ""].filter(Boolean);
  return parts.length ? `${parts.join(" · ")} over` : "—";
}

export function overdueListOf(list: FleetOverdue, filter: FleetOverdueFilter, company: string, ranks: RankWords): OverdueList {
  const vessel = filter.vesselId ? list.vessels.find((v) => v.id === filter.vesselId)?.name ?? "one vessel" : "Every vessel";
  const states = filter.state ? (filter.state === "late" ? "late only" : "out of tolerance only") : "late and out of tolerance";
  const count = (state: string) => list.items.filter((i) => i.state === state).length;
  return {
    company,
    listed: `Listed ${format(new TZDate(new Date(list.generatedAt), "UTC"), "d MMM yyyy HH:mm")} UTC, as the worker last computed the states.`,
    filters: [vessel, states, filter.flagged ? "critical or class-related only" : null].filter(Boolean).join(" · "),
    counts: `${count("out-of-tolerance")} out of tolerance · ${count("late")} late`,
    truncated: list.truncated ? `Only the first ${list.items.length} are listed: narrow the list by vessel or state.` : null,
    lines: list.items.map((i) => ({
      vessel: i.vessel.name,
      number: i.number,
      title: i.title,
      component: `${i.component.code} ${i.component.name}`,
      state: i.state.replaceAll("-", " "),
      due: [i.dueDay ? dayKeyWords(i.dueDay) : null, i.dueHours !== null ? formatHours(i.dueHours) : null].filter(Boolean).join("\n") || "—",
      overdue: overdueWords(i),
      rank: ranks.label(i.rank),
      notes: [
        i.critical && "critical",
        i.classRelated && "class item",
        i.plannedDate && `planned ${dayKeyWords(i.plannedDate)}`,
        i.pendingDeferral && "deferral asked",
        i.awaitingApproval && "done, awaiting approval",
      ]
        .filter(Boolean)
        .join(" · "),
    })),
  };
}
