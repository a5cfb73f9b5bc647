// The records an auditor and a surveyor ask for, in the browser with the demo data: the
// administrator searches the audit trail for the demo's readings and opens a record's own trail;
// the chief engineer goes through Aster Gale's class items and sorts them by state.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, switchUser } from "../support/browser";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

const signInAs = (email: string) => switchUser(page, email, DEMO_PASSWORD);

describe("the audit trail", () => {
  it("lets the administrator search by kind and see who changed what", async () => {
    await signInAs("admin@brightwater.example");
    await page.getByRole("navigation", { name: "Company" }).getByRole("link", { name: "Company" }).click();
    await page.getByRole("link", { name: "Audit trail" }).click();
    await page.getByRole("heading", { name: "Audit trail" }).waitFor();
    await page.getByLabel("Kind of record").selectOption({ label: "Readings" });
    await page.getByLabel("Person").selectOption({ label: "Keelson itself" });
    await page.getByRole("button", { name: "Search" }).click();
    await page.waitForURL(/person=system.*kind=readings|kind=readings.*person=system/);
    const rows = page.locator("tbody tr");
    await rows.first().waitFor();
    // The demo's readings were written by the demo set-up, and say so, with the values they set.
    expect(await rows.first().textContent()).toMatch(/Keelson \(demo set-up\).*reading added/);
    expect(await rows.first().textContent()).toMatch(/Meter value/);
    await screenshot(page, "audit-trail-readings");
    const csv = page.getByRole("link", { name: "Download CSV" });
    expect(await csv.getAttribute("href")).toBe("/api/admin/audit/export?person=system&kind=readings");
  });

  it("says which field is wrong in a bad period and shows nothing", async () => {
    await page.goto(`${new URL(page.url()).origin}/admin/audit?from=2026-06-10&until=2026-06-01`);
    await page.getByRole("alert").filter({ hasText: "The last day must not be before the first day." }).waitFor();
    expect(await page.locator("tbody tr").count()).toBe(0);
  });
});

describe("the class items", () => {
  it("lists Aster Gale's class-related routines for the chief engineer, sortable and printable", async () => {
    await signInAs("chief@brightwater.example");
    await page.getByRole("link", { name: "Aster Gale" }).first().click();
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Class items" }).click();
    await page.getByRole("heading", { name: /Class items of Aster Gale/ }).waitFor();
    const rows = page.locator("tbody tr");
    expect(await rows.count()).toBeGreaterThan(1);
    await page.getByRole("link", { name: "State", exact: true }).click();
    await page.waitForURL(/sort=state/);
    await rows.first().waitFor();
    // Sorted by state: the most urgent first, the same order as the Backlog's urgency.
    const states = await page.locator("tbody tr [data-state]").evaluateAll((els) => els.map((e) => e.getAttribute("data-state")));
    const order = ["out-of-tolerance", "late", "window-open", "deferred", "scheduled"];
    const ranks = states.map((s) => order.indexOf(s ?? ""));
    expect(ranks).toEqual([...ranks].sort((a, b) => a - b));
    expect(await page.getByRole("button", { name: "Print" }).count()).toBe(1);
    await screenshot(page, "class-items-by-state");
  });
});

describe("the ship's clock", () => {
  it("lets the chief engineer enter the clocks going back an hour six days from now, and says so", async () => {
    await signInAs("chief@brightwater.example");
    await page.getByRole("link", { name: "Aster Gale" }).first().click();
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Hour log" }).click();
    await page.getByText(/Ship’s clock: Asia\/Singapore/).click();
    const form = page.getByRole("form", { name: "Enter a change of the clock" });
    await form.waitFor();
    // Nothing picked: the server names the field.
    await form.getByRole("button", { name: "Enter the change" }).click();
    await form.getByRole("alert").filter({ hasText: /zone/ }).waitFor();
    // Six days ahead (inside the week the form allows), so the demo keeps its zone meanwhile.
    const day = new Intl.DateTimeFormat("en-CA", { timeZone: "Asia/Singapore" }).format(new Date(Date.now() + 6 * 86_400_000));
    await form.getByLabel("Ship’s day").fill(day);
    await form.getByLabel("Time").fill("00:00");
    await form.getByLabel("New zone").selectOption("UTC+7");
    await form.getByLabel("Note (optional)").fill("Westbound, browser test");
    await form.getByRole("button", { name: "Enter the change" }).click();
    await form.getByRole("status").filter({ hasText: "Clocks go back 1 h" }).waitFor({ timeout: 15_000 });
    expect(await page.getByText(/Asia\/Singapore → UTC\+7 \(to come\)/).count()).toBe(1);
    await screenshot(page, "ship-clock-entered");
  });
});
