import { writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import type { PlacedView, PortStayDetail } from "@/server/port-stays/contract";
import { rankWords } from "@/server/routines/rank-names";
import { readPdf } from "@/tests/support/pdf-text";
import { renderWorkPackage } from "./work-package";
import { workPackageOf } from "./work-package-data";

const TZ = "Asia/Singapore"; // UTC+8, no clock changes

function job(n: number, start: string, hours: number, people: string[], over: Partial<PlacedView> = {}): PlacedView {
  const from = new Date(start);
  const to = new Date(from.getTime() + hours * 3_600_000);
  return {
    workOrderId: `wo-${n}`,
    number: `WO-SUL-${String(n).padStart(5, "0")}`,
    title: `Job ${n}`,
    componentCode: `AE.${n}`,
    componentName: `Generator ${n}`,
    state: "window-open",
    team: [{ rank: "second-engineer", count: 1 }, ...(people.length > 1 ? [{ rank: "motorman", count: people.length - 1 }] : [])],
    elapsedHours: hours,
    manHours: hours * people.length,
    needsEngineStop: false,
    needsPort: false,
    tiedTo: null,
    critical: false,
    classRelated: false,
    dueAt: null,
    planFrom: null,
    planUntil: null,
    start: from.toISOString(),
    end: to.toISOString(),
    startLocal: "",
    segments: [{ from: from.toISOString(), to: to.toISOString() }],
    people,
    reason: `Falls due before the next stay (${n}).`,
    urgency: null,
    group: "sea",
    ...over,
  };
}

const detail: PortStayDetail = {
  vessel: { id: "v", name: "Sula Meridian", code: "SUL", timeZone: TZ },
  stay: {
    id: "s",
    port: "Port Louis",
    // 4 Dec 07:00 – 5 Dec 19:00 ship's time
    arrivesAt: "2026-12-03T23:00:00.000Z",
    departsAt: "2026-12-05T11:00:00.000Z",
    arrivesLocal: "2026-12-04T07:00",
    departsLocal: "2026-12-05T19:00",
    days: ["2026-12-04", "2026-12-05"],
    workdayFrom: "08:00",
    workdayTo: "17:00",
    engineStop: { from: "2026-12-04T00:00:00.000Z", to: "2026-12-04T09:00:00.000Z", fromLocal: "2026-12-04T08:00", toLocal: "2026-12-04T17:00" },
    crew: [
      { rank: "second-engineer", count: 1 },
      { rank: "motorman", count: 2 },
    ],
    watches: [{ rank: "motorman", person: 2, from: "2026-12-05T00:00:00.000Z", to: "2026-12-05T04:00:00.000Z", fromLocal: "", toLocal: "", label: "Bunkering" }],
    remarks: "",
    packageAcceptedAt: "2026-12-01T02:00:00.000Z",
    packageAcceptedBy: "Chief Example",
    itemCount: 2,
  },
  items: [
    // 4 Dec 08:00–12:00 ship's time, engine stopped, two people
    job(1, "2026-12-04T00:00:00.000Z", 4, ["second-engineer#1", "motorman#1"], { needsEngineStop: true, critical: true }),
    // 5 Dec 13:00–16:00, one person
    job(2, "2026-12-05T05:00:00.000Z", 3, ["motorman#1"]),
  ],
  now: "2026-12-02T00:00:00.000Z",
  may: { plan: true },
};

describe("the port stay's work package", () => {
  it("words the stay, its days, each person's hours and the totals from the accepted package", () => {
    const pkg = workPackageOf(detail, "9395044", rankWords({ motorman: "Wiper" }), null);
    expect(pkg.status).toBe("Accepted 1 Dec 2026 10:00 by Chief Example");
    expect(pkg.days.map((d) => d.label)).toEqual(["Fri 4 Dec 2026", "Sat 5 Dec 2026"]);
    // 4 h × 2 people and 3 h × 1 person
    expect(pkg.days.map((d) => d.summary)).toEqual(["1 job · 8 man-hours", "1 job · 3 man-hours"]);
    expect(pkg.days[0]!.jobs[0]).toMatchObject({ when: "08:00–12:00", flags: "engine stopped · critical", people: "Second engineer, Wiper 1" });
    expect(pkg.people).toEqual([
      { name: "Wiper 1", byDay: "Fri 4 Dec 4 h · Sat 5 Dec 3 h", total: "7 h" },
      { name: "Second engineer", byDay: "Fri 4 Dec 4 h", total: "4 h" },
    ]);
    expect(pkg.crew).toBe("1 × Second engineer · 2 × Wiper");
    expect(pkg.watches).toEqual(["Bunkering: Wiper 2, 5 Dec 2026 08:00 – 5 Dec 2026 12:00"]);
    expect(pkg.facts).toContainEqual(["Work", "2 jobs · 11 man-hours over 2 days"]);
  });

  it("prints the package with its jobs, tick boxes, people and the chief engineer's sign-off", async () => {
    const pdf = await renderWorkPackage(workPackageOf(detail, "9395044", rankWords(), null));
    if (process.env.REPORTS_SAMPLE_DIR) writeFileSync(`${process.env.REPORTS_SAMPLE_DIR}/work-package.pdf`, pdf);
    const { all, pages } = await readPdf(pdf);
    expect(pages).toHaveLength(1);
    for (const text of [
      "WORK PACKAGE",
      "Port Louis",
      "Accepted 1 Dec 2026 10:00 by Chief Example",
      "Fri 4 Dec 2026 — 1 job · 8 man-hours",
      "WO-SUL-00001",
      "WO-SUL-00002",
      "Generator 1",
      "Hours of each person",
      "Motorman 1",
      "Bunkering",
      "Package accepted by the chief engineer",
      "Signature",
      "the maker’s instruction manual",
    ]) {
      expect(all, text).toContain(text);
    }
    expect(pdf.length).toBeLessThan(60_000);
  });

  it("prints a proposal as not accepted, with the work left out and why", async () => {
    const proposal = {
      horizon: "",
      nextStay: null,
      lookAheadDays: 30,
      items: detail.items,
      leftOut: [{ ...detail.items[1]!, number: "WO-SUL-00099", title: "Purifier overhaul", urgency: "falls-due" as const, group: "sea" as const, reason: "no-people" as const, message: "No motorman is free long enough." }],
      atSea: [],
      people: [],
      value: 0,
      possible: 0,
      slotMinutes: 30,
    } as unknown as Parameters<typeof workPackageOf>[3];
    const unaccepted = { ...detail, items: [], stay: { ...detail.stay, packageAcceptedAt: null, packageAcceptedBy: null } };
    const { all } = await readPdf(await renderWorkPackage(workPackageOf(unaccepted, "9395044", rankWords(), proposal)));
    expect(all).toContain("Proposed by Keelson from the due work: not accepted yet");
    expect(all).toContain("WO-SUL-00001");
    expect(all).toContain("Left out of the proposal");
    expect(all).toContain("No motorman is free long enough.");
  });

  it("runs a long package over pages with each day's header again", async () => {
    const items = Array.from({ length: 60 }, (_, i) => job(i + 1, `2026-12-04T0${i % 8}:00:00.000Z`, 1, ["motorman#1"]));
    const { pages } = await readPdf(await renderWorkPackage(workPackageOf({ ...detail, items }, "9395044", rankWords(), null)));
    expect(pages.length).toBeGreaterThanOrEqual(3);
    const bare = pages.map((p) => p.replace(/\s+/g, ""));
    for (let n = 1; n <= 60; n++) {
      expect(bare.filter((p) => p.includes(`WO-SUL-${String(n).padStart(5, "0")}Job${n}`)), `job ${n}`).toHaveLength(1);
    }
    for (const page of pages.slice(1, -1)) expect(page.replace(/\s+/g, " ")).toContain("Fri 4 Dec 2026 (continued)");
  });
});
