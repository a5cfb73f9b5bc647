// The audit trail (issue 14), against the running stack: the trigger on every table of records,
// the person and reason stamped from the request, the administrator's search and CSV, a record's
// own trail, isolation between companies, and entries that cannot be changed.
import { and, eq, sql } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { AuditItem } from "@/server/audit/contract";
import { AUDIT_EXEMPT } from "@/server/audit/exempt";
import { presetRow } from "@/server/tolerance/rows";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const DAY = 86_400_000;

let f: Fixture;
let other: Fixture;
let engineer: Session;
let admin: Session;
let otherAdmin: Session;
let otherEngineer: Session;
let readingId: string;

async function entriesOf(table: string, recordId: string) {
  return testDb()
    .select()
    .from(s.auditEntry)
    .where(and(eq(s.auditEntry.tableName, table), eq(s.auditEntry.recordId, recordId)))
    .orderBy(s.auditEntry.id);
}

beforeAll(async () => {
  const now = new Date();
  f = await createCompany("audit", now);
  other = await createCompany("audit-other", now);
  [engineer, admin, otherAdmin, otherEngineer] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.admin.email, PASSWORD),
    signIn(other.users.admin.email, PASSWORD),
    signIn(other.users.engineer.email, PASSWORD),
  ]);
  // Today's main-engine reading, mistyped 1,020 h for 1,012 h (yesterday's is the fixture's 1,000 h).
  const [row] = await testDb()
    .insert(s.reading)
    .values({
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      counterId: f.counters.main.id,
      readAt: new Date(f.lastReadAt.getTime() + DAY - 60_000),
      segment: 1,
      meterValue: 1020,
      totalHours: 1020,
    })
    .returning();
  readingId = row!.id;
});
afterAll(closeTestDb);

describe("the trigger", () => {
  it("is on every table of records; the others are exempt with a reason", async () => {
    const { rows } = await testDb().execute<{ table: string; audited: boolean }>(sql`
      select c.relname as table,
             exists (select 1 from pg_trigger t where t.tgrelid = c.oid and t.tgname = 'audit_row') as audited
        from pg_class c join pg_namespace n on n.oid = c.relnamespace
       where n.nspname = 'public' and c.relkind in ('r', 'p')
       order by c.relname`);
    const tables = rows.map((r) => r.table);
    const unaccounted = rows.filter((r) => !r.audited && !(r.table in AUDIT_EXEMPT)).map((r) => r.table);
    const exemptYetAudited = rows.filter((r) => r.audited && r.table in AUDIT_EXEMPT).map((r) => r.table);
    const exemptGone = Object.keys(AUDIT_EXEMPT).filter((t) => !tables.includes(t));
    expect({ unaccounted, exemptYetAudited, exemptGone }).toEqual({ unaccounted: [], exemptYetAudited: [], exemptGone: [] });
    // The records the issue names are among the audited ones.
    for (const t of ["routine", "component", "counter", "reading", "completion", "deferral", "defect", "part", "tolerance_rule", "company", "user", "membership", "vessel_assignment"]) {
      expect(rows.find((r) => r.table === t)?.audited, t).toBe(true);
    }
  });

  it("writes an insert made outside any request with no person", async () => {
    const [entry] = await entriesOf("reading", readingId);
    expect(entry).toMatchObject({ action: "insert", actor: null, companyId: f.companyId, vesselId: f.vesselA.id });
    expect(entry!.after).toMatchObject({ meter_value: 1020, counter_id: f.counters.main.id });
  });
});

describe("a reading corrected by the engineer", () => {
  const reason = "Typed 1,020 for 1,012 on the morning round";

  it("leaves one entry with the person, the values before and after and the reason", async () => {
    const res = await api(engineer, "PATCH", `/api/vessels/${f.vesselA.id}/readings/${readingId}`, {
      value: 1012,
      reason,
    });
    expect(res.status).toBe(200);
    const updates = (await entriesOf("reading", readingId)).filter((e) => e.action === "update");
    expect(updates).toHaveLength(1);
    expect(updates[0]).toMatchObject({
      actor: `user:${f.users.engineer.id}`,
      reason,
      companyId: f.companyId,
      vesselId: f.vesselA.id,
      before: { meter_value: 1020, total_hours: 1020 },
      after: { meter_value: 1012, total_hours: 1012 },
    });
  });

  it("a refused correction writes nothing to the trail", async () => {
    const before = await entriesOf("reading", readingId);
    const res = await api(engineer, "PATCH", `/api/vessels/${f.vesselA.id}/readings/${readingId}`, {
      value: 5000,
      reason: "A value the neighbours refuse",
    });
    expect(res.status).toBe(422);
    expect(await entriesOf("reading", readingId)).toHaveLength(before.length);
  });

  it("is found by the administrator by person, vessel, kind and period, and in the CSV", async () => {
    const today = new Date().toISOString().slice(0, 10);
    const q = `person=${f.users.engineer.id}&vessel=${f.vesselA.id}&kind=readings&from=${today}&until=${today}`;
    const res = await api<{ items: AuditItem[]; nextBefore: number | null }>(admin, "GET", `/api/admin/audit?${q}`);
    expect(res.status).toBe(200);
    expect(res.body.items).toHaveLength(1);
    expect(res.body.items[0]).toMatchObject({
      by: expect.stringMatching(/^engineer audit-/),
      byPerson: true,
      action: "changed",
      reason,
      kind: "Readings",
    });
    expect(res.body.items[0]!.lines).toContainEqual({ label: "Meter value", before: "1020", after: "1012" });

    // Another kind, or a period before today, finds nothing of it.
    const none = await api<{ items: AuditItem[] }>(admin, "GET", `/api/admin/audit?person=${f.users.engineer.id}&kind=deferrals`);
    expect(none.body.items).toEqual([]);
    const earlier = await api<{ items: AuditItem[] }>(admin, "GET", `/api/admin/audit?person=${f.users.engineer.id}&until=2026-01-01`);
    expect(earlier.body.items).toEqual([]);

    const csv = await fetch(`${process.env.KEELSON_TEST_URL}/api/admin/audit/export?${q}`, {
      headers: { cookie: admin.cookie },
    });
    expect(csv.headers.get("content-type")).toMatch(/^text\/csv/);
    const text = await csv.text();
    expect(text).toContain("Entry,When (UTC),By,Vessel,Kind,Record,Action,Reason,Changes");
    expect(text).toContain("Meter value: 1020 → 1012");
    expect(text).toContain(reason);
  });

  it("stays inside the company: another company's administrator finds nothing of it", async () => {
    const res = await api<{ items: AuditItem[] }>(otherAdmin, "GET", `/api/admin/audit?person=${f.users.engineer.id}`);
    expect(res.status).toBe(200);
    expect(res.body.items).toEqual([]);
    const trail = await api(otherEngineer, "GET", `/api/vessels/${f.vesselA.id}/trail?table=counter&record=${f.counters.main.id}`);
    expect(trail.status).toBe(404);
  });

  it("is in the counter's own trail, named by the person", async () => {
    const res = await api<{ items: AuditItem[]; more: boolean }>(
      engineer,
      "GET",
      `/api/vessels/${f.vesselA.id}/trail?table=counter&record=${f.counters.main.id}`,
    );
    expect(res.status).toBe(200);
    const correction = res.body.items.find((i) => i.reason === reason);
    expect(correction).toMatchObject({ byPerson: true, action: "changed", record: "reading" });
    // The record's trail on another vessel of the same company does not show it.
    const elsewhere = await api<{ items: AuditItem[] }>(
      admin,
      "GET",
      `/api/vessels/${f.vesselB.id}/trail?table=counter&record=${f.counters.main.id}`,
    );
    // Nothing of another vessel's record comes through this vessel's door, not even its meters' rows,
    // which carry no vessel of their own.
    expect(elsewhere.body.items).toEqual([]);
  });

  it("a removal keeps the whole row it removed", async () => {
    const res = await api(engineer, "DELETE", `/api/vessels/${f.vesselA.id}/readings/${readingId}`, {
      reason: "Entered twice: the same round",
    });
    expect(res.status).toBe(200);
    const [removal] = (await entriesOf("reading", readingId)).filter((e) => e.action === "delete");
    expect(removal).toMatchObject({ actor: `user:${f.users.engineer.id}`, reason: "Entered twice: the same round", after: null });
    expect(removal!.before).toMatchObject({ meter_value: 1012, counter_id: f.counters.main.id });
  });
});

describe("a company-wide record's trail", () => {
  it("shows a tolerance rule's change by the administrator, and nothing of it to another company", async () => {
    const [rule] = await testDb().insert(s.toleranceRule).values(presetRow(f.companyId, 6)).returning();
    const res = await api(admin, "PATCH", `/api/admin/tolerance-rules/${rule!.id}`, { name: "Annual, as agreed with class" });
    expect(res.status).toBe(200);
    const trail = await api<{ items: AuditItem[] }>(engineer, "GET", `/api/trail?table=tolerance_rule&record=${rule!.id}`);
    expect(trail.status).toBe(200);
    const change = trail.body.items.find((i) => i.action === "changed");
    expect(change).toMatchObject({ byPerson: true, by: expect.stringMatching(/^admin audit-/) });
    expect(change!.lines).toContainEqual({
      label: "Name",
      before: "Annual: 3 months either side of the anniversary",
      after: "Annual, as agreed with class",
    });
    const foreign = await api<{ items: AuditItem[] }>(otherAdmin, "GET", `/api/trail?table=tolerance_rule&record=${rule!.id}`);
    expect(foreign.body.items).toEqual([]);
    const bad = await api(admin, "GET", `/api/trail?table=reading&record=${rule!.id}`);
    expect(bad.status).toBe(422);
  });
});

describe("entries are kept as written", () => {
  it("the database refuses to change or delete one", async () => {
    const [entry] = await entriesOf("reading", readingId);
    const refusal = (statement: Promise<unknown>) =>
      statement.then(
        () => "written",
        (error: Error & { cause?: Error }) => error.cause?.message ?? error.message,
      );
    expect(await refusal(testDb().execute(sql`update audit_entry set reason = 'rewritten' where id = ${entry!.id}`))).toMatch(
      /kept as written/,
    );
    expect(await refusal(testDb().execute(sql`delete from audit_entry where id = ${entry!.id}`))).toMatch(/kept as written/);
    expect((await entriesOf("reading", readingId))[0]).toEqual(entry);
  });

  it("the app has no route that writes to the trail", async () => {
    for (const method of ["POST", "PATCH", "DELETE"]) {
      const res = await api(admin, method, "/api/admin/audit", {});
      expect(res.status, method).toBe(405);
    }
  });

  it("bad search input is a 422 naming the field", async () => {
    const res = await api<{ errors?: { field: string }[] }>(admin, "GET", "/api/admin/audit?from=2026-13-01&kind=x");
    expect(res.status).toBe(422);
    expect(JSON.stringify(res.body)).toMatch(/from/);
    expect(JSON.stringify(res.body)).toMatch(/kind/);
  });
});
