import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { shipDay } from "@/server/format/hours";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

describe("the demo second engineer logs the day's running hours", () => {
  it("signs in and is refused a reading that goes backwards, with the counter named and nothing saved", async () => {
    await signInThroughForm(page, "second@brightwater.example", DEMO_PASSWORD);
    // An engineer with one vessel lands on its Hour log.
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/hour-log$/);
    const inputs = page.locator("tbody input[inputmode=decimal]");
    const last = Number(await inputs.first().getAttribute("placeholder"));
    await inputs.first().fill(String(last - 10));
    // Caught on the page before sending, in the second engineer's words.
    await expect.poll(() => page.getByText(/Reading is lower than the previous one/).count()).toBe(1);
    await page.getByRole("button", { name: "Save 1 reading" }).click();
    await expect.poll(() => page.getByText(/Nothing was saved/).count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, "hour-log-refused");
    expect(Number(await inputs.first().getAttribute("placeholder"))).toBe(last);
    await inputs.first().fill("");
  });

  it("enters every counter, sees them saved and the chart move", async () => {
    await expect.poll(() => page.getByRole("heading", { name: /Daily running hours/ }).count()).toBe(1);

    const chart = page.getByTestId("running-hours-chart");
    await chart.waitFor();
    const pointsBefore = Number(await chart.getAttribute("data-points"));
    const today = shipDay(new Date(), "Asia/Singapore");
    expect(await chart.getAttribute("data-last-day")).not.toBe(today);

    // Every counter input shows its last reading as a placeholder: add 5 h to each.
    const inputs = page.locator("tbody input[inputmode=decimal]");
    const count = await inputs.count();
    expect(count).toBeGreaterThanOrEqual(10);
    for (let i = 0; i < count; i++) {
      const input = inputs.nth(i);
      const last = Number(await input.getAttribute("placeholder"));
      await input.fill(String(Math.round((last + 5) * 10) / 10));
    }
    // The live difference shows before saving.
    expect(await page.getByText("+5 h").count()).toBe(count);
    await screenshot(page, "hour-log-filled");

    await page.getByRole("button", { name: `Save ${count} readings` }).click();
    await expect.poll(() => page.getByText(`Saved ${count} readings for`).count(), { timeout: 15_000 }).toBe(1);

    // The chart now ends on today's ship's day with one more day of data.
    await expect.poll(() => chart.getAttribute("data-last-day"), { timeout: 15_000 }).toBe(today);
    expect(Number(await chart.getAttribute("data-points"))).toBe(pointsBefore + 1);
    // The table's last readings moved to the new values.
    const firstPlaceholder = await inputs.first().getAttribute("placeholder");
    expect(await page.getByText(`${Number(firstPlaceholder).toLocaleString("en-GB")} h`).count()).toBeGreaterThan(0);
    await screenshot(page, "hour-log-saved");
  });

  it("offers a night theme", async () => {
    await page.getByRole("button", { name: /Day|Night/ }).first().click();
    expect(await page.evaluate(() => document.documentElement.classList.contains("dark"))).toBe(true);
    await screenshot(page, "hour-log-night");
  });
});
