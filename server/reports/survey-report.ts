// The vessel's survey and audit report for a period (landscape): the critical and class-related
// routines with their last done, next due, window and state; open deferrals with their decisions;
// open defects; how well each counter was read; and work done late or out of tolerance.
import { type Cell, type Column, GREY, Sheet } from "./pdf-sheet";

export type SurveyReport = {
  vessel: { name: string; code: string; imoNumber: string };
  company: string;
  /** The period's first and last ship's day ("YYYY-MM-DD"). */
  from: string;
  to: string;
  /** "1 Jan 2026 – 31 Dec 2026 (ship’s days, Asia/Singapore)" */
  period: string;
  /** "Listed 5 Dec 2026 19:50 UTC, …" */
  listed: string;
  summary: [string, string][];
  routines: {
    classItem: string;
    component: string;
    routine: string;
    flags: string;
    lastDone: string;
    nextDue: string;
    window: string;
    state: string;
    overdue: boolean;
  }[];
  deferrals: { workOrder: string; title: string; asked: string; reason: string; proposed: string; decision: string }[];
  defects: { number: string; title: string; component: string; found: string; flags: string; state: string; repair: string }[];
  coverage: { counter: string; days: string; missing: string; longestGap: string; lastReading: string }[];
  lateWork: { workOrder: string; title: string; component: string; flags: string; due: string; done: string; judged: string }[];
};

const small = (text: string): Cell => ({ text, size: 8.5 });

export async function renderSurveyReport(report: SurveyReport): Promise<Buffer> {
  const sheet = new Sheet({
    layout: "landscape",
    title: `Survey and audit report: ${report.vessel.name}, ${report.period}`,
    subject: `Maintenance records of ${report.vessel.name} for a survey or audit`,
    runningHead: `Survey and audit report · ${report.vessel.name} · ${report.period}`,
    footer: `Survey and audit report · ${report.vessel.name} · IMO ${report.vessel.imoNumber} · Keelson`,
  });
  sheet.text(`SURVEY AND AUDIT REPORT · ${report.company}`, { face: "bold", size: 8.5, color: GREY });
  sheet.gap(2);
  sheet.text(`${report.vessel.name} · ${report.vessel.code} · IMO ${report.vessel.imoNumber}`, { face: "bold", size: 16 });
  sheet.text(`Period ${report.period}. ${report.listed}`, { size: 9 });
  sheet.gap(4);
  sheet.rule(sheet.y, 1.5);
  sheet.gap(8);
  sheet.facts(report.summary, 4);
  sheet.text(
    "Keelson plans and records; the maker’s instruction manual, the company’s safety management system, flag-state and class requirements prevail. The states are those the worker last computed.",
    { size: 8.5, color: GREY },
  );

  const w = sheet.width;
  sheet.heading("Critical and class-related routines");
  if (!report.routines.length) sheet.text("The vessel has no critical or class-related routine.");
  else {
    const columns: Column[] = [
      { header: "Class item", width: 70 },
      { header: "Component and routine", width: w - 70 - 110 - 120 - 150 - 95 },
      { header: "Last done", width: 110 },
      { header: "Next due", width: 120 },
      { header: "Window", width: 150 },
      { header: "State", width: 95 },
    ];
    sheet.table(
      columns,
      report.routines.map((r) => [
        small(r.classItem),
        { lines: [{ text: r.routine, face: "bold", size: 8.5 }, { text: r.component, size: 8 }, { text: r.flags, size: 7.5, color: GREY }] },
        small(r.lastDone),
        small(r.nextDue),
        small(r.window),
        { text: r.state, size: 8.5, face: r.overdue ? "bold" : "regular" },
      ]),
      { title: "Critical and class-related routines" },
    );
  }

  sheet.heading("Open deferrals and their decisions");
  if (!report.deferrals.length) sheet.text("No deferral is pending or in force.");
  else {
    const columns: Column[] = [
      { header: "Work order", width: 170 },
      { header: "Asked", width: 110 },
      { header: "Reason", width: w - 170 - 110 - 110 - 190 },
      { header: "New limit asked", width: 110 },
      { header: "Decision", width: 190 },
    ];
    sheet.table(
      columns,
      report.deferrals.map((d) => [
        { lines: [{ text: d.workOrder, face: "bold", size: 8.5 }, { text: d.title, size: 8.5 }] },
        small(d.asked),
        small(d.reason),
        small(d.proposed),
        small(d.decision),
      ]),
      { title: "Open deferrals" },
    );
  }

  sheet.heading("Open defects");
  if (!report.defects.length) sheet.text("No defect is open.");
  else {
    const columns: Column[] = [
      { header: "Defect", width: w - 110 - 90 - 150 - 130 },
      { header: "Found", width: 110 },
      { header: "State", width: 90 },
      { header: "Affects", width: 150 },
      { header: "Repair", width: 130 },
    ];
    sheet.table(
      columns,
      report.defects.map((d) => [
        { lines: [{ text: `${d.number}  ${d.title}`, face: "bold", size: 8.5 }, { text: d.component, size: 8 }] },
        small(d.found),
        small(d.state),
        small(d.flags),
        small(d.repair),
      ]),
      { title: "Open defects" },
    );
  }

  sheet.heading("Readings coverage");
  sheet.text("Whole ship’s days of the period (up to yesterday) without any reading of the counter; days before a counter’s first reading are not counted.", {
    size: 8.5,
    color: GREY,
  });
  sheet.gap(4);
  if (!report.coverage.length) sheet.text("The vessel has no counter.");
  else {
    const columns: Column[] = [
      { header: "Counter", width: w - 90 - 110 - 200 - 150 },
      { header: "Days expected", width: 90, align: "right" },
      { header: "Days without a reading", width: 110, align: "right" },
      { header: "Longest gap", width: 200 },
      { header: "Last reading in the period", width: 150 },
    ];
    sheet.table(
      columns,
      report.coverage.map((c) => [small(c.counter), small(c.days), small(c.missing), small(c.longestGap), small(c.lastReading)]),
      { title: "Readings coverage" },
    );
  }

  sheet.heading("Work done late or out of tolerance in the period");
  if (!report.lateWork.length) sheet.text("All work done in the period was done on time.");
  else {
    const columns: Column[] = [
      { header: "Work order", width: w - 130 - 150 - 130 - 110 },
      { header: "Affects", width: 130 },
      { header: "Due", width: 150 },
      { header: "Done", width: 130 },
      { header: "Judged", width: 110 },
    ];
    sheet.table(
      columns,
      report.lateWork.map((l) => [
        { lines: [{ text: `${l.workOrder}  ${l.title}`, face: "bold", size: 8.5 }, { text: l.component, size: 8 }] },
        small(l.flags),
        small(l.due),
        small(l.done),
        { text: l.judged, size: 8.5, face: "bold" },
      ]),
      { title: "Work done late or out of tolerance" },
    );
  }
  return sheet.finish();
}
