import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let workOrderUrl = "";

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

describe("a job done on board, approved by the chief", () => {
  it("the second engineer records a turbocharger wash from the Backlog", async () => {
    await signInThroughForm(page, "second@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("link", { name: "Backlog" }).click();
    await page.getByLabel("Find").fill("compressor wash");
    await page.getByLabel("Find").press("Enter");
    // Wait for the filtered list, not the one on screen before it; take a wash nobody recorded yet.
    await expect.poll(() => page.locator("tbody tr").first().textContent(), { timeout: 15_000 }).toMatch(/compressor wash/);
    const row = page.locator("tbody tr").filter({ hasNotText: "awaiting approval" }).first();
    await row.getByRole("link").click();
    await page.waitForURL(/\/work-orders\//);
    workOrderUrl = page.url();

    // The checklist: every step ticked (the form comes once the work order has loaded).
    await page.getByRole("heading", { name: "Record the completion" }).waitFor();
    const steps = page.locator("fieldset").filter({ hasText: "Checklist" }).getByRole("checkbox");
    for (let i = 0; i < (await steps.count()); i++) await steps.nth(i).check();
    await page.getByLabel("Man-hours spent").fill("0.5");
    await page.getByRole("button", { name: "Record for approval" }).click();
    await expect.poll(() => page.getByText("it now awaits the chief engineer’s approval").count(), { timeout: 15_000 }).toBe(1);
    await screenshot(page, "work-order-recorded");
  });

  it("the chief engineer approves it and the job is done", async () => {
    await page.context().clearCookies();
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.goto(workOrderUrl);
    await page.getByRole("button", { name: "Approve" }).click();
    await expect
      .poll(() => page.getByText("Approved: the work order is done and the next occurrence is being scheduled.").count(), {
        timeout: 15_000,
      })
      .toBe(1);
    await screenshot(page, "work-order-approved");
  });
});
