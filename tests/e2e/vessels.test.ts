import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, demoVessels } from "@/db/seed/scenario";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

// A tablet held upright.
beforeAll(async () => {
  ({ browser, page } = await openPage({ width: 820, height: 1180 }));
});
afterAll(async () => {
  await browser?.close();
});

describe("the demo superintendent opens Keelson", () => {
  it("sees every vessel of the fleet with its counters and last reading", async () => {
    await signInThroughForm(page, "super@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("heading", { name: "Vessels", level: 1 }).waitFor();
    const cards = page.locator("main li");
    expect(await cards.count()).toBe(demoVessels.length);
    for (const v of demoVessels) {
      const card = cards.filter({ hasText: v.name });
      // The seed gives every demo vessel 10+ counters and a reading on the ship's day before.
      expect(Number(await card.locator("dt:has-text('Counters') + dd").textContent())).toBeGreaterThanOrEqual(10);
      expect(await card.getByText("none yet").count()).toBe(0);
    }
    await screenshot(page, "vessels-superintendent-tablet");
  });

  it("can read a vessel's Hour log but not write it", async () => {
    await page.getByRole("link", { name: "Hour log" }).first().click();
    await page.getByText("Your role can read the Hour log but not enter readings.").waitFor();
    expect(await page.locator("tbody input[inputmode=decimal]:not([disabled])").count()).toBe(0);
  });
});
