// The demo second engineer corrects a reading they just entered, then removes it. Self-contained:
// the reading is back-filled between a counter's last two readings and removed at the end, so the
// Hour log is left as it was for tests/e2e/hour-log.test.ts, which shares the demo database.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { formatHours, formatShipTime, shipClock, shipDay } from "@/server/format/hours";
import type { HourLogView, ReadingHistory } from "@/server/readings/contract";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

/** The counter chosen, the instant of the new reading, the value mistyped and the one meant. */
type Plan = {
  vesselId: string;
  counterId: string;
  name: string;
  timeZone: string;
  at: Date;
  typed: number;
  meant: number;
  previous: number;
};
let plan: Plan;

const floor1 = (v: number) => Math.floor(v * 10 + 1e-9) / 10;
const ceil1 = (v: number) => Math.ceil(v * 10 - 1e-9) / 10;

async function getJson<T>(path: string): Promise<T> {
  const response = await page.request.get(`${BASE_URL}${path}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as T;
}

/**
 * The counter with the most room between its last two readings (an engine that hardly ran), and
 * two values at their midpoint that both pass the 24-hours-in-24-hours rule (SOURCES.md,
 * "Running-hour facts") against each side: the higher one "typed", the lower one "meant".
 */
async function planReading(vesselId: string): Promise<Plan> {
  const view = await getJson<HourLogView>(`/api/vessels/${vesselId}/hour-log`);
  const timeZone = view.vessel.timeZone;
  let best: (Plan & { room: number }) | null = null;
  for (const c of view.counters) {
    const history = await getJson<ReadingHistory>(`/api/vessels/${vesselId}/readings?counterId=${c.id}&days=10`);
    const [p, n] = history.readings.filter((r) => r.segment === c.segment).slice(-2);
    if (!p || !n) continue;
    const pAt = new Date(p.readAt).getTime();
    const nAt = new Date(n.readAt).getTime();
    const at = new Date(Math.floor((pAt + nAt) / 2 / 60_000) * 60_000);
    const before = (at.getTime() - pAt) / 3_600_000;
    const after = (nAt - at.getTime()) / 3_600_000;
    const meant = ceil1(Math.max(p.meterValue, n.meterValue - after));
    const typed = floor1(Math.min(n.meterValue, p.meterValue + before));
    const room = typed - meant;
    if (room >= 0.2 && (!best || room > best.room)) {
      best = { vesselId, counterId: c.id, name: c.name, timeZone, at, typed, meant, previous: p.meterValue, room };
    }
  }
  expect(best, "a demo counter with room between its last two readings").not.toBeNull();
  return best!;
}

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

describe("the demo second engineer corrects a mistyped reading", () => {
  it("back-fills a reading with a typo", async () => {
    await signInThroughForm(page, "second@brightwater.example", DEMO_PASSWORD);
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/hour-log$/);
    const vesselId = /\/vessels\/([0-9a-f-]+)\/hour-log$/.exec(page.url())![1]!;
    plan = await planReading(vesselId);

    await page.getByLabel("Ship’s day").fill(shipDay(plan.at, plan.timeZone));
    await page.getByLabel("Ship’s time").fill(shipClock(plan.at, plan.timeZone));
    await page.locator(`#reading-${plan.counterId}`).fill(String(plan.typed));
    await page.getByRole("button", { name: "Save 1 reading" }).click();
    await expect.poll(() => page.getByText("Saved 1 reading for").count(), { timeout: 15_000 }).toBe(1);
  });

  it("opens Correct from the counter's latest readings and is refused a value below the previous reading", async () => {
    await page.getByRole("combobox", { name: "Counter" }).selectOption(plan.counterId);
    const when = formatShipTime(plan.at, plan.timeZone);
    const correct = page.getByRole("button", { name: `Correct the reading of ${when}, ${formatHours(plan.typed)}` });
    await correct.waitFor();
    // Keyboard: focus the action and press Enter; the panel's first field takes focus.
    await correct.focus();
    await page.keyboard.press("Enter");
    const panel = page.getByRole("dialog", { name: "Correct a reading" });
    await panel.waitFor();
    const value = panel.getByLabel("Corrected value (h)");
    expect(await value.evaluate((el) => el === document.activeElement)).toBe(true);

    await value.fill(String(floor1(plan.previous - 1)));
    await panel.getByLabel("Reason").fill("Typed the wrong figure");
    // Caught while typing, in the same words as the server.
    await expect.poll(() => panel.getByText(/Reading is lower than the previous one/).count()).toBe(1);
    await panel.getByRole("button", { name: "Save correction" }).click();
    await expect.poll(() => panel.getByText(/Nothing was changed/).count(), { timeout: 10_000 }).toBe(1);
    expect(await value.getAttribute("aria-invalid")).toBe("true");
    await screenshot(page, "reading-correction-refused");
  });

  it("corrects it with a reason and sees the corrected mark with the reason", async () => {
    const panel = page.getByRole("dialog", { name: "Correct a reading" });
    await panel.getByLabel("Corrected value (h)").fill(String(plan.meant));
    await panel.getByLabel("Reason").fill("Typed a digit wrong when back-filling");
    await screenshot(page, "reading-correction-form");
    await panel.getByRole("button", { name: "Save correction" }).click();

    const when = formatShipTime(plan.at, plan.timeZone);
    const notice = `Corrected the ${plan.name} reading at ${when}: ${formatHours(plan.typed)} → ${formatHours(plan.meant)}.`;
    await expect.poll(() => page.getByText(notice).count(), { timeout: 15_000 }).toBe(1);
    expect(await panel.count()).toBe(0);

    const row = page
      .getByRole("listitem")
      .filter({
        has: page.getByRole("button", { name: `Correct the reading of ${when}, ${formatHours(plan.meant)}` }),
      });
    await row.waitFor();
    const mark = row.getByRole("button", { name: "corrected" });
    await mark.focus();
    const tip = row.getByRole("tooltip");
    expect(await tip.isVisible()).toBe(true);
    expect(await tip.textContent()).toContain(
      `Was ${formatHours(plan.typed)}: “Typed a digit wrong when back-filling”`,
    );
    expect(await tip.textContent()).toContain("Mika Sandoval");
    await screenshot(page, "reading-correction-corrected");

    await page
      .getByRole("button", { name: /Day|Night/ })
      .first()
      .click();
    expect(await page.evaluate(() => document.documentElement.classList.contains("dark"))).toBe(true);
    await mark.focus();
    await screenshot(page, "reading-correction-corrected-night");

    await page.setViewportSize({ width: 820, height: 1180 });
    await mark.scrollIntoViewIfNeeded();
    await mark.focus();
    await screenshot(page, "reading-correction-tablet");
  });

  it("removes the reading again after confirming, and the Hour log is as before", async () => {
    const when = formatShipTime(plan.at, plan.timeZone);
    await page.getByRole("button", { name: `Correct the reading of ${when}, ${formatHours(plan.meant)}` }).click();
    const panel = page.getByRole("dialog", { name: "Correct a reading" });
    await panel.getByLabel("Remove this reading").check();
    await panel.getByLabel("Reason").fill("Back-filled by mistake: the day was already read");
    await panel.getByRole("button", { name: "Remove reading…" }).click();
    await expect.poll(() => panel.getByText(/Press the button again to remove it/).count()).toBe(1);
    await screenshot(page, "reading-correction-confirm-removal");
    await panel.getByRole("button", { name: "Yes, remove this reading" }).click();
    await expect.poll(() => page.getByText(/^Removed the reading of /).count(), { timeout: 15_000 }).toBe(1);

    const history = await getJson<ReadingHistory>(
      `/api/vessels/${plan.vesselId}/readings?counterId=${plan.counterId}&days=10`,
    );
    expect(history.readings.some((r) => r.readAt === plan.at.toISOString())).toBe(false);
    expect(history.removals[0]).toMatchObject({ readAt: plan.at.toISOString(), oldMeterValue: plan.meant });
    await screenshot(page, "reading-correction-removed");
  });
});
