// The demo's liner wear (db/seed/liner-wear.ts): on Aster Gale one cylinder's wear creeps toward its
// 0.80 mm limit over five overhauls. The second engineer opens that overhaul's open work order and
// finds the chart of each measurement, captioned as a straight line fitted to its points, the table
// a screen reader reads instead, and the plain warning that the limit comes before the job falls due.
import path from "node:path";
import { AxeBuilder } from "@axe-core/playwright";
import { and, asc, eq, like, ne } from "drizzle-orm";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { DEMO_COMPANY_SLUG } from "@/server/auth/demo-company";
import { BASE_URL, launchBrowser, OUTPUT, screenshot, signInThroughForm } from "../support/browser";
import { closeTestDb, testDb } from "../support/fixtures";

let browser: Browser;
let context: BrowserContext;
let page: Page;

beforeAll(async () => {
  browser = await launchBrowser();
  // A context of our own: axe-core's builder asks for one.
  context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  page = await context.newPage();
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
  await closeTestDb();
});

/** Aster Gale's piston overhauls that have an open work order, with how many approved completions each has. */
async function openOverhauls() {
  const db = testDb();
  const rows = await db
    .select({ vesselId: s.vessel.id, routineId: s.routine.id, workOrderId: s.workOrder.id, number: s.workOrder.number })
    .from(s.routine)
    .innerJoin(s.vessel, eq(s.vessel.id, s.routine.vesselId))
    .innerJoin(s.company, eq(s.company.id, s.vessel.companyId))
    .innerJoin(s.workOrder, and(eq(s.workOrder.routineId, s.routine.id), ne(s.workOrder.state, "done")))
    .where(and(eq(s.company.slug, DEMO_COMPANY_SLUG), eq(s.vessel.code, "AG"), like(s.routine.title, "Cylinder unit %: piston overhaul%")))
    .orderBy(asc(s.routine.title));
  const done = await db
    .select({ routineId: s.workOrder.routineId })
    .from(s.completion)
    .innerJoin(s.workOrder, eq(s.workOrder.id, s.completion.workOrderId))
    .where(and(eq(s.completion.status, "approved"), eq(s.completion.vesselId, rows[0]!.vesselId)));
  return rows.map((r) => ({ ...r, completions: done.filter((d) => d.routineId === r.routineId).length }));
}

describe("measurement trends on a work order", () => {
  it("show the demo's liner wear against its limit, with the straight line and the warning", async () => {
    const overhauls = await openOverhauls();
    const demo = overhauls.find((o) => o.completions >= 5);
    expect(demo, "the seeded liner-wear series").toBeDefined();

    await signInThroughForm(page, "second@brightwater.example", DEMO_PASSWORD);
    await page.goto(`${BASE_URL}/vessels/${demo!.vesselId}/work-orders/${demo!.workOrderId}`);
    const section = page.getByRole("region", { name: "Measurement trends" });
    const wear = section.locator('[data-testid="trend-chart"][data-measurement="Liner wear, top ring TDC"]');
    await wear.waitFor({ timeout: 15_000 });
    expect(await wear.getAttribute("data-points")).toBe("5");
    expect(await wear.getAttribute("data-projection")).toBe("reaches");
    expect(await wear.locator("figcaption").textContent()).toMatch(
      /^A straight line fitted by least squares to 5 points against the counter’s running hours, rising [\d.]+ mm per 1,000 h\. At the present rate it reaches the upper limit 0\.80 mm at about [\d,]+ h \(about \d{1,2} \w{3} \d{4}\)\.$/,
    );
    // The chart draws five points, both limits and the line; a screen reader gets the table instead.
    expect(await wear.locator("svg circle").count()).toBe(5);
    expect(await wear.getByRole("img", { name: /Liner wear, top ring TDC: recorded values against the limits/ }).count()).toBe(1);
    const table = wear.getByRole("table", { name: /Liner wear, top ring TDC: the recorded values, against the lower limit 0\.00 mm and the upper limit 0\.80 mm/ });
    expect(await table.locator("tbody tr").count()).toBe(5);

    const warning = section.getByTestId("trend-warning");
    expect(await warning.count()).toBe(1);
    expect(await warning.textContent()).toMatch(
      /^▲ At the present rate, liner wear, top ring TDC reaches its limit 0\.80 mm at about [\d,]+ h \(about \d{1,2} \w{3} \d{4}\) — before this job falls due at [\d,.]+ h\.$/,
    );
    // The hours it names come before the due hours it names.
    const [, meets, due] = /at about ([\d,]+) h .* falls due at ([\d,.]+) h/.exec((await warning.textContent()) ?? "")!;
    expect(Number(meets!.replace(/,/g, ""))).toBeLessThan(Number(due!.replace(/,/g, "")));

    // The second measurement of the job is charted too, without a warning of its own.
    expect(await section.locator('[data-testid="trend-chart"][data-measurement="Ring groove clearance"]').count()).toBe(1);

    const axe = await new AxeBuilder({ page }).include('section[aria-labelledby="trends-heading"]').analyze();
    const blocking = axe.violations.filter((v) => v.impact === "serious" || v.impact === "critical");
    expect(blocking.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`)).toEqual([]);

    await screenshot(page, "measurement-trends");
    await section.screenshot({ path: path.join(OUTPUT, "measurement-trends-section.png") });
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await section.screenshot({ path: path.join(OUTPUT, "measurement-trends-section-dark.png") });
    await page.setViewportSize({ width: 820, height: 1180 });
    await section.screenshot({ path: path.join(OUTPUT, "measurement-trends-section-dark-tablet.png") });
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it("say a cylinder with one recorded value has too few points to project", async () => {
    // The seed's history leaves the other cylinders with their last overhaul only (db/seed/history.ts).
    const single = (await openOverhauls()).find((o) => o.completions === 1);
    expect(single).toBeDefined();
    await page.goto(`${BASE_URL}/vessels/${single!.vesselId}/work-orders/${single!.workOrderId}`);
    const wear = page.locator('[data-testid="trend-chart"][data-measurement="Liner wear, top ring TDC"]');
    await wear.waitFor({ timeout: 15_000 });
    expect(await wear.locator("figcaption").textContent()).toBe(
      "1 recorded value against the counter’s running hours. No projection: a trend needs at least 3 recorded values.",
    );
    expect(await page.getByTestId("trend-warning").count()).toBe(0);
  });
});
