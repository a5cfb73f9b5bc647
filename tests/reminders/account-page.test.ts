// The "My e-mail" page in a real browser: a chief engineer switches the digest off with the
// keyboard, the choice survives a reload; screenshots in light, dark and at tablet width.
import { and, eq } from "drizzle-orm";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let f: Fixture;
let browser: Browser;
let page: Page;

beforeAll(async () => {
  f = await createCompany("mail-page");
  ({ browser, page } = await openPage());
  await signInThroughForm(page, f.users["chief-engineer"].email, PASSWORD);
});

afterAll(async () => {
  await browser?.close();
  await closeTestDb();
});

describe("My e-mail", () => {
  it("is linked from the header and lists the chief engineer's reminders", async () => {
    await page.goto(`${BASE_URL}/`);
    await page.getByRole("link", { name: "My e-mail" }).click();
    await page.waitForURL((url) => url.pathname === "/account");
    await expect(page.getByRole("heading", { name: "My e-mail" }).isVisible()).resolves.toBe(true);
    for (const label of ["Daily due digest", "Missing-readings reminders", "Out-of-tolerance escalations"]) {
      await expect(page.getByRole("checkbox", { name: label }).isChecked()).resolves.toBe(true);
    }
    await expect(page.getByRole("checkbox", { name: "Weekly fleet summary" }).count()).resolves.toBe(0);
    await screenshot(page, "reminders-account-light");
  });

  it("switches the digest off with the keyboard and keeps it after a reload", async () => {
    await page.getByRole("checkbox", { name: "Daily due digest" }).focus();
    await page.keyboard.press("Space");
    await page.getByRole("button", { name: "Save" }).focus();
    await page.keyboard.press("Enter");
    await page.getByText("Saved: 1 of 3 reminders switched off.").waitFor();
    const rows = await testDb()
      .select({ kind: s.mailOptOut.kind })
      .from(s.mailOptOut)
      .where(and(eq(s.mailOptOut.companyId, f.companyId), eq(s.mailOptOut.userId, f.users["chief-engineer"].id)));
    expect(rows).toEqual([{ kind: "due-digest" }]);
    await page.reload();
    await expect(page.getByRole("checkbox", { name: "Daily due digest" }).isChecked()).resolves.toBe(false);
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "reminders-account-dark");
    await page.setViewportSize({ width: 820, height: 1000 });
    await screenshot(page, "reminders-account-tablet");
  });
});
