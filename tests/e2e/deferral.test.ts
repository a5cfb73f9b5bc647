import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { WorkOrderWithDeferrals } from "@/server/deferrals/contract";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let workOrderUrl = "";
let backlogUrl = "";
let number = "";

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

// The main engine's fuel valves test on Aster Gale: no other browser test and no demo deferral uses it.
const JOB = "fuel valves pressure test";

describe("a deferral asked on board and decided ashore", () => {
  it("the chief engineer requests a deferral from the work order page", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.locator("main li").filter({ hasText: "Aster Gale" }).getByRole("link", { name: "Hour log" }).click();
    await page.getByRole("link", { name: "Backlog" }).click();
    await page.waitForURL(/\/backlog$/);
    backlogUrl = page.url();
    // The seeded requests are announced above the list.
    await expect
      .poll(() => page.getByText(/deferral requests? awaits? a decision/).count(), { timeout: 15_000 })
      .toBe(1);
    await page.getByLabel("Find").fill(JOB);
    await page.getByLabel("Find").press("Enter");
    await expect.poll(() => page.locator("tbody tr").first().textContent(), { timeout: 15_000 }).toMatch(/fuel valves/);
    const row = page.locator("tbody tr").filter({ hasNotText: "deferral asked" }).first();
    await row.getByRole("link").click();
    await page.waitForURL(/\/work-orders\//);
    workOrderUrl = page.url();

    // The limit in force, from the page's own route handler, to propose something just beyond it.
    const apiPath = new URL(workOrderUrl).pathname.replace(/^\/vessels/, "/api/vessels");
    const detail = (await (await page.request.get(`${BASE_URL}${apiPath}`)).json()) as WorkOrderWithDeferrals;
    number = detail.workOrder.number;
    expect(detail.deferrals.may.request).toBe(true);
    const limit = detail.deferrals.current.dueHours!;
    expect(limit).toBeGreaterThan(0);

    await page.getByRole("button", { name: "Request a deferral" }).click();
    const panel = page.getByRole("dialog", { name: "Request a deferral" });
    await panel
      .getByLabel("Reason")
      .fill("New fuel valve nozzles are on order; delivery with the stores at the next port.");
    // A limit below the one in force first: the server refuses it beside the field, nothing is sent on.
    await panel.getByLabel("New running-hours limit").fill(String(Math.round(limit) - 10));
    await panel.getByRole("button", { name: "Send the request" }).click();
    await expect
      .poll(() => panel.getByText(/The new limit must be above the current one/).count(), { timeout: 15_000 })
      .toBe(1);
    await screenshot(page, "deferral-request-refused");
    await panel.getByLabel("New running-hours limit").fill(String(Math.round(limit) + 250));
    await panel.getByRole("button", { name: "Send the request" }).click();
    await expect.poll(() => page.getByText(`Deferral of ${number} requested`).count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByText("awaiting a decision", { exact: false }).count()).toBeGreaterThan(0);
    await screenshot(page, "deferral-requested");
  });

  it("the superintendent finds it pending on the Backlog, approves it, and the work order is deferred", async () => {
    await page.context().clearCookies();
    await signInThroughForm(page, "super@brightwater.example", DEMO_PASSWORD);
    // The demo's deferral approved last week: its work order is deferred.
    await page.goto(`${backlogUrl}?state=deferred`);
    await expect
      .poll(() => page.locator("tbody tr").filter({ hasText: "Lube oil purifier" }).count(), { timeout: 15_000 })
      .toBe(1);
    expect(await page.locator('tbody [data-state="deferred"]').count()).toBeGreaterThan(0);
    await page.goto(backlogUrl);
    const notice = page.getByRole("status").filter({ hasText: "await" });
    await notice.waitFor();
    await notice.getByRole("button", { name: /Show (them|it)/ }).click();
    await page.waitForURL(/deferral=pending/);
    const row = page.locator("tbody tr").filter({ hasText: number });
    await expect.poll(() => row.count(), { timeout: 15_000 }).toBe(1);
    expect(await row.getByText("deferral asked").count()).toBe(1);
    await screenshot(page, "deferral-backlog-pending");

    await row.getByRole("link", { name: number }).click();
    await page.waitForURL(workOrderUrl);
    await page
      .getByLabel("Decision note (needed to reject)")
      .fill("Agreed; keep the spare valve in the stand-by rack.");
    await page.getByRole("button", { name: "Approve deferral" }).click();
    await expect
      .poll(() => page.getByText(`Deferral approved: ${number} is deferred to`).count(), { timeout: 15_000 })
      .toBe(1);
    await expect.poll(() => page.locator('header [data-state="deferred"]').count(), { timeout: 15_000 }).toBe(1);
    expect(await page.getByTestId("deferred-limit").textContent()).toMatch(/limit in force/);
    await screenshot(page, "deferral-approved");
    // The same at tablet width in the dark theme, for a look at night in the engine control room.
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "deferral-approved-dark-tablet");
  });
});
