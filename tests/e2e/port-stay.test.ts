// The demo chief engineer plans the next port stay of Corran Ness from its Calendar: opens the stay,
// has Keelson propose a package, accepts it, and finds the accepted work on the stay's days back on
// the Calendar. Writes to the demo data (planned dates on Corran Ness).
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { shipDay } from "@/server/format/hours";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let calendarUrl = "";
let stayUrl = "";
/** Work-order number → the ship's day it was accepted on. */
let accepted: Record<string, string> = {};

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

/** Work-order number → day, as the Calendar's list view shows the month on screen. */
async function calendarListDays(): Promise<Record<string, string>> {
  return page.evaluate(() => {
    const out: Record<string, string> = {};
    let day = "";
    for (const row of document.querySelectorAll(".fc-list-table tr")) {
      const date = row.getAttribute("data-date");
      if (date) day = date;
      const number = row.getAttribute("data-work-order") ?? row.querySelector("[data-work-order]")?.getAttribute("data-work-order");
      if (number && day) out[number] = day;
    }
    return out;
  });
}

describe("the chief engineer plans a port stay from the Calendar", () => {
  it("opens the stay from the Calendar's “Plan …” link", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("link", { name: "Corran Ness" }).click();
    await page.getByRole("link", { name: "Calendar" }).click();
    await page.waitForURL(/\/calendar$/);
    calendarUrl = page.url();
    const plan = page.getByRole("link", { name: /^Plan Rotterdam Waalhaven/ });
    const stays = page.getByRole("region", { name: "Port stays in view" });
    // The demo stay is four days ahead: in this month's view, or the next one's.
    await expect
      .poll(
        async () => {
          if ((await plan.count()) > 0) return true;
          if (/Loading/.test((await stays.textContent()) ?? "")) return false;
          await page.getByRole("button", { name: /^Next/ }).click();
          return false;
        },
        { timeout: 20_000 },
      )
      .toBe(true);
    await screenshot(page, "port-stay-calendar-before");
    await plan.click();
    await page.waitForURL(/\/port-stays\/[0-9a-f-]{36}$/);
    stayUrl = page.url();
    await page.getByRole("heading", { name: /Rotterdam Waalhaven/, level: 1 }).waitFor();
  });

  it("proposes a package: every job with its reason, no rank over its hours", async () => {
    await page.getByRole("button", { name: "Propose work package" }).click();
    await page.getByRole("button", { name: "Accept package" }).waitFor();
    const items = page.locator("[data-day] [data-work-order]");
    await expect.poll(() => items.count(), { timeout: 15_000 }).toBeGreaterThan(0);
    // Each day's crew figures read "used / available"; none may be over.
    const figures = await page.locator("[data-day] [role=meter]").evaluateAll((meters) =>
      meters.map((m) => [Number(m.getAttribute("aria-valuenow")), Number(m.getAttribute("aria-valuemax"))]),
    );
    expect(figures.length).toBeGreaterThan(0);
    for (const [used, available] of figures) expect(used).toBeLessThanOrEqual(available!);
    for (const text of await items.allTextContents()) expect(text.length).toBeGreaterThan(30);
    await screenshot(page, "port-stay-proposal");
  });

  it("accepts it and finds the work on the stay's days on the Calendar", async () => {
    accepted = await page.locator("[data-day]").evaluateAll((days) =>
      Object.fromEntries(
        days.flatMap((d) =>
          [...d.querySelectorAll("[data-work-order]")].map((i) => [i.getAttribute("data-work-order")!, d.getAttribute("data-day")!]),
        ),
      ),
    );
    expect(Object.keys(accepted).length).toBeGreaterThan(0);
    await page.getByRole("button", { name: "Accept package" }).click();
    await page.getByText(/^Package accepted: \d+ jobs? planned/).waitFor({ timeout: 15_000 });
    await screenshot(page, "port-stay-accepted");

    await page.getByRole("link", { name: "See it on the Calendar" }).click();
    await page.waitForURL(calendarUrl);
    await page.getByRole("button", { name: "List" }).click();
    const wanted = Object.entries(accepted);
    const firstShownDay = () => page.evaluate(() => document.querySelector(".fc-list-day")?.getAttribute("data-date") ?? null);
    // The stay may run into the next month: read each month its days are in.
    for (const month of [...new Set(wanted.map(([, day]) => day.slice(0, 7)))].sort()) {
      const inMonth = wanted.filter(([, day]) => day.startsWith(month));
      await expect
        .poll(
          async () => {
            const shown = await firstShownDay();
            if (shown && shown.slice(0, 7) < month) {
              await page.getByRole("button", { name: /^Next/ }).click();
              return -1;
            }
            const days = await calendarListDays();
            return inMonth.filter(([number, day]) => days[number] === day).length;
          },
          { timeout: 20_000 },
        )
        .toBe(inMonth.length);
    }
    await screenshot(page, "port-stay-calendar-after");
  });

  it("prints the package sheet with checklists and cautions", async () => {
    await page.goto(`${stayUrl}/sheet`);
    await page.getByRole("heading", { name: /^Work package: Rotterdam Waalhaven/ }).waitFor();
    for (const number of Object.keys(accepted)) expect(await page.getByText(number, { exact: true }).count()).toBe(1);
    expect(await page.getByText(/permit to work/).count()).toBeGreaterThan(0);
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Print" }).isVisible()).toBe(false);
    await screenshot(page, "port-stay-sheet-print");
    await page.emulateMedia({ media: "screen" });
  });

  it("adds a port stay on the Port stays tab, with the crew of the latest stay, and deletes it", async () => {
    await page.goto(stayUrl);
    await page.getByRole("link", { name: "Port stays", exact: true }).click();
    await page.waitForURL(/\/port-stays$/);
    const upcoming = page.getByRole("region", { name: "Upcoming" });
    await upcoming.getByRole("link", { name: "Rotterdam Waalhaven (demo call)" }).waitFor();
    expect(await upcoming.getByText(/✓ accepted, \d+ jobs?/).count()).toBe(1);

    await page.getByRole("button", { name: "Add port stay" }).click();
    const panel = page.getByRole("dialog", { name: "Add a port stay" });
    // The demo crew has six ranks: the new stay starts from them.
    expect(await panel.getByRole("combobox", { name: /^Rank, row/ }).count()).toBe(6);
    await panel.getByRole("button", { name: "Add port stay" }).click();
    await panel.getByText("Enter the port name.").waitFor();
    await screenshot(page, "port-stay-add-errors");

    const day = (n: number) => shipDay(new Date(Date.now() + n * 86_400_000), "Europe/Amsterdam");
    await panel.getByLabel("Port", { exact: true }).fill("Hook of Holland (test call)");
    await panel.getByLabel("Arrival").fill(`${day(40)}T06:00`);
    await panel.getByLabel("Departure").fill(`${day(41)}T18:00`);
    await panel.getByRole("button", { name: "Add port stay" }).click();
    await page.getByText("Hook of Holland (test call) added.").waitFor();
    await upcoming.getByRole("link", { name: "Hook of Holland (test call)" }).click();
    await page.getByRole("heading", { name: "Hook of Holland (test call)", level: 1 }).waitFor();
    expect(await page.getByText("No package yet.", { exact: false }).count()).toBe(1);

    // As a tablet in the dark engine control room would show it.
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await page.getByRole("button", { name: "Propose work package" }).click();
    await page.getByRole("button", { name: "Accept package" }).waitFor();
    await screenshot(page, "port-stay-dark-tablet");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
    await page.setViewportSize({ width: 1280, height: 900 });

    await page.getByRole("button", { name: "Delete" }).click();
    await page.getByRole("dialog").getByRole("button", { name: "Delete stay" }).click();
    await page.waitForURL(/\/port-stays$/);
    await upcoming.getByRole("link", { name: "Rotterdam Waalhaven (demo call)" }).waitFor();
    await expect.poll(() => page.getByRole("link", { name: "Hook of Holland (test call)" }).count()).toBe(0);
    await screenshot(page, "port-stays-list");
  });
});
