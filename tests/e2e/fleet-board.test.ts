// The demo superintendent opens the Fleet board, sees every demo vessel, drills into a vessel's
// Backlog filtered the same way as the figure clicked, and rejects a pending deferral from the
// board's list on its work order page. Writes to the demo data (one seeded request on Corran Ness
// is decided; the other browser tests count on Aster Gale's).
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, demoVessels } from "@/db/seed/scenario";
import type { FleetBoard } from "@/server/fleet/contract";
import type { FleetOverdue } from "@/server/fleet/overdue-contract";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let board: FleetBoard;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

async function loadBoard(): Promise<FleetBoard> {
  const res = await page.request.get(`${BASE_URL}/api/fleet/board`);
  expect(res.status()).toBe(200);
  return (await res.json()) as FleetBoard;
}

describe("the superintendent's Fleet board", () => {
  it("is the office's landing: every demo vessel on one screen, in the board's order", async () => {
    await signInThroughForm(page, "super@brightwater.example", DEMO_PASSWORD);
    expect(await page.getByRole("link", { name: /Fleet board →/ }).count()).toBe(1);
    await page.getByRole("navigation", { name: "Company" }).getByRole("link", { name: "Fleet board" }).click();
    await page.waitForURL(/\/fleet$/);
    const rows = page.locator('[data-testid="fleet-table"] tbody tr');
    await expect.poll(() => rows.count(), { timeout: 15_000 }).toBe(demoVessels.length);
    board = await loadBoard();
    // The rows, top to bottom, are the API's vessels in its order, and they are the demo's.
    const codes = await rows.evaluateAll((trs) => trs.map((tr) => tr.getAttribute("data-vessel")));
    expect(codes).toEqual(board.vessels.map((v) => v.code));
    expect([...codes].sort()).toEqual(demoVessels.map((v) => v.code).sort());
    for (const v of demoVessels) expect(await rows.filter({ hasText: v.name }).count(), v.name).toBe(1);
    // The fleet chart has the seeded 90 days of history.
    const chart = page.getByTestId("fleet-trend-chart");
    expect(Number(await chart.getAttribute("data-points"))).toBe(90);
    expect(await page.getByTestId("trend-sparkline").count()).toBe(demoVessels.length);
    // The seed's last readings are at 09:00 ship's time the day before: depending on the hour of
    // the run a vessel may be past the company's 36 h. The flag shows for exactly those the API names.
    expect(await page.getByTestId("stopped-reporting").count()).toBe(
      board.vessels.filter((v) => v.stoppedReporting).length,
    );
    await screenshot(page, "fleet-board");
    await page.setViewportSize({ width: 820, height: 1180 });
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "fleet-board-dark-tablet");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it("drills into one vessel's Backlog, filtered the same way as the figure clicked", async () => {
    // The first vessel with overdue critical work, else the first with anything overdue.
    const v =
      board.vessels.find((x) => x.criticalOutOfTolerance > 0) ?? board.vessels.find((x) => x.outOfTolerance > 0);
    expect(v, "a demo vessel with work out of tolerance").toBeDefined();
    const critical = v!.criticalOutOfTolerance > 0;
    const figure = critical ? v!.criticalOutOfTolerance : v!.outOfTolerance;
    const what = critical ? "critical work out of tolerance" : "out of tolerance";
    await page.getByRole("link", { name: `${figure} ${what} on ${v!.name}: open its Backlog` }).click();
    await page.waitForURL(/\/backlog\?/);
    const url = new URL(page.url());
    expect(url.pathname).toBe(`/vessels/${v!.id}/backlog`);
    expect(url.searchParams.get("state")).toBe("out-of-tolerance");
    expect(url.searchParams.get("critical")).toBe(critical ? "true" : null);
    // The Backlog, from the live work orders, finds as many as the board's snapshot said.
    await expect
      .poll(() => page.locator("#backlog-heading").textContent(), { timeout: 15_000 })
      .toMatch(new RegExp(`^Backlog\\s*${figure} work orders?\\b`));
    const states = await page
      .locator("tbody [data-state]")
      .evaluateAll((els) => els.map((e) => e.getAttribute("data-state")));
    expect(states.length).toBeGreaterThan(0);
    expect(new Set(states)).toEqual(new Set(["out-of-tolerance"]));
    await screenshot(page, "fleet-board-drill-down");

    // The vessel's name opens the overdue list: out of tolerance and late together.
    await page.goto(`${BASE_URL}/fleet`);
    await page.locator(`tr[data-vessel="${v!.code}"] th a`).click();
    await page.waitForURL(/\/backlog\?/);
    expect(new URL(page.url()).searchParams.get("state")).toBe("out-of-tolerance,late");
  });

  it("decides a pending deferral on the board itself, with the chief's reason and the counter's rate in view", async () => {
    await page.goto(`${BASE_URL}/fleet`);
    const list = page.getByTestId("pending-deferrals");
    await list.waitFor();
    board = await loadBoard();
    // A seeded request on Corran Ness: the deferral browser test counts on Aster Gale's.
    const pending =
      board.pendingDeferrals.find((d) => d.vessel.code === "CN") ??
      board.pendingDeferrals.find((d) => d.vessel.code !== "AG");
    expect(pending, "a seeded pending request off Aster Gale").toBeDefined();
    expect(await list.locator("li").count()).toBe(board.pendingDeferrals.length);
    const item = list.locator("li").filter({ has: page.getByRole("link", { name: pending!.workOrder.number }) });
    // The chief engineer's reason, word for word, beside the request.
    expect(await item.getByText(`“${pending!.reason}”`).count()).toBe(1);
    // A rejection needs its note: refused first, said beside the request.
    await item.getByRole("button", { name: `Reject the deferral of ${pending!.workOrder.number}` }).click();
    await item.getByRole("alert").waitFor();
    await item
      .getByLabel(`Note on the request for ${pending!.workOrder.number} (needed to reject)`)
      .fill("Not agreed: book the survey at this port; the agent can arrange the attendance.");
    await screenshot(page, "fleet-board-deferral-rejected");
    await item.getByRole("button", { name: `Reject the deferral of ${pending!.workOrder.number}` }).click();
    await expect
      .poll(() => page.getByRole("link", { name: pending!.workOrder.number }).count(), { timeout: 15_000 })
      .toBe(0);
    const after = await loadBoard();
    expect(after.pendingDeferrals.map((d) => d.id)).not.toContain(pending!.id);
    expect(after.pendingDeferrals).toHaveLength(board.pendingDeferrals.length - 1);
    await screenshot(page, "fleet-board-after-decision");
  });

  it("opens the overdue list of every vessel, narrows it to flagged work, and takes it away as CSV", async () => {
    await page.goto(`${BASE_URL}/fleet`);
    await page.getByRole("link", { name: "Overdue list, every vessel" }).click();
    await page.waitForURL(/\/fleet\/overdue$/);
    const all = (await (await page.request.get(`${BASE_URL}/api/fleet/overdue`)).json()) as FleetOverdue;
    expect(all.items.length).toBeGreaterThan(0);
    const table = page.getByRole("table", { name: /Overdue work orders/ });
    const rows = table.locator("tbody tr");
    await expect.poll(() => rows.count(), { timeout: 15_000 }).toBe(all.items.length);
    // The worst first: out of tolerance before late, in words.
    const states = await table.locator("[data-state]").allTextContents();
    const firstLate = states.findIndex((t) => t.includes("late"));
    expect(states.slice(firstLate).every((t) => t.includes("late"))).toBe(true);
    await screenshot(page, "fleet-overdue");

    await page.getByLabel("Critical or class-related only").click();
    await page.waitForURL(/flagged=true/);
    const flagged = all.items.filter((i) => i.critical || i.classRelated);
    await expect.poll(() => rows.count()).toBe(flagged.length);
    const href = await page.getByRole("link", { name: "Download CSV" }).getAttribute("href");
    expect(href).toBe("/api/fleet/overdue/export?flagged=true");
    const csv = await (await page.request.get(`${BASE_URL}${href}`)).text();
    const lines = csv.replace(/^\uFEFF/, "").trim().split("\r\n");
    expect(lines[0]).toMatch(/^Vessel,Work order,Title,/);
    expect(lines).toHaveLength(flagged.length + 1);

    await page.emulateMedia({ media: "print" });
    await screenshot(page, "fleet-overdue-print");
    await page.emulateMedia({ media: "screen" });
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await page.setViewportSize({ width: 820, height: 1180 });
    await screenshot(page, "fleet-overdue-dark-tablet");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
    await page.setViewportSize({ width: 1280, height: 900 });
  });
});
