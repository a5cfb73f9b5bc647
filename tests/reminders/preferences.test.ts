// "My e-mail": the signed-in user switches reminder kinds on and off (mail_opt_out rows of their
// own company); the run then leaves them out.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { MailPreferences } from "@/server/reminders/preferences";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const URL = "/api/account/mail-preferences";
let f: Fixture;
let other: Fixture;
let engineer: Session;
let superintendent: Session;

const optOuts = (fx: Fixture, userId: string) =>
  testDb()
    .select({ kind: s.mailOptOut.kind })
    .from(s.mailOptOut)
    .where(and(eq(s.mailOptOut.companyId, fx.companyId), eq(s.mailOptOut.userId, userId)));

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("mail-prefs"), createCompany("mail-prefs-other")]);
  [engineer, superintendent] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users.superintendent.email, PASSWORD),
  ]);
});

afterAll(async () => {
  await closeTestDb();
});

describe("mail preferences", () => {
  it("asks for a sign-in", async () => {
    expect((await api(null, "GET", URL)).status).toBe(401);
    expect((await api(null, "PUT", URL, { receive: { "due-digest": false } })).status).toBe(401);
  });

  it("lists the kinds of the user's role, all on at first", async () => {
    const mine = await api<MailPreferences>(engineer, "GET", URL);
    expect(mine.status).toBe(200);
    expect(mine.body.email).toBe(f.users.engineer.email);
    expect(mine.body.kinds.map((k) => [k.kind, k.receive])).toEqual([
      ["due-digest", true],
      ["missing-readings", true],
    ]);
    expect(mine.body.accountKinds.map((k) => k.label)).toEqual(["invitations", "password resets"]);
    const office = await api<MailPreferences>(superintendent, "GET", URL);
    expect(office.body.kinds.map((k) => k.kind)).toEqual(["missing-readings", "escalation", "fleet-summary"]);
  });

  it("switches a kind off and on again, in the user's own company", async () => {
    const off = await api<MailPreferences>(engineer, "PUT", URL, { receive: { "due-digest": false } });
    expect(off.status).toBe(200);
    expect(off.body.kinds.find((k) => k.kind === "due-digest")?.receive).toBe(false);
    expect(await optOuts(f, f.users.engineer.id)).toEqual([{ kind: "due-digest" }]);
    // A second identical save changes nothing.
    expect((await api(engineer, "PUT", URL, { receive: { "due-digest": false } })).status).toBe(200);
    expect(await optOuts(f, f.users.engineer.id)).toHaveLength(1);
    const on = await api<MailPreferences>(engineer, "PUT", URL, { receive: { "due-digest": true } });
    expect(on.body.kinds.every((k) => k.receive)).toBe(true);
    expect(await optOuts(f, f.users.engineer.id)).toEqual([]);
    expect(await testDb().select().from(s.mailOptOut).where(eq(s.mailOptOut.companyId, other.companyId))).toEqual([]);
  });

  it("refuses kinds the role does not get and account messages, writing nothing", async () => {
    const foreign = await api<Problem>(engineer, "PUT", URL, {
      receive: { "fleet-summary": false, "due-digest": false },
    });
    expect(foreign.status).toBe(422);
    expect(foreign.contentType).toContain("application/problem+json");
    expect(foreign.body.errors).toEqual([
      {
        field: "receive.fleet-summary",
        message: "Your role (Engineer) does not get the weekly fleet summary, so there is nothing to switch.",
      },
    ]);
    const account = await api<Problem>(engineer, "PUT", URL, { receive: { "password-reset": false } });
    expect(account.status).toBe(422);
    expect(account.body.errors?.[0]?.field).toMatch(/^receive/);
    const notBoolean = await api<Problem>(engineer, "PUT", URL, { receive: { "due-digest": "no" } });
    expect(notBoolean.status).toBe(422);
    expect(notBoolean.body.errors?.[0]?.field).toBe("receive.due-digest");
    expect(await optOuts(f, f.users.engineer.id)).toEqual([]);
  });

  it("shows the page", async () => {
    const page = await api<string>(engineer, "GET", "/account");
    expect(page.status).toBe(200);
    expect(page.body).toContain("My e-mail");
    expect(page.body).toContain("Daily due digest");
  });
});
