// The app passes its own Content-Security-Policy: the demo's main pages, opened by the people who
// use them, report no CSP violation, neither in the console nor as a `securitypolicyviolation`
// event. The last test shows the policy is in force and its refusals are heard (a foreign image is
// refused and reported), so a silent page kept to the policy; the policy was not missing.
import { and, asc, eq } from "drizzle-orm";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import { DEMO_COMPANY_SLUG } from "@/server/auth/demo-company";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { BASE_URL, launchBrowser, screenshot, signInThroughForm } from "../support/browser";
import { closeTestDb, testDb } from "../support/fixtures";

let browser: Browser;
let vesselUrl = "";
let workOrderUrl = "";
let stayUrl = "";

beforeAll(async () => {
  browser = await launchBrowser();
  const db = testDb();
  const [vessel] = await db
    .select({ id: s.vessel.id })
    .from(s.vessel)
    .innerJoin(s.company, eq(s.company.id, s.vessel.companyId))
    .where(and(eq(s.company.slug, DEMO_COMPANY_SLUG), eq(s.vessel.code, "AG")));
  vesselUrl = `${BASE_URL}/vessels/${vessel!.id}`;
  const [workOrder] = await db
    .select({ id: s.workOrder.id })
    .from(s.workOrder)
    .where(eq(s.workOrder.vesselId, vessel!.id))
    .limit(1);
  workOrderUrl = `${vesselUrl}/work-orders/${workOrder!.id}`;
  const [stay] = await db
    .select({ id: s.portStay.id })
    .from(s.portStay)
    .where(eq(s.portStay.vesselId, vessel!.id))
    .orderBy(asc(s.portStay.arrivesAt))
    .limit(1);
  stayUrl = `${vesselUrl}/port-stays/${stay!.id}`;
});
afterAll(async () => {
  await browser?.close();
  await closeTestDb();
});

type Watched = { context: BrowserContext; page: Page; violations: string[] };

/** A signed-in page whose CSP complaints, from the console or the event, are collected. */
async function watchedPage(email: string): Promise<Watched> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const violations: string[] = [];
  // Injected by the browser's debugging protocol, outside the page's policy: it is not itself a
  // script the policy would judge.
  await context.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      console.error(
        `securitypolicyviolation: ${e.violatedDirective} blocked ${e.blockedURI || "inline"} (${e.sourceFile}:${e.lineNumber})`,
      );
    });
  });
  const page = await context.newPage();
  page.on("console", (message) => {
    const text = message.text();
    if (/Content Security Policy|securitypolicyviolation/i.test(text)) violations.push(`${page.url()}: ${text}`);
  });
  await signInThroughForm(page, email, DEMO_PASSWORD);
  return { context, page, violations };
}

/**
 * Signs in, opens each page, lets its data load and its widgets draw (`url → selector` for a widget
 * to wait for), and returns what the policy refused.
 */
async function violationsOn(email: string, label: string, pages: [url: string, widget?: string][]): Promise<string[]> {
  const watched = await watchedPage(email);
  try {
    for (const [i, [url, widget]] of pages.entries()) {
      const response = await watched.page.goto(url, { waitUntil: "networkidle" });
      expect(response?.status(), url).toBe(200);
      expect(response?.headers()["content-security-policy"], url).toMatch(/'nonce-[^']+' 'strict-dynamic'/);
      // A hydrated page: a heading drawn and the app's scripts running (the policy let them).
      await watched.page
        .locator(widget ?? "h1")
        .first()
        .waitFor();
      await screenshot(watched.page, `csp-${label}-${i}`);
    }
    return watched.violations;
  } finally {
    await watched.context.close();
  }
}

describe("no Content-Security-Policy violation on the demo pages", () => {
  it("for the chief engineer: Hour log, Backlog, Calendar, Routines, Register, a work order, port stays", async () => {
    const violations = await violationsOn("chief@brightwater.example", "chief", [
      [`${BASE_URL}/`],
      [`${vesselUrl}/hour-log`],
      [`${vesselUrl}/backlog`],
      // FullCalendar drew its month: its injected stylesheet was let in.
      [`${vesselUrl}/calendar`, ".fc-daygrid"],
      [`${vesselUrl}/routines`],
      [`${vesselUrl}/register`],
      [workOrderUrl],
      [`${vesselUrl}/port-stays`],
      [stayUrl],
      [`${BASE_URL}/account`],
    ]);
    expect(violations).toEqual([]);
  });

  it("for the superintendent: Fleet board, the overdue list, a vessel's Backlog and a work order", async () => {
    const pages = [`${BASE_URL}/fleet`, `${BASE_URL}/fleet/overdue`, `${vesselUrl}/backlog`, workOrderUrl];
    expect(
      await violationsOn(
        "super@brightwater.example",
        "super",
        pages.map((url) => [url]),
      ),
    ).toEqual([]);
  });

  it("for the administrator: the admin pages", async () => {
    const pages = [
      "/admin",
      "/admin/people",
      "/admin/vessels",
      "/admin/tolerance-rules",
      "/admin/settings",
      "/admin/mail",
    ];
    expect(
      await violationsOn(
        "admin@brightwater.example",
        "admin",
        pages.map((p) => [`${BASE_URL}${p}`]),
      ),
    ).toEqual([]);
  });

  it("the policy is in force: an image from another origin is refused, and reported as a violation", async () => {
    const chief = await watchedPage("chief@brightwater.example");
    try {
      await chief.page.goto(`${vesselUrl}/backlog`, { waitUntil: "networkidle" });
      await chief.page.evaluate(() => {
        const probe = document.createElement("img");
        // TEST-NET-3 (RFC 5737): never a real host; img-src allows only Keelson's own origin.
        probe.src = "http://203.0.113.1/probe.png";
        document.body.append(probe);
      });
      // The console's "Refused to load the image" and the event: at least one of them.
      await expect.poll(() => chief.violations.filter((v) => v.includes("img-src")).length).toBeGreaterThan(0);
    } finally {
      await chief.context.close();
    }
  });
});
