// The PDF reports as a person gets them in the browser: the job card from a work order page and
// the survey and audit report from the Backlog, each a download that pdf.js reads back.
import { copyFileSync, readFileSync } from "node:fs";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { WorkOrderWithDeferrals } from "@/server/deferrals/contract";
import { BASE_URL, OUTPUT, openPage, screenshot, signInThroughForm } from "../support/browser";
import { readPdf } from "../support/pdf-text";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage());
  await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
});
afterAll(async () => {
  await browser?.close();
});

/** Clicks what starts a download and reads the file; a copy stays in the test output. */
async function downloadFrom(click: () => Promise<void>, keepAs: string) {
  const [download] = await Promise.all([page.waitForEvent("download", { timeout: 30_000 }), click()]);
  const file = await download.path();
  copyFileSync(file, path.join(OUTPUT, keepAs));
  return { name: download.suggestedFilename(), bytes: new Uint8Array(readFileSync(file)) };
}

describe("the PDF reports in the browser", () => {
  it("downloads a work order's job card from its page", async () => {
    await page.locator("main li").filter({ hasText: "Aster Gale" }).getByRole("link", { name: "Hour log" }).click();
    await page.getByRole("link", { name: "Backlog" }).click();
    await page.waitForURL(/\/backlog$/);
    await expect.poll(() => page.locator("tbody tr a").count(), { timeout: 15_000 }).toBeGreaterThan(0);
    await page.locator("tbody tr a").first().click();
    await page.waitForURL(/\/work-orders\//);
    const apiPath = new URL(page.url()).pathname.replace(/^\/vessels/, "/api/vessels");
    const detail = (await (await page.request.get(`${BASE_URL}${apiPath}`)).json()) as WorkOrderWithDeferrals;
    const link = page.getByRole("link", { name: "Job card (PDF)" });
    await link.waitFor();
    await screenshot(page, "reports-work-order-page");
    const { name, bytes } = await downloadFrom(() => link.click(), "reports-job-card.pdf");
    expect(name).toBe(`${detail.workOrder.number}-job-card.pdf`);
    const { all } = await readPdf(bytes);
    expect(all).toContain(detail.workOrder.number);
    expect(all).toContain(detail.workOrder.title);
    for (const step of detail.routine?.checklist ?? []) expect(all.replace(/\s+/g, "")).toContain(step.replace(/\s+/g, ""));
    expect(all).toContain("Approved by the chief engineer");
  });

  it("downloads the vessel's survey and audit report for a period from the Backlog", async () => {
    await page.goBack();
    await page.waitForURL(/\/backlog/);
    const form = page.getByRole("region", { name: "Survey and audit report" });
    await form.scrollIntoViewIfNeeded();
    await screenshot(page, "reports-backlog-survey-form");
    const { name, bytes } = await downloadFrom(() => form.getByRole("button", { name: "Survey report (PDF)" }).click(), "reports-survey.pdf");
    expect(name).toMatch(/^survey-report-[A-Z]+-\d{4}-\d{2}-\d{2}-\d{4}-\d{2}-\d{2}\.pdf$/);
    const { all } = await readPdf(bytes);
    expect(all).toContain("SURVEY AND AUDIT REPORT");
    expect(all).toContain("Aster Gale");
    expect(all).toContain("Readings coverage");
  });
});
