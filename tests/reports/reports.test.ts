// The PDF reports through the running app as signed-in people fetch them: the job card of a work
// order, a port stay's work package (proposed, then accepted) and the fleet's overdue list, read
// back with pdf.js; another company's records are the same 404 as records that do not exist.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { shipDay } from "@/server/format/hours";
import type { PortStayView, ProposalView } from "@/server/port-stays/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, BASE_URL, type Session, signIn } from "../support/http";
import { readPdf } from "../support/pdf-text";

const DAY = 86_400_000;
const STEPS = ["Isolate and lock out", "Open up the crankcase", "Gauge the liner", "Box up and test run"];
let f: Fixture;
let other: Fixture;
const as = {} as Record<"engineer" | "chief" | "viewer" | "superintendent" | "otherChief", Session>;
const card = { id: "", number: "" };
let otherWorkOrderId = "";
let purifier = { id: "", number: "" };

/** A GET as a browser's download: the status, the headers and the bytes. */
async function download(session: Session | null, path: string) {
  const response = await fetch(`${BASE_URL}${path}`, { headers: session ? { cookie: session.cookie } : {} });
  return {
    status: response.status,
    type: response.headers.get("content-type"),
    disposition: response.headers.get("content-disposition"),
    bytes: new Uint8Array(await response.arrayBuffer()),
  };
}

async function routineWorkOrder(fx: Fixture, code: string) {
  const db = testDb();
  const [comp] = await db
    .insert(s.component)
    .values({ companyId: fx.companyId, vesselId: fx.vesselA.id, code, name: "Cylinder unit 1", counterId: fx.counters.main.id, critical: true })
    .returning();
  const [routine] = await db
    .insert(s.routine)
    .values({
      companyId: fx.companyId,
      vesselId: fx.vesselA.id,
      componentId: comp!.id,
      title: "Cylinder unit 1: piston overhaul",
      intervalHours: 100,
      baselineHours: 925,
      baselineAt: new Date(Date.now() - 5 * DAY),
      checklist: STEPS,
      measurements: [
        { name: "Liner wear", unit: "mm", lower: null, upper: 0.8 },
        { name: "Ring gap", unit: "mm", lower: 0.4, upper: 1.2 },
      ],
      cautions: ["isolation", "turning-gear"],
      spareParts: "Piston ring set",
      critical: true,
    })
    .returning();
  await recomputeVessel(db, fx.companyId, fx.vesselA.id);
  const [order] = await db
    .select()
    .from(s.workOrder)
    .where(and(eq(s.workOrder.companyId, fx.companyId), eq(s.workOrder.routineId, routine!.id)));
  return order!;
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("reports"), createCompany("reports-other")]);
  const order = await routineWorkOrder(f, "ME.CYL.1");
  card.id = order.id;
  card.number = order.number;
  otherWorkOrderId = (await routineWorkOrder(other, "ME.CYL.1")).id;
  // Late work needing port, for the stay's package and the fleet's overdue list.
  const db = testDb();
  const [comp] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "PUR.1", name: "Fuel oil purifier 1" })
    .returning();
  const [late] = await db
    .insert(s.workOrder)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: comp!.id,
      number: "WO-ALPHA-P1",
      title: "Purifier overhaul",
      occurrence: 1,
      state: "late",
      dueDate: new Date(Date.now() - 3 * DAY),
      outOfToleranceAt: new Date(Date.now() + 60 * DAY),
      needsPort: true,
      rank: "second-engineer",
      team: [{ rank: "second-engineer", count: 1 }],
      elapsedHours: 6,
      estimatedManHours: 6,
    })
    .returning();
  purifier = { id: late!.id, number: late!.number };
  [as.engineer, as.chief, as.viewer, as.superintendent, as.otherChief] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(other.users["chief-engineer"].email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

const cardPath = (workOrderId: string, vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/work-orders/${workOrderId}/card`;

describe("the job card", () => {
  it("is a PDF of the work order with its checklist, measurements and limits, and sign-off lines", async () => {
    const res = await download(as.engineer, cardPath(card.id));
    expect(res.status).toBe(200);
    expect(res.type).toBe("application/pdf");
    expect(res.disposition).toBe(`attachment; filename="${card.number}-job-card.pdf"`);
    const { all, pages, fonts } = await readPdf(res.bytes);
    expect(pages.length).toBeGreaterThanOrEqual(1);
    expect(pages.length).toBeLessThanOrEqual(2);
    for (const text of [
      card.number,
      f.vesselA.name,
      "Cylinder unit 1: piston overhaul",
      "ME.CYL.1",
      "Critical equipment",
      "every 100 h",
      "Before you start",
      "Isolate and lock out.",
      "Turning gear.",
      "class requirements prevail",
      ...STEPS,
      "Liner wear",
      "0.8 mm",
      "Ring gap",
      "0.4 mm",
      "1.2 mm",
      "Piston ring set",
      "Counter reading (Main engine)",
      "Done by",
      "Answered for by",
      "Approved by the chief engineer",
    ]) {
      expect(all, text).toContain(text);
    }
    expect(all).not.toContain("Why it was not done");
    // Nothing of today is written in: the day of the work is the crew's to write.
    const today = shipDay(new Date(), f.vesselA.timeZone);
    expect(all).not.toContain(today);
    expect(fonts.filter((name) => /^[A-Z]{6}\+Inter-/.test(name)).length).toBe(fonts.length);
    expect(res.bytes.length).toBeLessThan(60_000);
  });

  it("is the same 404 for another company's work order, another company's vessel and an unassigned vessel", async () => {
    const foreign = await api(as.engineer, "GET", cardPath(otherWorkOrderId));
    expect(foreign.status).toBe(404);
    expect(foreign.contentType).toMatch(/application\/problem\+json/);
    expect((await api(as.engineer, "GET", cardPath(otherWorkOrderId, other.vesselA.id))).status).toBe(404);
    expect((await api(as.engineer, "GET", cardPath(card.id, f.vesselB.id))).status).toBe(404);
    expect((await api(as.otherChief, "GET", cardPath(card.id))).status).toBe(404);
    expect((await api(null, "GET", cardPath(card.id))).status).toBe(401);
    // Its owner reads it as a viewer too.
    expect((await download(as.viewer, cardPath(card.id))).status).toBe(200);
  });
});

describe("the port stay's work package", () => {
  let stay: PortStayView;
  const dayIn = (n: number) => shipDay(new Date(Date.now() + n * DAY), f.vesselA.timeZone);
  const pdfPath = () => `/api/vessels/${f.vesselA.id}/port-stays/${stay.id}/package/pdf`;

  it("is the planner's proposal, marked as not accepted, for the chief engineer before one is accepted", async () => {
    const created = await api<PortStayView>(as.chief, "POST", `/api/vessels/${f.vesselA.id}/port-stays`, {
      port: "Port Louis",
      arrivesAt: `${dayIn(3)}T07:00`,
      departsAt: `${dayIn(4)}T19:00`,
      workdayFrom: "07:00",
      workdayTo: "19:00",
      engineStop: null,
      crew: [{ rank: "second-engineer", count: 1 }],
      watches: [],
    });
    expect(created.status).toBe(201);
    stay = created.body;
    const res = await download(as.chief, pdfPath());
    expect(res.status).toBe(200);
    expect(res.type).toBe("application/pdf");
    expect(res.disposition).toBe(`attachment; filename="work-package-ALPHA-Port-Louis.pdf"`);
    const { all } = await readPdf(res.bytes);
    expect(all).toContain("Port Louis");
    expect(all).toContain("Proposed by Keelson from the due work: not accepted yet");
    expect(all).toContain(purifier.number);
    // A viewer is not offered proposals: the sheet says no package was accepted.
    const { all: viewerText } = await readPdf((await download(as.viewer, pdfPath())).bytes);
    expect(viewerText).toContain("No work package was accepted for this stay.");
    expect(viewerText).not.toContain(purifier.number);
  });

  it("is the accepted package once the chief engineer accepts it, with the day, the people and the man-hours", async () => {
    const proposal = await api<ProposalView>(as.chief, "POST", `/api/vessels/${f.vesselA.id}/port-stays/${stay.id}/proposal`);
    expect(proposal.status).toBe(200);
    const items = proposal.body.items.map((i) => ({ workOrderId: i.workOrderId, start: i.startLocal, people: i.people, reason: i.reason }));
    expect(items.map((i) => i.workOrderId)).toContain(purifier.id);
    expect((await api(as.chief, "PUT", `/api/vessels/${f.vesselA.id}/port-stays/${stay.id}/package`, { items })).status).toBe(200);
    const { all, pages } = await readPdf((await download(as.engineer, pdfPath())).bytes);
    expect(pages.length).toBeGreaterThanOrEqual(1);
    expect(all).toMatch(/Accepted \d{1,2} \w{3} \d{4} \d{2}:\d{2} by chief-engineer/);
    expect(all).toContain(purifier.number);
    expect(all).toContain("Purifier overhaul");
    expect(all).toContain("Hours of each person");
    expect(all).toContain("Second engineer");
    expect(all).toContain("6 h");
    expect(all).toContain("Package accepted by the chief engineer");
  });

  it("is 404 for another company's chief engineer", async () => {
    expect((await api(as.otherChief, "GET", pdfPath())).status).toBe(404);
    expect((await api(as.otherChief, "GET", `/api/vessels/${other.vesselA.id}/port-stays/${stay.id}/package/pdf`)).status).toBe(404);
  });
});

describe("the fleet's overdue list", () => {
  it("is a PDF of the company's late work for the office, under the list's filters", async () => {
    const res = await download(as.superintendent, "/api/fleet/overdue/pdf?state=late");
    expect(res.status).toBe(200);
    expect(res.type).toBe("application/pdf");
    expect(res.disposition).toMatch(/^attachment; filename="overdue-\d{4}-\d{2}-\d{2}\.pdf"$/);
    const { all } = await readPdf(res.bytes);
    expect(all).toContain("OVERDUE WORK");
    expect(all).toContain(purifier.number);
    expect(all).toContain(f.vesselA.name);
    expect(all).toContain("late only");
    // Only this company's work.
    expect(all).not.toContain(other.vesselA.name);
  });

  it("refuses a bad filter by name and is not for the crew", async () => {
    const bad = await api<{ errors: { field: string }[] }>(as.superintendent, "GET", "/api/fleet/overdue/pdf?state=soon");
    expect(bad.status).toBe(422);
    expect(bad.body.errors.map((e) => e.field)).toEqual(["query.state"]);
    expect((await api(as.engineer, "GET", "/api/fleet/overdue/pdf")).status).toBe(403);
  });
});

describe("the survey and audit report", () => {
  const surveyPath = (query: string, vesselId = f.vesselA.id) => `/api/vessels/${vesselId}/reports/survey${query}`;
  const today = () => shipDay(new Date(), f.vesselA.timeZone);
  const daysAgo = (n: number) => shipDay(new Date(Date.now() - n * DAY), f.vesselA.timeZone);

  beforeAll(async () => {
    const db = testDb();
    // A critical job done two days ago, past its grace, with no state recorded before (history):
    // judged against its limits, out of tolerance.
    const [comp] = await db
      .insert(s.component)
      .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "EG", name: "Emergency generator" })
      .returning();
    const [done] = await db
      .insert(s.workOrder)
      .values({
        companyId: f.companyId,
        vesselId: f.vesselA.id,
        componentId: comp!.id,
        number: "WO-ALPHA-EG1",
        title: "Emergency generator load test",
        occurrence: 1,
        state: "done",
        dueDate: new Date(Date.now() - 20 * DAY),
        graceEndsAt: new Date(Date.now() - 10 * DAY),
        critical: true,
        completedAt: new Date(Date.now() - 2 * DAY),
      })
      .returning();
    await db.insert(s.completion).values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      workOrderId: done!.id,
      doneAt: new Date(Date.now() - 2 * DAY),
      manHours: 2,
      status: "approved",
      doneBy: f.users.engineer.id,
    });
    // A deferral of the overhaul waiting for the office.
    await db.insert(s.deferral).values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      workOrderId: card.id,
      reason: "The spare liner arrives at the next port.",
      proposedDueHours: 1200,
      needsOffice: true,
      requestedBy: f.users["chief-engineer"].id,
    });
  });

  it("is a PDF of the period's critical and class-related routines, deferrals, readings and late work", async () => {
    const res = await download(as.engineer, surveyPath(`?from=${daysAgo(29)}&to=${today()}`));
    expect(res.status).toBe(200);
    expect(res.type).toBe("application/pdf");
    expect(res.disposition).toBe(`attachment; filename="survey-report-ALPHA-${daysAgo(29)}-${today()}.pdf"`);
    const { all } = await readPdf(res.bytes);
    for (const text of [
      "SURVEY AND AUDIT REPORT",
      f.vesselA.name,
      "Cylinder unit 1: piston overhaul",
      card.number,
      "The spare liner arrives at the next port.",
      "awaiting the technical superintendent’s decision",
      "Readings coverage",
      "Generator 1",
      "WO-ALPHA-EG1",
      "Emergency generator load test",
      "out of tolerance",
    ]) {
      expect(all, text).toContain(text);
    }
    // The fixture reads each counter once, yesterday (ship's time): from that first day on, one
    // whole day is expected (today is not over), and it was read.
    expect(all).toMatch(/Main engine 1 0 — \d{1,2} \w{3} \d{4} \d{2}:\d{2} · 1,000 h/);
  });

  it("takes the twelve months up to today when no period is given, and refuses a period backwards by name", async () => {
    const res = await download(as.viewer, surveyPath(""));
    expect(res.status).toBe(200);
    expect(res.disposition).toContain(`-${today()}.pdf`);
    const bad = await api<{ errors: { field: string }[] }>(as.engineer, "GET", surveyPath(`?from=${today()}&to=${daysAgo(3)}`));
    expect(bad.status).toBe(422);
    expect(bad.body.errors.map((e) => e.field)).toEqual(["query.to"]);
    const malformed = await api<{ errors: { field: string }[] }>(as.engineer, "GET", surveyPath("?from=yesterday"));
    expect(malformed.body.errors.map((e) => e.field)).toEqual(["query.from"]);
  });

  it("is 404 on another company's vessel", async () => {
    expect((await api(as.engineer, "GET", surveyPath("", other.vesselA.id))).status).toBe(404);
    expect((await api(as.otherChief, "GET", surveyPath(""))).status).toBe(404);
  });
});

