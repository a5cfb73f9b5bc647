import { writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import type { DefectView } from "@/server/defects/contract";
import type { DeferralListItem } from "@/server/deferrals/contract";
import { readPdf } from "@/tests/support/pdf-text";
import { SurveyReportQuery } from "./contract";
import { renderSurveyReport } from "./survey-report";
import { surveyReportOf } from "./survey-report-data";
import type { SurveyData, SurveyRoutine } from "./survey-queries";
import { readingCoverage, daysOf } from "./survey-rules";

const vessel = { name: "Sula Meridian", code: "SUL", imoNumber: "9395044", timeZone: "UTC" };
const d = (iso: string) => new Date(iso);

function routine(n: number, over: Partial<SurveyRoutine> = {}): SurveyRoutine {
  return {
    id: `r${n}`,
    title: `Class routine ${n}`,
    classItemRef: `MC-${n}`,
    critical: n % 2 === 0,
    classRelated: true,
    component: { code: `ME.${n}`, name: `Main engine part ${n}`, classItemRef: null },
    open: {
      number: `WO-SUL-${String(n).padStart(5, "0")}`,
      state: n === 1 ? "out-of-tolerance" : "window-open",
      dueDate: d("2026-09-15T23:59:59Z"),
      dueHours: null,
      deferredDueDate: null,
      deferredDueHours: null,
      windowOpensAt: d("2026-06-16T00:00:00Z"),
      graceEndsAt: d("2026-12-15T23:59:59Z"),
      windowOpensHours: null,
      graceEndsHours: null,
    },
    lastDone: { doneAt: d("2025-09-10T08:00:00Z"), counterHours: 41_200 },
    ...over,
  };
}

const deferral = {
  id: "df1",
  workOrderId: "w2",
  status: "pending",
  reason: "Spare liner arrives at the next port.",
  proposedDueDay: "2026-11-30",
  proposedDueHours: null,
  needsOffice: true,
  requestedBy: "Chief Example",
  requestedAt: "2026-08-01T10:00:00.000Z",
  decidedBy: null,
  decidedAt: null,
  decisionNote: null,
  vessel: { id: "v", name: "Sula Meridian", code: "SUL" },
  workOrder: { id: "w2", number: "WO-SUL-00002", title: "Class routine 2", state: "window-open", critical: true, classRelated: true },
} as DeferralListItem;

const defect = {
  number: "DR-SUL-0003",
  title: "Leaking jacket water seal on unit 4",
  component: { id: "c", code: "ME.CYL.4", name: "Cylinder unit 4" },
  foundAt: "2026-08-20T06:00:00.000Z",
  reportedBy: "Second Example",
  affectsCritical: true,
  affectsSafety: false,
  affectsClass: true,
  state: "planned",
  targetDay: "2026-09-10",
  workOrder: { id: "w9", number: "WO-SUL-00099", state: "window-open" },
  ageDays: 12,
} as DefectView;

const data: SurveyData = {
  from: "2026-08-01",
  to: "2026-08-31",
  routines: [routine(1), routine(2), routine(3, { open: null, lastDone: null })],
  deferrals: [deferral],
  defects: [defect],
  counters: [
    {
      name: "Main engine",
      coverage: readingCoverage(daysOf("2026-08-01", "2026-08-31"), new Set(daysOf("2026-08-01", "2026-08-31").filter((x) => x < "2026-08-10" || x > "2026-08-14")), "2026-01-01"),
      lastReading: { readAt: d("2026-08-31T08:00:00Z"), totalHours: 42_010 },
    },
  ],
  lateWork: [
    {
      number: "WO-SUL-00050",
      title: "Emergency generator load test",
      component: { code: "EG", name: "Emergency generator" },
      critical: true,
      classRelated: false,
      doneAt: d("2026-08-12T09:00:00Z"),
      counterHours: null,
      dueAt: d("2026-08-01T23:59:59Z"),
      dueHours: null,
      judged: "late",
    },
  ],
};

describe("the survey and audit report", () => {
  it("words every section from the records", () => {
    const r = surveyReportOf(data, vessel, "Meridian Shipping", d("2026-09-01T00:00:00Z"));
    expect(r.period).toBe("1 Aug 2026 – 31 Aug 2026 (ship’s days, UTC)");
    expect(r.routines[0]).toMatchObject({
      classItem: "MC-1",
      lastDone: "10 Sep 2025 · at 41,200 h",
      nextDue: "15 Sep 2026\nWO-SUL-00001",
      window: "16 Jun 2026 – 15 Dec 2026",
      state: "out of tolerance",
      overdue: true,
    });
    expect(r.routines[2]).toMatchObject({ lastDone: "not done in Keelson", nextDue: "no open work order", state: "—" });
    expect(r.deferrals[0]).toMatchObject({ proposed: "30 Nov 2026", decision: "awaiting the technical superintendent’s decision" });
    // Read every day but 10–14 Aug: 5 days in a row without a reading.
    expect(r.coverage[0]).toMatchObject({ days: "31", missing: "5", longestGap: "5 days, 10 Aug 2026 – 14 Aug 2026" });
    expect(r.lateWork[0]).toMatchObject({ due: "1 Aug 2026", done: "12 Aug 2026", judged: "late" });
    expect(r.summary).toContainEqual(["Critical and class-related routines", "3, 1 late or out of tolerance now"]);
  });

  it("prints the report with its sections, tables and period", async () => {
    const pdf = await renderSurveyReport(surveyReportOf(data, vessel, "Meridian Shipping", d("2026-09-01T00:00:00Z")));
    if (process.env.REPORTS_SAMPLE_DIR) writeFileSync(`${process.env.REPORTS_SAMPLE_DIR}/survey.pdf`, pdf);
    const { all, pages } = await readPdf(pdf);
    expect(pages.length).toBeGreaterThanOrEqual(1);
    for (const text of [
      "SURVEY AND AUDIT REPORT",
      "Sula Meridian · SUL · IMO 9395044",
      "Period 1 Aug 2026 – 31 Aug 2026",
      "Critical and class-related routines",
      "MC-1",
      "Class routine 1",
      "out of tolerance",
      "Open deferrals and their decisions",
      "Spare liner arrives at the next port.",
      "Open defects",
      "DR-SUL-0003",
      "Readings coverage",
      "Main engine",
      "Work done late or out of tolerance in the period",
      "WO-SUL-00050",
      "Emergency generator load test",
    ]) {
      expect(all, text).toContain(text);
    }
  });

  it("says so where a section is empty", async () => {
    const empty: SurveyData = { ...data, routines: [], deferrals: [], defects: [], counters: [], lateWork: [] };
    const { all } = await readPdf(await renderSurveyReport(surveyReportOf(empty, vessel, "Meridian Shipping", new Date())));
    expect(all).toContain("The vessel has no critical or class-related routine.");
    expect(all).toContain("No deferral is pending or in force.");
    expect(all).toContain("No defect is open.");
    expect(all).toContain("All work done in the period was done on time.");
  });

  it("takes a period of at most five years, the last day not before the first", () => {
    expect(SurveyReportQuery.safeParse({ from: "2025-01-01", to: "2025-12-31" }).success).toBe(true);
    expect(SurveyReportQuery.safeParse({}).success).toBe(true);
    const backwards = SurveyReportQuery.safeParse({ from: "2025-02-01", to: "2025-01-31" });
    expect(backwards.error?.issues.map((i) => i.path.join("."))).toEqual(["to"]);
    expect(SurveyReportQuery.safeParse({ from: "2019-01-01", to: "2025-01-31" }).error?.issues[0]?.message).toMatch(/five years/);
    expect(SurveyReportQuery.safeParse({ from: "2026-13-01" }).success).toBe(false);
  });
});
