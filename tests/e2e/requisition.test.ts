// Parts before a port stay, in the browser with the demo data: Aster Gale's chief engineer opens the
// Port Kelang stay, sees the piston ring sets short for its overhauls, drafts a requisition of the
// shortfalls and sends it; the superintendent finds it on the Fleet board and the office's list
// and marks it ordered; the second engineer receives it into the stores and it is delivered.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, switchUser } from "../support/browser";

let browser: Browser;
let page: Page;
let number = "";

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

const signInAs = (email: string) => switchUser(page, email, DEMO_PASSWORD);

describe("parts before a port stay", () => {
  it("shows the chief engineer the parts the Port Kelang jobs lack", async () => {
    await signInAs("chief@brightwater.example");
    await page.getByRole("link", { name: "Aster Gale" }).first().click();
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Port stays" }).click();
    await page.getByRole("region", { name: "Upcoming" }).getByRole("link", { name: "Port Kelang (demo call)" }).click();
    await page.getByRole("heading", { name: /Port Kelang/, level: 1 }).waitFor();
    // Another test may have accepted the package already: then its parts are counted as they are.
    const propose = page.getByRole("button", { name: "Propose a package" });
    if (await propose.isVisible()) await propose.click();
    const parts = page.getByRole("region", { name: /^Parts for/ });
    await parts.getByRole("status").filter({ hasText: /short for \d+ jobs?/ }).waitFor({ timeout: 60_000 });
    const rings = parts.locator("tbody tr").filter({ hasText: "BW-1001" });
    expect(Number(await rings.locator("td").nth(5).textContent())).toBeGreaterThan(0);
    await parts.scrollIntoViewIfNeeded();
    await screenshot(page, "stay-parts-short");
  });

  it("drafts a requisition of the shortfalls and sends it to the office", async () => {
    const parts = page.getByRole("region", { name: /^Parts for/ });
    await parts.getByRole("button", { name: /^Draft a requisition for \d+ parts?$/ }).click();
    const made = parts.getByText(/^RQ-AG-\d{4} drafted\./);
    await made.waitFor({ timeout: 15_000 });
    number = /RQ-AG-\d{4}/.exec((await made.textContent()) ?? "")![0];
    await parts.getByRole("link", { name: "Check and send it on the Requisitions tab" }).click();
    const card = page.locator(`[data-requisition="${number}"]`);
    await card.waitFor();
    await expect.poll(() => card.getByText("Drafted on board").count()).toBe(1);
    expect(await card.locator("tbody tr").filter({ hasText: "BW-1001" }).count()).toBe(1);
    await card.getByRole("button", { name: `Send to the office (${number})` }).click();
    await expect.poll(() => card.getByText("Sent to the office").count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, "requisition-sent");
  });

  it("shows the superintendent the open requisition on the Fleet board, and the office marks it ordered", async () => {
    await signInAs("super@brightwater.example");
    await page.goto(new URL("/fleet", page.url()).toString());
    const link = page.getByRole("link", { name: /^\d+ requisitions open for Aster Gale: open the list$/ });
    await link.waitFor({ timeout: 20_000 });
    await link.click();
    await page.getByRole("heading", { name: "Requisitions", level: 1 }).waitFor();
    const row = page.locator("tbody tr").filter({ hasText: number });
    await row.waitFor();
    expect(await row.getByText("Sent to the office").count()).toBe(1);
    await screenshot(page, "requisitions-office");
    await row.getByRole("link", { name: number }).click();
    const card = page.locator(`[data-requisition="${number}"]`);
    await card.getByRole("button", { name: `Mark ordered (${number})` }).click();
    const panel = page.getByRole("dialog", { name: `Order ${number}` });
    await panel.getByLabel("Your order reference (optional)").fill("PO-26-0412");
    await panel.getByRole("button", { name: "Mark ordered" }).click();
    await expect.poll(() => card.getByText("Ordered by the office").count(), { timeout: 10_000 }).toBe(1);
    expect(await card.getByText(/office order PO-26-0412/).count()).toBe(1);
  });

  it("is received by the second engineer into the stores, and delivered", async () => {
    await signInAs("second@brightwater.example");
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/hour-log$/);
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Requisitions" }).click();
    const card = page.locator(`[data-requisition="${number}"]`);
    await card.getByRole("button", { name: `Receive parts of ${number}` }).click();
    const panel = page.getByRole("dialog", { name: `Receive ${number}` });
    // Only the ring sets came; the rest will not (the other parts stay under their minimum).
    for (const input of await panel.getByLabel(/^Received now of /).all()) {
      if ((await input.getAttribute("aria-label")) !== "Received now of BW-1001") await input.fill("");
    }
    await panel.getByLabel("Nothing more will come: close it as delivered with what was received").check();
    await panel.getByRole("button", { name: "Receive into the stores" }).click();
    await expect.poll(() => page.getByText(`${number} delivered: the parts are in the stores.`).count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, "requisition-delivered");
  });
});
