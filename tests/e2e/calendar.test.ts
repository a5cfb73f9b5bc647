import type { Browser, Page, Response } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { CalendarRange, CalendarWorkOrder } from "@/server/calendar/contract";
import { isPlannable } from "@/server/calendar/plannable-days";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

const calendarAnswer = (p: Page) =>
  p.waitForResponse((r: Response) => r.url().includes("/calendar?start=") && r.request().method() === "GET");

function daysOf(range: CalendarRange): string[] {
  const days: string[] = [];
  for (let t = Date.parse(`${range.start}T00:00:00Z`); t < Date.parse(`${range.end}T00:00:00Z`); t += 86_400_000) {
    days.push(new Date(t).toISOString().slice(0, 10));
  }
  return days;
}

/** An open, unplanned work order of the range and another day of the range it may be planned on. */
function planCandidate(range: CalendarRange): { workOrder: CalendarWorkOrder; day: string } {
  for (const w of range.workOrders) {
    if (w.state === "done" || w.plannedDate) continue;
    // After UTC today: every ship's today is at most one day ahead of it, and a past day is refused.
    const utcToday = new Date().toISOString().slice(0, 10);
    const day = daysOf(range).find((d) => d !== w.day && d > utcToday && isPlannable(d, w));
    if (day) return { workOrder: w, day };
  }
  throw new Error("The demo month has no work order to plan.");
}

describe("the demo chief engineer plans from the Calendar", () => {
  it("sees work with its state in words and a port stay, lists it, and plans a work order through the panel", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("link", { name: "Hour log" }).first().click();
    const first = calendarAnswer(page);
    await page.getByRole("link", { name: "Calendar" }).click();
    await page.waitForURL(/\/calendar$/);
    const month = (await (await first).json()) as CalendarRange;
    expect(month.workOrders.length).toBeGreaterThan(0);
    expect(month.portStays.length).toBeGreaterThan(0);

    // The month grid: work orders with their state said in words, and the port stay shaded.
    const events = page.locator(".fc-daygrid .kc-event");
    await events.first().waitFor();
    const words = await page.locator(".fc-daygrid .kc-event [data-state]").allTextContents();
    expect(words.length).toBeGreaterThan(0);
    expect(words.every((t) => /scheduled|window open|late|out of tolerance|deferred|done/.test(t))).toBe(true);
    const stay = month.portStays[0]!;
    expect(await page.locator(".fc-bg-event", { hasText: stay.port }).count()).toBeGreaterThan(0);
    const link = page.getByRole("link", { name: `Plan ${stay.port}` });
    expect(await link.getAttribute("href")).toBe(
      `${new URL(page.url()).pathname.replace(/calendar$/, "")}port-stays/${stay.id}`,
    );
    // An hours-based work order says it is projected, and its basis shows on keyboard focus.
    const projected = page.locator(".fc-daygrid .kc-event", { has: page.locator(".kc-mark-projected") }).first();
    if ((await projected.count()) > 0) {
      await projected.focus();
      await expect.poll(() => projected.locator(".kc-basis").isVisible()).toBe(true);
      expect(await projected.locator(".kc-basis").textContent()).toMatch(/projected at [\d.]+ h\/day/);
    }
    await screenshot(page, "calendar-month");

    // The list view: a new range, fetched as the view changes.
    const listed = calendarAnswer(page);
    await page.getByRole("button", { name: "List", exact: true }).click();
    const list = (await (await listed).json()) as CalendarRange;
    await page.locator(".fc-list .kc-event").first().waitFor();
    expect(await page.locator(".fc-list .kc-event [data-state]").count()).toBe(list.workOrders.length);
    await screenshot(page, "calendar-list");

    // Plan one through the panel, keyboard only: focus the work order, Enter, type the day, Enter.
    const { workOrder, day } = planCandidate(list);
    const row = page.locator(`.fc-list [data-work-order="${workOrder.number}"]`);
    await row.getByRole("button").focus();
    await page.keyboard.press("Enter");
    const panel = page.getByRole("dialog");
    await panel.waitFor();
    expect(await panel.getByText("May be planned").count()).toBe(1);
    expect(await panel.getByRole("link", { name: `Open work order ${workOrder.number}` }).getAttribute("href")).toMatch(
      new RegExp(`/work-orders/${workOrder.id}$`),
    );
    await screenshot(page, "calendar-plan-panel");
    // A day already past on board is refused beside the field, and nothing is saved.
    const past = new Date(Date.now() - 3 * 86_400_000).toISOString().slice(0, 10);
    await panel.getByLabel("Planned date").fill(past);
    await page.keyboard.press("Enter");
    const refusal = panel.getByText(/A planned day is today or later; .* has passed on board\./).first();
    await refusal.waitFor();
    expect(await panel.getByLabel("Planned date").getAttribute("aria-invalid")).toBe("true");
    await screenshot(page, "calendar-plan-refused");
    const unchanged = await page.evaluate(
      async (url) => (await (await fetch(url)).json()) as CalendarRange,
      new URL(`${page.url().replace(/\/calendar$/, "")}`).pathname.replace(/^\/vessels/, "/api/vessels") +
        `/calendar?start=${list.start}&end=${list.end}`,
    );
    expect(unchanged.workOrders.find((w) => w.id === workOrder.id)?.plannedDate ?? null).toBeNull();
    await panel.getByLabel("Planned date").fill(day);
    await page.keyboard.press("Enter");
    await panel.waitFor({ state: "hidden" });
    await page.getByText(`${workOrder.number} is planned for`).waitFor();
    const moved = page.locator(`.fc-list [data-work-order="${workOrder.number}"]`);
    await expect.poll(async () => (await moved.textContent()) ?? "").toContain("planned");
    if (workOrder.dueDay && workOrder.dueDay !== day) {
      expect(await moved.textContent()).toMatch(/planned · due \d{1,2} \w{3}/);
    }
    await screenshot(page, "calendar-planned");

    // Dark theme and tablet width, to look at.
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await page.getByRole("button", { name: "Month grid", exact: true }).click();
    await page.locator(".fc-daygrid .kc-event").first().waitFor();
    await screenshot(page, "calendar-month-dark");
    await page.setViewportSize({ width: 820, height: 1100 });
    await screenshot(page, "calendar-month-dark-tablet");
  });
});
