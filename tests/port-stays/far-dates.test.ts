// Far-off dates cannot take the app down (issue 10): a stay in year 9999 is refused by the contract
// with the fields named and nothing written, and a stay already stored with absurd dates (put in
// the database directly, as old data or a bug might) does not freeze the list or the proposal.
// Before, the stay's days were walked by comparing day texts, and "10000-01-01" sorts before
// "9999-12-31": about 97 million steps inside the web process. A hang fails these tests by their
// timeout; what they assert is the answer.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { PortStayList, ProposalView } from "@/server/port-stays/contract";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

let f: Fixture;
let chief: Session;

const base = () => `/api/vessels/${f.vesselA.id}/port-stays`;

const CREW = [{ rank: "second-engineer", count: 1 }];

async function stayCount() {
  return (await testDb().select().from(s.portStay).where(eq(s.portStay.companyId, f.companyId))).length;
}

async function storeStay(port: string, arrivesAt: string, departsAt: string): Promise<string> {
  const [row] = await testDb()
    .insert(s.portStay)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      port,
      arrivesAt: new Date(arrivesAt),
      departsAt: new Date(departsAt),
      crew: CREW,
    })
    .returning({ id: s.portStay.id });
  return row!.id;
}

beforeAll(async () => {
  f = await createCompany("port-stays-far-dates");
  chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
});

afterAll(async () => {
  await closeTestDb();
});

describe("a port stay in year 9999", () => {
  it("is refused with 422 naming the arrival and departure, and nothing is written", async () => {
    const before = await stayCount();
    const res = await api<Problem>(chief, "POST", base(), {
      port: "Far future",
      arrivesAt: "9999-12-31T07:00",
      departsAt: "9999-12-31T19:00",
      workdayFrom: "08:00",
      workdayTo: "17:00",
      engineStop: null,
      crew: CREW,
      watches: [],
    });
    expect(res.status).toBe(422);
    const fields = Object.fromEntries((res.body.errors ?? []).map((e) => [e.field, e.message]));
    expect(fields.arrivesAt).toMatch(/^The arrival must lie between 2000-01-01 and \d{4}-\d{2}-\d{2}\.$/);
    expect(fields.departsAt).toMatch(/^The departure must lie between 2000-01-01 and \d{4}-\d{2}-\d{2}\.$/);
    expect(await stayCount()).toBe(before);
  });
});

describe("a stay already stored with absurd dates", () => {
  let lastDayOf9999: string;
  let tenThousandYears: string;

  beforeAll(async () => {
    // Vessel A keeps Asia/Singapore (UTC+8): 30 Dec 9999 08:00 to 31 Dec 9999 18:00 aboard — the
    // old walk stepped past 31 Dec 9999 into "+010000-…" and never stopped.
    lastDayOf9999 = await storeStay("Year 9999", "9999-12-30T00:00:00Z", "9999-12-31T10:00:00Z");
    // A stay of eight thousand years: its days are cut at the longest stay the contract allows.
    tenThousandYears = await storeStay("Forever", "2026-01-01T00:00:00Z", "9999-12-30T00:00:00Z");
  });

  it("still lets the list answer, with the stays' days counted and capped", async () => {
    const res = await api<PortStayList>(chief, "GET", base());
    expect(res.status).toBe(200);
    const stays = [...res.body.upcoming, ...res.body.past];
    expect(stays.find((stay) => stay.id === lastDayOf9999)?.days).toEqual(["9999-12-30", "9999-12-31"]);
    const forever = stays.find((stay) => stay.id === tenThousandYears);
    // 31 days: the contract's 30-day stay plus the arrival's own day (server/port-stays/stay-days.ts).
    expect(forever?.days).toHaveLength(31);
    expect(forever?.days[0]).toBe("2026-01-01");
    expect(forever?.days.at(-1)).toBe("2026-01-31");
  });

  it("still lets the proposal answer for either stay", async () => {
    for (const stayId of [lastDayOf9999, tenThousandYears]) {
      const res = await api<ProposalView>(chief, "POST", `${base()}/${stayId}/proposal`);
      expect(res.status).toBe(200);
      // The company has no work orders: an empty package, nothing of value to place.
      expect(res.body.items).toEqual([]);
      expect([res.body.value, res.body.possible]).toEqual([0, 0]);
    }
  });
});
