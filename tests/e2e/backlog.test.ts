import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

describe("the demo chief engineer reads the Backlog", () => {
  it("sees a believable Backlog with every open state, and filters it from the URL", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("link", { name: "Hour log" }).first().click();
    await page.getByRole("link", { name: "Backlog" }).click();
    await page.waitForURL(/\/backlog$/);
    const rows = page.locator("tbody tr");
    await rows.first().waitFor();
    // Most urgent first: the first row is out of tolerance, said in words.
    expect(await rows.first().getByText("out of tolerance").count()).toBe(1);
    for (const [state, words] of [
      ["scheduled", "scheduled"],
      ["window-open", "window open"],
      ["late", "late"],
      ["out-of-tolerance", "out of tolerance"],
    ]) {
      const badges = page.locator(`tbody [data-state="${state}"]`);
      expect(await badges.count(), state).toBeGreaterThan(0);
      expect(await badges.first().textContent()).toContain(words);
    }
    await screenshot(page, "backlog");

    // Only the critical class items inside their window: the filter goes into the URL.
    await page.getByLabel("Class items only").check();
    await page.waitForURL(/classRelated=true/);
    await expect.poll(async () => (await rows.allTextContents()).every((t) => t.includes("class"))).toBe(true);
    await page.reload();
    expect(await page.getByLabel("Class items only").isChecked()).toBe(true);
    await screenshot(page, "backlog-class-items");
  });

  it("shows a defect not yet planned as such, and done work with what was due and when it was done", async () => {
    // The demo's steering-gear pump bearing (db/seed/defects.ts) is reported, not planned.
    await page.goto(page.url().replace(/\/backlog.*$/, "/backlog?defects=true"));
    const defect = page.locator("tbody tr").filter({ hasText: "Noisy bearing, steering gear pump 1" });
    await defect.waitFor();
    expect(await defect.getByText("not planned yet").count()).toBe(1);
    // Done work: due …, done … — never a projection "≈ at 0 h".
    await page.goto(page.url().replace(/\/backlog.*$/, "/backlog?state=done"));
    const rows = page.locator("tbody tr");
    await rows.first().waitFor();
    const texts = await rows.allTextContents();
    expect(texts.every((t) => /done \d{1,2} [A-Z][a-z]{2}/.test(t))).toBe(true);
    expect(texts.some((t) => t.includes("≈ at 0 h"))).toBe(false);
    await screenshot(page, "backlog-done");
  });
});
