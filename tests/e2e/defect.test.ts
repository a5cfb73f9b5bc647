// A defect found on board, in the browser with the demo data: Aster Gale's second engineer reports
// an oil leak with a photo; the chief engineer plans its repair into the Port Kelang stay; the
// superintendent sees the vessel's open defects on the Fleet board and opens them in its Backlog.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, switchUser } from "../support/browser";
import { gradientPng } from "../support/png";
import { formatDayKey } from "@/server/format/dates";

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

describe("a defect found on board", () => {
  it("is reported by the second engineer, refused first without its component", async () => {
    await signInAs("second@brightwater.example");
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/hour-log$/);
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Defects" }).click();
    await page.getByRole("heading", { name: "Defects", level: 1 }).waitFor();
    // The demo's open defects: those on critical equipment first.
    await page.locator("[data-defect]").first().waitFor();
    await page.getByRole("button", { name: "Report a defect" }).click();
    const panel = page.getByRole("dialog", { name: "Report a defect" });
    await panel.getByLabel("What was found").fill("Crankcase oil weeping at the inspection door");
    await panel.getByRole("button", { name: "Report the defect" }).click();
    await panel.getByText("Choose the component from the register.").waitFor();
    await panel.getByLabel("Component").selectOption({ index: 3 });
    await panel.getByLabel("Details").fill("Oil weeping at the lower door gasket, a few drops an hour.");
    await panel.getByLabel("It affects critical equipment").check();
    await screenshot(page, "defect-report-form");
    await panel.getByRole("button", { name: "Report the defect" }).click();
    const said = page.getByRole("status").filter({ hasText: /^DR-AG-\d{4} reported as WO-AG-\d{5}\./ });
    await said.waitFor({ timeout: 15_000 });
    number = /DR-AG-\d{4}/.exec((await said.textContent()) ?? "")![0];
    expect(await page.locator(`[data-defect="${number}"]`).getByText("Reported", { exact: true }).count()).toBe(1);
  });

  it("gets its photo on its work order", async () => {
    await page.getByRole("link", { name: "Add photos on its work order" }).click();
    await page.getByRole("heading", { name: /^Defect report DR-AG-\d{4}/ }).waitFor();
    const photos = page.getByRole("region", { name: "Photos and documents" });
    await photos.getByLabel("Caption for the next files (optional)").fill("Door gasket weeping");
    await photos.getByLabel("Add photos or documents").setInputFiles({ name: "door-gasket.png", mimeType: "image/png", buffer: gradientPng() });
    await photos.getByRole("img", { name: "Door gasket weeping" }).waitFor({ timeout: 15_000 });
    await screenshot(page, "defect-work-order");
  });

  it("is planned by the chief engineer into the Port Kelang stay", async () => {
    await signInAs("chief@brightwater.example");
    await page.getByRole("link", { name: "Aster Gale" }).first().click();
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Defects" }).click();
    const row = page.locator(`[data-defect="${number}"]`);
    await row.getByRole("button", { name: `Plan ${number}` }).click();
    const panel = page.getByRole("dialog", { name: `Plan ${number}` });
    // Port Kelang: the demo call three days ahead (db/seed/port-stays.ts).
    // Aster Gale's clock (Asia/Singapore): the stay's first ship's day.
    const target = new Intl.DateTimeFormat("en-CA", { timeZone: "Asia/Singapore" }).format(new Date(Date.now() + 3 * 86_400_000));
    await panel.getByLabel("Target day").fill(target);
    await panel.getByLabel("Rank").selectOption("motorman");
    await panel.getByLabel("Man-hours").fill("0");
    await panel.getByRole("button", { name: "Plan the repair" }).click();
    await panel.getByText(/man-hours as a number more than 0/).waitFor();
    await panel.getByLabel("Man-hours").fill("4,5");
    await panel.getByRole("button", { name: "Add a part" }).click();
    await panel.getByLabel("Part 1", { exact: true }).selectOption({ label: "BW-1030 — Mechanical seal, sea water pump" });
    await panel.getByRole("button", { name: "Plan the repair" }).click();
    // The message says the day in Keelson's one date style ("8 Dec 2026").
    await page.getByRole("status").filter({ hasText: `${number} planned for ${formatDayKey(target)}.` }).waitFor({ timeout: 15_000 });
    expect(await row.getByText("Planned", { exact: true }).count()).toBe(1);
    await screenshot(page, "defects-planned");
  });

  it("shows the superintendent the vessel's open defects on the Fleet board, and they open in its Backlog", async () => {
    await signInAs("super@brightwater.example");
    await page.goto(new URL("/fleet", page.url()).toString());
    const link = page.getByRole("link", { name: /^\d+ defects open on Aster Gale, \d+ on critical equipment, the oldest \d+ days: open its Backlog$/ });
    await link.waitFor({ timeout: 20_000 });
    await link.click();
    await page.waitForURL(/\/backlog\?defects=true$/);
    await expect.poll(() => page.locator("tbody tr").filter({ hasText: number }).count(), { timeout: 15_000 }).toBe(1);
    await screenshot(page, "defects-in-backlog");
  });
});
