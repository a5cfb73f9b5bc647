// Company → Mail: the administrator reads the messages the local fake caught for their company
// (never another company's) and the outbox with its statuses, attempts and errors.
import { inArray } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox } from "@/db/schema";
import type { AdminMail } from "@/server/mail/contract";
import { MAIL_KIND_LABEL } from "@/server/mail/kinds";
import { appUrl, unsubscribeUrl } from "@/server/mail/links";
import { renderMail } from "@/server/mail/render";
import { enqueueMail } from "@/server/mail/outbox";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, signIn } from "../support/http";
import { askTheWorkerToSend, caughtOfCompany, failNext, freshAddress, testMail, waitFor } from "./mail-fake";

const db = testDb();
let f: Fixture;
let other: Fixture;
let browser: Browser;
let page: Page;
const SUBJECT = `Aster Gale: 2 jobs late ${Date.now().toString(36)}`;
const FAILING = `Never delivered ${Date.now().toString(36)}`;
const OTHER = `Another company’s digest ${Date.now().toString(36)}`;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("caught"), createCompany("caught-other")]);
  const admin = f.users.admin;
  const { html, text } = renderMail({
    preheader: "Two jobs ran late overnight",
    title: "Aster Gale: 2 jobs late",
    intro: "Good morning. Two jobs on Aster Gale ran past their due point overnight.",
    sections: [
      {
        heading: "Late",
        lines: [
          { text: "ME-014 Main engine: fuel valve overhaul", href: appUrl("/"), note: "due 28 Nov, 3 days late" },
          { text: "GE-2 Generator 2: lube oil & filter change", href: appUrl("/"), note: "due 30 Nov, 1 day late" },
        ],
      },
    ],
    action: { label: "Open the Backlog", href: appUrl("/") },
    footer: `Sent by Keelson for ${f.companyId}.`,
    unsubscribe: {
      href: unsubscribeUrl(admin.id, f.companyId, "due-digest"),
      kindLabel: MAIL_KIND_LABEL["due-digest"],
    },
  });
  const failing = freshAddress("caught-failing");
  // The relay refuses every message to this address: it stays in the outbox with its error.
  await failNext(1000, failing);
  const keys = [`caught-${SUBJECT}`, `caught-${FAILING}`, `caught-${OTHER}`];
  await enqueueMail(
    db,
    testMail(f.companyId, admin.email, keys[0]!, { userId: admin.id, subject: SUBJECT, html, text }),
  );
  await enqueueMail(db, testMail(f.companyId, failing, keys[1]!, { subject: FAILING }));
  await enqueueMail(db, testMail(other.companyId, other.users.admin.email, keys[2]!, { subject: OTHER }));
  // (No sendDueMail with a `now` of its own here: that would take sending.test.ts's rows.)
  await askTheWorkerToSend();
  await waitFor(
    "the worker to try all three",
    async () => {
      const rows = await db
        .select()
        .from(mailOutbox)
        .where(
          inArray(
            mailOutbox.dedupeKey,
            keys.map((k) => `test:${k}`),
          ),
        );
      return rows.length === 3 && rows.every((r) => r.attempts > 0 && r.status !== "sending");
    },
    80_000,
  );
  ({ browser, page } = await openPage());
}, 90_000);

afterAll(async () => {
  await browser?.close();
  await closeTestDb();
});

describe("GET /api/admin/mail", () => {
  it("is for administrators, and lists only their company's mail", async () => {
    expect((await api(null, "GET", "/api/admin/mail")).status).toBe(401);
    const engineer = await signIn(f.users.engineer.email, PASSWORD);
    expect((await api(engineer, "GET", "/api/admin/mail")).status).toBe(403);

    const admin = await signIn(f.users.admin.email, PASSWORD);
    const { status, body } = await api<AdminMail>(admin, "GET", "/api/admin/mail");
    expect(status).toBe(200);
    expect(body.delivery.kind).toBe("fake");
    expect(body.caught?.map((m) => m.subject)).toEqual([SUBJECT]);
    expect(body.outbox.map((r) => r.subject).sort()).toEqual([FAILING, SUBJECT].sort());
    expect(body.outbox.find((r) => r.subject === SUBJECT)).toMatchObject({ status: "sent", attempts: 1 });
    const failed = body.outbox.find((r) => r.subject === FAILING)!;
    expect(["pending", "failed"]).toContain(failed.status);
    expect(failed.lastError).toContain("451");

    const otherAdmin = await signIn(other.users.admin.email, PASSWORD);
    const theirs = await api<AdminMail>(otherAdmin, "GET", "/api/admin/mail");
    expect(theirs.body.caught?.map((m) => m.subject)).toEqual([OTHER]);
  });
});

describe("Company → Mail", () => {
  it("shows the caught message as HTML in a sandbox and as plain text, and the outbox", async () => {
    await signInThroughForm(page, f.users.admin.email, PASSWORD);
    await page.goto(`${BASE_URL}/admin`);
    await page.getByRole("link", { name: "Mail", exact: true }).click();
    await page.waitForURL(/\/admin\/mail$/);
    await page.getByRole("heading", { name: "Caught mail" }).waitFor();

    const list = page.getByRole("list", { name: "Caught messages" });
    await list.getByRole("button", { name: new RegExp(SUBJECT) }).click();
    const frame = page.locator(`iframe[title="HTML of “${SUBJECT}”"]`);
    expect(await frame.getAttribute("sandbox")).toBe("");
    const inner = page.frameLocator(`iframe[title="HTML of “${SUBJECT}”"]`);
    await inner.getByText("lube oil & filter change").waitFor();
    await screenshot(page, "mail-admin-html");

    await page.getByRole("tab", { name: "Plain text" }).click();
    await page.getByText("- GE-2 Generator 2: lube oil & filter change").waitFor();

    const outbox = page.getByRole("region", { name: "Outbox" });
    const failingRow = outbox.getByRole("row").filter({ hasText: FAILING });
    expect(await failingRow.textContent()).toMatch(/pending|failed/);
    expect(await failingRow.textContent()).toContain("451");
    // Another company's message is not there.
    expect(await page.getByText(OTHER).count()).toBe(0);

    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "mail-admin-text-dark");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
    await page.setViewportSize({ width: 820, height: 1100 });
    await page.getByRole("tab", { name: "HTML" }).click();
    await screenshot(page, "mail-admin-tablet");
    await page.setViewportSize({ width: 1280, height: 900 });
  }, 90_000);

  it("opens the unsubscribe page from the message and unsubscribes with its button", async () => {
    const link = unsubscribeUrl(f.users.admin.id, f.companyId, "due-digest");
    await page.goto(`${BASE_URL}/unsubscribe${new URL(link).search}`);
    await page.getByRole("heading", { name: "Stop the daily due digest?" }).waitFor();
    await screenshot(page, "unsubscribe-confirm");
    await page.getByRole("button", { name: "Unsubscribe from the daily due digest" }).click();
    await page.getByRole("heading", { name: "Unsubscribed" }).waitFor();
    expect(await page.getByRole("status").textContent()).toContain("no longer gets the daily due digest");
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "unsubscribe-done-dark");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
  }, 60_000);

  it("clears the company's caught mail only, and says how many", async () => {
    await page.goto(`${BASE_URL}/admin/mail`);
    await page
      .getByRole("list", { name: "Caught messages" })
      .getByRole("button", { name: new RegExp(SUBJECT) })
      .waitFor();
    await page.getByRole("button", { name: "Clear caught mail" }).click();
    const dialog = page.getByRole("dialog", { name: "Clear the caught mail?" });
    await dialog.getByText("other companies’ messages on this set-up stay in it", { exact: false }).waitFor();
    await dialog.getByRole("button", { name: "Clear caught mail" }).click();
    await page.getByText("Cleared 1 caught message of your company.", { exact: false }).waitFor();
    await page.getByText("Nothing caught yet.", { exact: false }).waitFor();
    await screenshot(page, "mail-admin-cleared");
    expect(await caughtOfCompany(f.companyId)).toEqual([]);
    // The other company's message is still in the catcher.
    expect((await caughtOfCompany(other.companyId)).map((m) => m.subject)).toEqual([OTHER]);
  }, 60_000);
});
