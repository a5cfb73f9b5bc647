// The class items (issue 14): a vessel's class-related routines as a surveyor goes through them,
// and the fleet's for the superintendent. Real PostgreSQL, the worker's recompute, the running app.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { ClassItem } from "@/server/class-items/contract";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let other: Fixture;
let chief: Session;
let superintendent: Session;
let otherChief: Session;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("class-items"), createCompany("class-items-other")]);
  const db = testDb();
  const [hull] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "SG", name: "Steering gear" })
    .returning();
  const [boiler] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselB.id, code: "AB", name: "Auxiliary boiler" })
    .returning();
  await db.insert(s.routine).values([
    {
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: hull!.id,
      title: "Steering gear annual survey item",
      calendarRule: "FREQ=YEARLY",
      anchored: true,
      anchorDate: "2026-04-15",
      classRelated: true,
      classItemRef: "SG-01",
      critical: true,
    },
    {
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      componentId: hull!.id,
      title: "Grease the rudder carrier",
      calendarRule: "FREQ=MONTHLY",
      baselineAt: new Date("2026-05-01T00:00:00Z"),
    },
    {
      companyId: f.companyId,
      vesselId: f.vesselB.id,
      componentId: boiler!.id,
      title: "Boiler internal examination",
      calendarRule: "FREQ=YEARLY;INTERVAL=2",
      anchored: true,
      anchorDate: "2026-09-30",
      classRelated: true,
      classItemRef: "AB-02",
    },
  ]);
  // 1 June 2026: after the 15 April anniversary, inside class's 3 months after it.
  const now = new Date("2026-06-01T04:00:00Z");
  await recomputeVessel(db, f.companyId, f.vesselA.id, now);
  await recomputeVessel(db, f.companyId, f.vesselB.id, now);
  [chief, superintendent, otherChief] = await Promise.all([
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
    signIn(other.users["chief-engineer"].email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

describe("a vessel's class items", () => {
  it("lists only the class-related routines, with the IACS window and no late inside it", async () => {
    const res = await api<{ items: ClassItem[] }>(chief, "GET", `/api/vessels/${f.vesselA.id}/class-items`);
    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(1);
    const [item] = res.body.items;
    expect(item).toMatchObject({
      reference: "SG-01",
      component: { code: "SG", name: "Steering gear" },
      anniversary: "2026-04-15",
      lastDone: null,
      deferral: null,
    });
    // IACS booklet (SOURCES.md): anniversary 15 April → window 16 January to 15 July; HSSC, IMO Res.
    // A.1104(29) 4.2.1: done inside it is on time, so on 1 June the item is still window-open, not late.
    expect(item!.workOrder).toMatchObject({ state: "window-open", windowFrom: "2026-01-16", windowUntil: "2026-07-15" });
  });

  it("is refused for another company's vessel, and bad sort input names the field", async () => {
    expect((await api(otherChief, "GET", `/api/vessels/${f.vesselA.id}/class-items`)).status).toBe(404);
    const bad = await api(chief, "GET", `/api/vessels/${f.vesselA.id}/class-items?sort=colour`);
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body)).toMatch(/sort/);
  });
});

describe("the fleet's class items", () => {
  it("gives the superintendent every vessel's items, sorted as asked; the chief engineer is refused", async () => {
    const res = await api<{ items: ClassItem[] }>(superintendent, "GET", "/api/class-items?sort=reference");
    expect(res.status).toBe(200);
    // By vessel name (Alpha before Bravo), then reference.
    expect(res.body.items.map((i) => i.reference)).toEqual(["SG-01", "AB-02"]);
    expect((await api(chief, "GET", "/api/class-items")).status).toBe(403);
  });

  it("the vessel page prints the table", async () => {
    const page = await fetch(`${process.env.KEELSON_TEST_URL}/vessels/${f.vesselA.id}/class-items?sort=due`, {
      headers: { cookie: chief.cookie },
    });
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("SG-01");
    expect(html).toContain("16 Jan 2026 – 15 Jul 2026");
    expect(html).not.toContain("Grease the rudder carrier");
  });
});
