// The public one-click unsubscribe: POST /api/unsubscribe verifies the link's HMAC token (no
// session) and writes the opt-out; a bad token is 422 and writes nothing.
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOptOut, mailOutbox } from "@/db/schema";
import { oneClickUnsubscribeUrl, unsubscribeToken, unsubscribeUrl } from "@/server/mail/links";
import { enqueueMail, type MailKind } from "@/server/mail/outbox";
import type { Problem } from "@/server/http/problem";
import { api } from "../support/http";
import { closeTestDb, createCompany, type Fixture, testDb } from "../support/fixtures";
import { testMail } from "./mail-fake";

const BASE_URL = process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000";
let f: Fixture;
const db = testDb();

beforeAll(async () => {
  f = await createCompany("unsubscribe");
});
afterAll(closeTestDb);

const optOuts = (userId: string, kind?: MailKind) =>
  db
    .select()
    .from(mailOptOut)
    .where(
      and(
        eq(mailOptOut.companyId, f.companyId),
        eq(mailOptOut.userId, userId),
        kind ? eq(mailOptOut.kind, kind) : undefined,
      ),
    );

/** The page's HTML without the comments React puts between adjacent text parts. */
const textOf = (html: string) => html.replace(/<!-- -->/g, "");

/** The route's path and query of a link the sender would put in a message. */
const routeOf = (url: string) => {
  const u = new URL(url);
  return `/api/unsubscribe${u.search}`;
};

describe("POST /api/unsubscribe", () => {
  it("refuses a tampered or incomplete link with 422 and writes nothing", async () => {
    const engineer = f.users.engineer;
    const good = new URL(unsubscribeUrl(engineer.id, f.companyId, "due-digest"));
    const tampered = new URLSearchParams(good.search);
    tampered.set("k", "escalation");
    const bad = await api<Problem>(null, "POST", `/api/unsubscribe?${tampered}`);
    expect(bad.status).toBe(422);
    expect(bad.contentType).toContain("application/problem+json");
    expect(bad.body.errors?.[0]).toMatchObject({ field: "query.t" });
    expect(bad.body.errors?.[0]?.message).toContain("not valid");

    // Another company's id with this user's token: refused too.
    const otherCompany = new URLSearchParams(good.search);
    otherCompany.set("c", "00000000-0000-4000-8000-000000000000");
    expect((await api(null, "POST", `/api/unsubscribe?${otherCompany}`)).status).toBe(422);

    // An account message's token is never accepted: they cannot be opted out of.
    const reset = new URLSearchParams({
      u: engineer.id,
      c: f.companyId,
      k: "password-reset",
      t: unsubscribeToken(engineer.id, f.companyId, "password-reset"),
    });
    expect((await api(null, "POST", `/api/unsubscribe?${reset}`)).status).toBe(422);

    const incomplete = await api<Problem>(null, "POST", `/api/unsubscribe?u=${engineer.id}`);
    expect(incomplete.status).toBe(422);
    expect(incomplete.body.errors?.map((e) => e.field).sort()).toEqual(["query.c", "query.k", "query.t"]);

    expect(await optOuts(engineer.id)).toHaveLength(0);
  });

  it("writes the opt-out for a genuine link, without a session, and the kind stops", async () => {
    const engineer = f.users.engineer;
    const ok = await api<{ unsubscribed: boolean; kind: string; kindLabel: string }>(
      null,
      "POST",
      routeOf(unsubscribeUrl(engineer.id, f.companyId, "due-digest")),
    );
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ unsubscribed: true, kind: "due-digest", kindLabel: "daily due digest" });
    expect((await optOuts(engineer.id)).map((r) => r.kind)).toEqual(["due-digest"]);

    // A second click changes nothing.
    expect((await api(null, "POST", routeOf(unsubscribeUrl(engineer.id, f.companyId, "due-digest")))).status).toBe(200);
    expect(await optOuts(engineer.id)).toHaveLength(1);

    // What the opt-out is for: the next digest is not queued, an escalation still is.
    const digestKey = `unsub-digest-${engineer.id}`;
    expect(await enqueueMail(db, testMail(f.companyId, engineer.email, digestKey, { userId: engineer.id }))).toBe(
      false,
    );
    expect(
      await db
        .select()
        .from(mailOutbox)
        .where(eq(mailOutbox.dedupeKey, `test:${digestKey}`)),
    ).toHaveLength(0);
  });

  it("accepts an RFC 8058 one-click POST from a mail client", async () => {
    const chief = f.users["chief-engineer"];
    const response = await fetch(`${BASE_URL}${routeOf(oneClickUnsubscribeUrl(chief.id, f.companyId, "escalation"))}`, {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: "List-Unsubscribe=One-Click",
    });
    expect(response.status).toBe(200);
    expect((await optOuts(chief.id, "escalation")).map((r) => r.kind)).toEqual(["escalation"]);
  });

  it("sends a browser's form back to the page, which says what stopped", async () => {
    const superintendent = f.users.superintendent;
    const link = unsubscribeUrl(superintendent.id, f.companyId, "fleet-summary");
    const response = await fetch(`${BASE_URL}${routeOf(link)}`, {
      method: "POST",
      redirect: "manual",
      headers: { accept: "text/html,application/xhtml+xml", "content-type": "application/x-www-form-urlencoded" },
      body: "",
    });
    expect(response.status).toBe(303);
    const location = new URL(response.headers.get("location")!);
    expect(location.pathname).toBe("/unsubscribe");
    expect(location.searchParams.get("done")).toBe("1");
    expect(await optOuts(superintendent.id, "fleet-summary")).toHaveLength(1);

    // The page is public: no session cookie, no redirect to the sign-in page.
    const page = await fetch(`${BASE_URL}${location.pathname}${location.search}`, { redirect: "manual" });
    const html = textOf(await page.text());
    expect(page.status).toBe(200);
    expect(html).toContain(superintendent.email);
    expect(html).toContain("no longer gets the weekly fleet summary");
  });

  it("shows what will stop before anything is written, and a bad link plainly", async () => {
    const engineer = f.users.engineer;
    const link = new URL(unsubscribeUrl(engineer.id, f.companyId, "missing-readings"));
    const response = await fetch(`${BASE_URL}/unsubscribe${link.search}`, { redirect: "manual" });
    expect(response.status).toBe(200);
    const page = textOf(await response.text());
    expect(page).toContain("Stop the missing-readings reminders?");
    expect(page).toContain("no hour-meter reading");
    expect(await optOuts(engineer.id, "missing-readings")).toHaveLength(0);

    const forged = link.search.replace(/t=[^&]+/, "t=forged");
    const broken = await (await fetch(`${BASE_URL}/unsubscribe${forged}`, { redirect: "manual" })).text();
    expect(broken).toContain("This unsubscribe link does not work");
  });
});
