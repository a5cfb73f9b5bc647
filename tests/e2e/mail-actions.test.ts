// Company → Mail in the browser: "Try again" on a failed message by keyboard, "Cancel" on a
// waiting one after a confirmation, each with its notice; "Clear caught mail" asks first. Then a
// look at the other admin lists built on the same table (app/_components/data-table.tsx).
import { eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox } from "@/db/schema";
import { freshAddress, queueDueAt, testMail } from "../mail/mail-fake";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";

const db = testDb();
const FAR = new Date(Date.now() + 50 * 365 * 24 * 3_600_000);
const tag = Date.now().toString(36);
const FAILED = `Weekly summary that never left ${tag}`;
const WAITING = `Digest for a mistyped address ${tag}`;
let f: Fixture;
let failedTo: string;
let waitingTo: string;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  f = await createCompany("mail-ui");
  failedTo = freshAddress("ui-failed");
  waitingTo = freshAddress("ui-waiting");
  // Out of every sender's reach (see tests/mail/admin-actions.test.ts), then set as the page needs.
  const [failedId, waitingId] = await queueDueAt(db, FAR, [
    testMail(f.companyId, failedTo, `ui-${FAILED}`, { subject: FAILED }),
    testMail(f.companyId, waitingTo, `ui-${WAITING}`, { subject: WAITING }),
  ]);
  await db
    .update(mailOutbox)
    .set({ status: "failed", attempts: 8, lastError: "451 4.3.0 relay busy (test)" })
    .where(eq(mailOutbox.id, failedId!));
  await db
    .update(mailOutbox)
    .set({ attempts: 1, lastError: "550 5.1.1 no such mailbox (test)" })
    .where(eq(mailOutbox.id, waitingId!));
  ({ browser, page } = await openPage());
});

afterAll(async () => {
  await browser?.close();
  await closeTestDb();
});

describe("Company → Mail actions", () => {
  it("tries a failed message again and cancels a waiting one", async () => {
    await signInThroughForm(page, f.users.admin.email, PASSWORD);
    await page.goto(`${BASE_URL}/admin/mail`);
    const outbox = page.getByRole("region", { name: "Outbox" });
    const retry = outbox.getByRole("button", { name: `Try again “${FAILED}” to ${failedTo}` });
    await retry.waitFor();
    // A failed message cannot be cancelled any more; a waiting one can.
    expect(await outbox.getByRole("button", { name: `Cancel “${FAILED}” to ${failedTo}` }).count()).toBe(0);
    await screenshot(page, "mail-actions");

    await retry.focus();
    await page.keyboard.press("Enter");
    await outbox.getByText(`“${FAILED}” to ${failedTo} is queued again`).waitFor();
    // Focus lands on the heading above the notice, not on the page.
    await expect.poll(() => page.evaluate(() => document.activeElement?.id)).toBe("outbox-heading");

    await outbox.getByRole("button", { name: `Cancel “${WAITING}” to ${waitingTo}` }).click();
    const dialog = page.getByRole("dialog", { name: "Cancel this message?" });
    await dialog.getByText("It will not be sent.", { exact: false }).waitFor();
    // Only one button says "cancel": the action itself.
    expect(await dialog.getByRole("button", { name: "Cancel", exact: true }).count()).toBe(0);
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "mail-actions-cancel-dark");
    await dialog.getByRole("button", { name: "Cancel the message" }).click();
    await outbox.getByText(`“${WAITING}” to ${waitingTo} is cancelled and will not be sent.`).waitFor();
    const row = outbox.getByRole("row").filter({ hasText: WAITING });
    await expect.poll(() => row.textContent()).toContain("Cancelled by");
    expect(await row.textContent()).toContain("cancelled");
    await screenshot(page, "mail-actions-done-dark");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));

    // Clearing the catcher asks first (and is left unconfirmed: other tests read the catcher).
    await page.getByRole("button", { name: "Clear caught mail" }).click();
    const clear = page.getByRole("dialog", { name: "Clear the caught mail?" });
    await clear.getByText("other companies’ messages on this set-up stay in it", { exact: false }).waitFor();
    await page.setViewportSize({ width: 820, height: 1100 });
    await screenshot(page, "mail-actions-clear-tablet");
    await page.keyboard.press("Escape");
    await expect.poll(() => clear.count()).toBe(0);
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  // The vessel and people lists share the outbox's table: named by their heading, one row header each.
  it("shows the vessels and people lists in the shared table", async () => {
    for (const [path, heading, rows] of [
      ["/admin/vessels", "Vessels", 2],
      ["/admin/people", "People", 5],
    ] as const) {
      await page.goto(`${BASE_URL}${path}`);
      const table = page.getByRole("table", { name: heading });
      await table.waitFor();
      expect(await table.getByRole("rowheader").count(), heading).toBe(rows);
      await screenshot(page, `mail-actions-shared-table-${heading.toLowerCase()}`);
    }
  });
});
