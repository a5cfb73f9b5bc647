// Accessibility of every page of the demo, in the day and the night theme: axe-core finds no serious
// or critical violation of WCAG 2.0–2.2 A/AA (tags wcag2a … wcag22aa, which also switch on axe's
// target-size rule, off by default) nor of its best practices. On the Backlog and the Hour log a
// check of our own goes further than axe: no control smaller than 24 × 24 CSS px at all (WCAG 2.2
// SC 2.5.8; axe lets a small target pass when it has room around it, a tablet in a moving ship does
// not), links inside running text excepted as the SC does.
import { AxeBuilder } from "@axe-core/playwright";
import type { Result } from "axe-core";
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { BASE_URL, launchBrowser, screenshot, signInThroughForm } from "../support/browser";
import { closeTestDb, testDb } from "../support/fixtures";
import { type DemoIds, demoIds, PAGES, pageRoutesInApp, type Visitor } from "./a11y-pages";

const THEMES = ["day", "night"] as const;
type Theme = (typeof THEMES)[number];
const AXE_TAGS = ["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22a", "wcag22aa", "best-practice"];
const BLOCKING = new Set(["serious", "critical"]);
/** Pages whose look is checked by eye in the screenshots (the test output folder). */
const PICTURED = new Set(["/vessels/[vesselId]/backlog", "/vessels/[vesselId]/calendar"]);
/** Pages where every control must be at least 24 × 24 px (the issue's tablet complaint). */
const MEASURED = new Set(["/vessels/[vesselId]/backlog", "/vessels/[vesselId]/hour-log"]);

let browser: Browser;
let ids: DemoIds;
const pages = new Map<Visitor, Promise<{ context: BrowserContext; page: Page }>>();

beforeAll(async () => {
  browser = await launchBrowser();
  ids = await demoIds(testDb());
});
afterAll(async () => {
  for (const opened of pages.values()) await (await opened).context.close();
  await browser?.close();
  await closeTestDb();
});

/** One signed-in tab per visitor, shared by that visitor's pages (one sign-in each). */
function pageOf(visitor: Visitor): Promise<{ context: BrowserContext; page: Page }> {
  let opened = pages.get(visitor);
  if (!opened) {
    opened = (async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, colorScheme: "light" });
      const page = await context.newPage();
      if (visitor !== "anonymous") await signInThroughForm(page, visitor, DEMO_PASSWORD);
      return { context, page };
    })();
    pages.set(visitor, opened);
  }
  return opened;
}

/** As the theme toggle does it (app/_components/theme-toggle.tsx), then the colour transitions end. */
async function switchTheme(page: Page, theme: Theme): Promise<void> {
  await page.evaluate(async (dark) => {
    document.documentElement.classList.toggle("dark", dark);
    localStorage.setItem("keelson-theme", dark ? "dark" : "light");
    const transitions = document.getAnimations().filter((a) => a instanceof CSSTransition);
    await Promise.all(transitions.map((a) => a.finished.catch(() => undefined)));
  }, theme === "night");
}

/** Opens the page and waits until its data is drawn: no skeleton left (`aria-busy`). */
async function open(page: Page, url: string, ready = "h1"): Promise<void> {
  const response = await page.goto(url, { waitUntil: "networkidle" });
  expect(response?.status(), url).toBe(200);
  await page.locator(ready).first().waitFor();
  await page.waitForFunction(() => document.querySelectorAll('[aria-busy="true"]').length === 0);
}

/**
 * Every rule by day; by night only colour contrast, the one thing a theme changes (and the slowest
 * rule, so the night pass stays short). A caught message's HTML (Company → Mail) sits in an iframe
 * with an empty sandbox, on purpose: axe cannot run inside it, and that markup is the mail's, not a page.
 */
function axe(page: Page, theme: Theme): AxeBuilder {
  const builder = new AxeBuilder({ page }).exclude('iframe[sandbox=""]');
  return theme === "day" ? builder.withTags(AXE_TAGS) : builder.withRules(["color-contrast"]);
}

function describeViolations(violations: Result[]): string[] {
  return violations.flatMap((v) =>
    v.nodes.map((node) => `${v.impact} ${v.id}: ${node.target.join(" ")} — ${v.help} (${node.failureSummary ?? ""})`),
  );
}

/** Controls smaller than 24 × 24 CSS px, as "tag 'name' w×h". Hidden and screen-reader-only ones are left out. */
function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const selector =
      'a[href], button, input:not([type="hidden"]), select, textarea, summary, [role="button"], [role="checkbox"], [role="tab"], [role="link"], [tabindex]:not([tabindex="-1"])';
    const insideText = (el: Element) => {
      // SC 2.5.8's "inline" exception: a link in a sentence keeps the line's height.
      if (el.tagName !== "A" || getComputedStyle(el).display !== "inline") return false;
      const parent = el.parentElement;
      return !!parent && (parent.textContent ?? "").trim().length > (el.textContent ?? "").trim().length;
    };
    return [...document.querySelectorAll(selector)].flatMap((el) => {
      const box = el.getBoundingClientRect();
      const style = getComputedStyle(el);
      const shown = box.width > 1 && box.height > 1 && style.visibility !== "hidden" && !el.closest("[inert]");
      if (!shown || insideText(el) || (box.width >= 24 && box.height >= 24)) return [];
      const label = (el.getAttribute("aria-label") ?? el.textContent ?? "").trim().slice(0, 40);
      const kind = el.getAttribute("type") ?? el.getAttribute("role") ?? "";
      return [
        `${el.tagName.toLowerCase()}${kind ? `[${kind}]` : ""} '${label}' ${box.width.toFixed(0)}×${box.height.toFixed(0)}`,
      ];
    });
  });
}

describe("accessibility of every page, day and night", () => {
  it("lists every page of app/ with who opens it and its ids", () => {
    const routes = pageRoutesInApp();
    expect(routes.length).toBeGreaterThan(10);
    // A new page is missing here until it is added to PAGES in a11y-pages.ts.
    expect(routes.filter((route) => !(route in PAGES))).toEqual([]);
    // …and a page that was removed leaves no stale entry behind.
    expect(Object.keys(PAGES).filter((route) => !routes.includes(route))).toEqual([]);
  });

  for (const [route, entry] of Object.entries(PAGES)) {
    it(`${route} (${entry.as}): no serious or critical axe violation`, async () => {
      const { page } = await pageOf(entry.as);
      const url = `${BASE_URL}${entry.path(ids)}`;
      await open(page, url, entry.ready);
      const found: string[] = [];
      for (const theme of THEMES) {
        await switchTheme(page, theme);
        const result = await axe(page, theme).analyze();
        const blocking = result.violations.filter((v) => BLOCKING.has(v.impact ?? ""));
        found.push(...describeViolations(blocking).map((line) => `${theme}: ${line}`));
        if (PICTURED.has(route)) await screenshot(page, `a11y-${route.split("/").at(-1)}-${theme}`);
        // Sizes are the same in both themes: measured once.
        if (MEASURED.has(route) && theme === "day")
          found.push(...(await smallTargets(page)).map((t) => `under 24×24 px: ${t}`));
      }
      await switchTheme(page, "day");
      expect(found, `${url}\n${found.join("\n")}`).toEqual([]);
    });
  }
});
