// The survey and audit report's query and its words from the loaded records. Pure.
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { DEFERRAL_STATUS_WORDS } from "@/server/deferrals/contract";
import { formatHours, formatShipDate, formatShipTime } from "@/server/format/hours";
import { dayKeyWords } from "./overdue-list-data";
import type { SurveyReport } from "./survey-report";
import type { SurveyData } from "./survey-queries";

const STATE_WORDS: Record<string, string> = {
  scheduled: "scheduled",
  "window-open": "window open",
  late: "late",
  "out-of-tolerance": "out of tolerance",
  deferred: "deferred",
  done: "done",
};

export function surveyReportOf(
  data: SurveyData,
  vessel: { name: string; code: string; imoNumber: string; timeZone: string },
  company: string,
  now: Date,
): SurveyReport {
  const tz = vessel.timeZone;
  const day = (d: Date | null) => (d ? formatShipDate(d, tz) : null);
  const both = (date: string | null, hours: number | null) =>
    [date, hours !== null ? `at ${formatHours(hours)}` : null].filter(Boolean).join(" · ") || "—";
  const flags = (critical: boolean, classRelated: boolean) =>
    [critical && "critical", classRelated && "class-related"].filter(Boolean).join(" · ");

  const routines = data.routines.map((r) => {
    const o = r.open;
    const deferred = o && (o.deferredDueDate || o.deferredDueHours !== null);
    const windowDays = o && (o.windowOpensAt || o.graceEndsAt) ? `${day(o.windowOpensAt) ?? "—"} – ${day(o.graceEndsAt) ?? "—"}` : null;
    const windowHours = o && o.windowOpensHours !== null && o.graceEndsHours !== null ? `${formatHours(o.windowOpensHours)} – ${formatHours(o.graceEndsHours)}` : null;
    return {
      classItem: r.classItemRef ?? r.component.classItemRef ?? "—",
      component: `${r.component.code} ${r.component.name}`,
      routine: r.title,
      flags: flags(r.critical, r.classRelated),
      lastDone: r.lastDone ? both(day(r.lastDone.doneAt), r.lastDone.counterHours) : "not done in Keelson",
      nextDue: o
        ? `${both(day(o.deferredDueDate ?? o.dueDate), o.deferredDueHours ?? o.dueHours)}${deferred ? " (deferred)" : ""}\n${o.number}`
        : "no open work order",
      window: [windowDays, windowHours].filter(Boolean).join("\n") || "—",
      state: o ? (STATE_WORDS[o.state] ?? o.state) : "—",
      overdue: o?.state === "late" || o?.state === "out-of-tolerance",
    };
  });

  const deferrals = data.deferrals.map((d) => ({
    workOrder: d.workOrder.number,
    title: d.workOrder.title,
    asked: `${formatShipDate(new Date(d.requestedAt), tz)}${d.requestedBy ? `\n${d.requestedBy}` : ""}`,
    reason: d.reason,
    proposed: [d.proposedDueDay ? dayKeyWords(d.proposedDueDay) : null, d.proposedDueHours !== null ? formatHours(d.proposedDueHours) : null]
      .filter(Boolean)
      .join("\n"),
    decision:
      d.status === "pending"
        ? `awaiting the ${d.needsOffice ? "technical superintendent’s" : "chief engineer’s"} decision`
        : [
            `${DEFERRAL_STATUS_WORDS[d.status].words}${d.decidedAt ? ` ${formatShipDate(new Date(d.decidedAt), tz)}` : ""}${d.decidedBy ? ` by ${d.decidedBy}` : ""}`,
            d.decisionNote,
          ]
            .filter(Boolean)
            .join(": "),
  }));

  const defects = data.defects.map((d) => ({
    number: d.number,
    title: d.title,
    component: `${d.component.code} ${d.component.name}`,
    found: `${formatShipDate(new Date(d.foundAt), tz)} (${d.ageDays} day${d.ageDays === 1 ? "" : "s"})${d.reportedBy ? `\n${d.reportedBy}` : ""}`,
    flags: [d.affectsCritical && "critical equipment", d.affectsSafety && "safety", d.affectsClass && "class"].filter(Boolean).join(" · ") || "—",
    state: d.state,
    repair: `${d.workOrder.number}${d.targetDay ? `\nby ${dayKeyWords(d.targetDay)}` : ""}`,
  }));

  const coverage = data.counters.map((c) => ({
    counter: c.name,
    days: String(c.coverage.days),
    missing: String(c.coverage.missing),
    longestGap: c.coverage.longestGap
      ? c.coverage.longestGap.days === 1
        ? `1 day, ${dayKeyWords(c.coverage.longestGap.from)}`
        : `${c.coverage.longestGap.days} days, ${dayKeyWords(c.coverage.longestGap.from)} – ${dayKeyWords(c.coverage.longestGap.to)}`
      : "—",
    lastReading: c.lastReading ? `${formatShipTime(c.lastReading.readAt, tz)} · ${formatHours(c.lastReading.totalHours)}` : "none",
  }));

  const lateWork = data.lateWork.map((l) => ({
    workOrder: l.number,
    title: l.title,
    component: `${l.component.code} ${l.component.name}`,
    flags: flags(l.critical, l.classRelated) || "—",
    due: both(day(l.dueAt), l.dueHours),
    done: both(day(l.doneAt), l.counterHours),
    judged: STATE_WORDS[l.judged] ?? l.judged,
  }));

  const count = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
  const overdueNow = routines.filter((r) => r.overdue).length;
  const missingCounters = coverage.filter((c) => c.missing !== "0").length;
  return {
    vessel: { name: vessel.name, code: vessel.code, imoNumber: vessel.imoNumber },
    company,
    from: data.from,
    to: data.to,
    period: `${dayKeyWords(data.from)} – ${dayKeyWords(data.to)} (ship’s days, ${tz})`,
    listed: `Listed ${format(new TZDate(now, "UTC"), "d MMM yyyy HH:mm")} UTC.`,
    summary: [
      ["Critical and class-related routines", `${routines.length}, ${overdueNow} late or out of tolerance now`],
      ["Open deferrals", `${deferrals.length}, ${data.deferrals.filter((d) => d.status === "pending").length} awaiting a decision`],
      ["Open defects", String(defects.length)],
      ["Work done late in the period", `${count(lateWork.length, "work order")}`],
      ["Counters", `${coverage.length}, ${missingCounters} with days without a reading`],
    ],
    routines,
    deferrals,
    defects,
    coverage,
    lateWork,
  };
}
