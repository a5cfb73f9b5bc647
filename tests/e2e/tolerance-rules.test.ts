// The demo administrator keeps the company's tolerance rules. The other browser tests read work-order
// states that these rules decide, so every change here is to a rule no demo routine falls under
// (the five-year preset, and a rule of its own beyond every demo interval), and the test ends
// with the rules exactly as it found them.
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { AdminToleranceRule, AdminToleranceRuleList } from "@/server/tolerance/contract";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let found: Omit<AdminToleranceRule, "id">[] = [];

const RENEWAL = "Five years and more: 3 months before, none after";
const ANNUAL = "Annual: 3 months either side of the anniversary";
const HOURS = "Running hours: 10 % before, 5 % after, at most 500 h";
// A name of its own, so that a second run against the same database does not clash with the first.
const NEW_RULE = `Very long hours intervals ${Date.now().toString(36)}`;

/** The company's rules as the route sends them, ids left out: a deleted and restored preset has a new id. */
async function storedRules(): Promise<Omit<AdminToleranceRule, "id">[]> {
  const response = await page.request.get(`${BASE_URL}/api/admin/tolerance-rules`);
  expect(response.status()).toBe(200);
  const { rules } = (await response.json()) as AdminToleranceRuleList;
  return rules.map(({ id: _id, ...rule }) => rule);
}

const table = (heading: string): Locator => page.getByRole("region", { name: heading });
const rowOf = (name: string): Locator =>
  page.locator("tbody tr").filter({ has: page.getByRole("rowheader", { name }) });
/** The row's cells after its name, the buttons left out. */
const cells = async (row: Locator) => (await row.locator("td:not(:last-child)").allTextContents()).map((t) => t.trim());
const panel = (name: string | RegExp): Locator => page.getByRole("dialog", { name });
const preview = (form: Locator) =>
  form.locator("[aria-live=polite]").filter({ hasText: "In plain words" }).locator("p").nth(1);
const states = (form: Locator) =>
  form.locator("[aria-live=polite]").filter({ hasText: "In plain words" }).locator("p").nth(2);

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

describe("the demo administrator keeps the tolerance rules", () => {
  it("opens Company → Tolerance rules and reads the presets in plain words", async () => {
    await signInThroughForm(page, "admin@brightwater.example", DEMO_PASSWORD);
    found = await storedRules();
    await page.getByRole("navigation", { name: "Company" }).getByRole("link", { name: "Company" }).click();
    await page.getByRole("link", { name: "Tolerance rules" }).click();
    await page.waitForURL(/\/admin\/tolerance-rules$/);
    await page.getByRole("heading", { name: "Calendar intervals" }).waitFor();

    // Each preset as a person reads it: what it matches, the window, the grace, the cap.
    // The annual survey preset: HSSC's 3 months either side of the anniversary, all of it on time
    // (IMO Res. A.1104(29) 4.2.1; presets.ts).
    expect(await cells(rowOf(ANNUAL))).toEqual(["calendar intervals of 301–500 days", "3 months", "3 months", "yes", "yes"]);
    expect(await cells(rowOf(RENEWAL))).toEqual(["calendar intervals of 1,201–36,525 days", "3 months", "none", "yes", "no"]);
    expect(await cells(rowOf(HOURS))).toEqual([
      "running-hours intervals of 0–1,000,000 h",
      "10 % of the interval",
      "5 % of the interval",
      "500 h",
      "no",
    ]);
    expect(await table("Calendar intervals").locator("tbody tr").count()).toBe(
      found.filter((r) => r.kind === "calendar").length,
    );
    expect(await table("Running-hours intervals").locator("tbody tr").count()).toBe(
      found.filter((r) => r.kind === "hours").length,
    );
    await screenshot(page, "tolerance-rules");
  });

  it("edits the grace of the five-year preset, seeing the plain words change before saving, then puts it back", async () => {
    await page.getByRole("button", { name: `Edit ${RENEWAL}` }).click();
    const form = panel(`Edit “${RENEWAL}”`);
    await form.waitFor();
    expect(await preview(form).textContent()).toBe(
      "Opens 3 months before the due date; out of tolerance as soon as it is past due; an early completion moves the anniversary, one inside the window keeps it.",
    );
    await form.getByLabel("Grace after the due point").fill("1");
    await expect
      .poll(() => preview(form).textContent())
      .toBe(
        "Opens 3 months before the due date; out of tolerance 1 month after; an early completion moves the anniversary, one inside the window keeps it.",
      );
    // What each state means under the rule, said beside it.
    expect(await states(form).textContent()).toBe(
      "States: scheduled until the window opens; window open from 3 months before the due date to the due date; late for 1 month after it; out of tolerance from the day after.",
    );
    // The range is said in words too.
    expect(await form.getByText("Applies to calendar intervals of 1,201–36,525 days.").count()).toBe(1);
    await screenshot(page, "tolerance-rules-edit-preview");
    await form.getByRole("button", { name: "Save rule" }).click();
    await expect
      .poll(() => page.getByText(`“${RENEWAL}” saved; the Backlog follows within a minute.`).count(), {
        timeout: 15_000,
      })
      .toBe(1);
    expect((await cells(rowOf(RENEWAL)))[2]).toBe("1 month");

    // Back as it was.
    await page.getByRole("button", { name: `Edit ${RENEWAL}` }).click();
    await panel(`Edit “${RENEWAL}”`).getByLabel("Grace after the due point").fill("0");
    await panel(`Edit “${RENEWAL}”`).getByRole("button", { name: "Save rule" }).click();
    await expect.poll(async () => (await cells(rowOf(RENEWAL)))[2], { timeout: 15_000 }).toBe("none");
    expect(await storedRules()).toEqual(found);
  });

  it("is told plainly when the smallest interval is above the largest, and nothing is saved", async () => {
    await page.getByRole("button", { name: `Edit ${RENEWAL}` }).click();
    const form = panel(`Edit “${RENEWAL}”`);
    await form.getByLabel("Smallest interval (days)").fill("2000");
    await form.getByLabel("Largest interval (days)").fill("1500");
    await form.getByRole("button", { name: "Save rule" }).click();
    const largest = form.getByLabel("Largest interval (days)");
    await expect.poll(() => largest.getAttribute("aria-invalid")).toBe("true");
    expect(await form.locator("#rule-maxInterval-error").textContent()).toBe(
      "The largest interval cannot be below the smallest.",
    );
    await screenshot(page, "tolerance-rules-min-above-max");
    await form.getByRole("button", { name: "Close" }).click();
    expect(await storedRules()).toEqual(found);
    expect((await cells(rowOf(RENEWAL)))[0]).toBe("calendar intervals of 1,201–36,525 days");
  });

  it("adds a running-hours rule of its own, then deletes it", async () => {
    await table("Running-hours intervals").getByRole("button", { name: "Add running-hours rule" }).click();
    const form = panel("Add a tolerance rule");
    await form.getByLabel("Name").fill(NEW_RULE);
    expect(await form.getByLabel("Kind of interval").inputValue()).toBe("hours");
    // Beyond every demo interval (the longest is 24,000 h), so no work order changes state.
    await form.getByLabel("Smallest interval (hours)").fill("50000");
    await form.getByLabel("Largest interval (hours)").fill("100000");
    await form.getByLabel("Window before the due point").fill("5");
    await form.getByLabel("Window unit").selectOption({ label: "% of the interval" });
    await form.getByLabel("Grace after the due point").fill("250");
    await form.getByLabel("Cap (hours, optional)").fill("1000");
    // Worked example: 5 % of 50,000–100,000 h is 2,500–5,000 h, so the 1,000 h cap always holds.
    await expect
      .poll(() => preview(form).textContent())
      .toBe(
        "Opens 5 % of the interval, at most 1,000 h before the due hours; out of tolerance 250 h after; every completion moves the anniversary, even one inside the window.",
      );
    await form.getByRole("button", { name: "Add rule" }).click();
    await expect.poll(() => page.getByText(`“${NEW_RULE}” added.`).count(), { timeout: 15_000 }).toBe(1);
    expect(await cells(rowOf(NEW_RULE))).toEqual([
      "running-hours intervals of 50,000–100,000 h",
      "5 % of the interval",
      "250 h",
      "1,000 h",
      "no",
    ]);
    await screenshot(page, "tolerance-rules-added");

    await page.getByRole("button", { name: `Delete ${NEW_RULE}` }).click();
    const confirm = panel(`Delete “${NEW_RULE}”?`);
    expect(await confirm.textContent()).toContain("without a rule a work order has no window and no grace");
    await confirm.getByRole("button", { name: "Delete rule" }).click();
    await expect.poll(() => page.getByText(`“${NEW_RULE}” is deleted.`).count(), { timeout: 15_000 }).toBe(1);
    expect(await rowOf(NEW_RULE).count()).toBe(0);
    expect(await storedRules()).toEqual(found);
  });

  it("restores a deleted preset with its own figures", async () => {
    await page.getByRole("button", { name: "Restore the presets" }).click();
    await expect
      .poll(() => page.getByText("Every preset is there already; nothing was added.").count(), { timeout: 15_000 })
      .toBe(1);

    // The five-year preset governs no demo routine: deleting it for a moment moves no state.
    await page.getByRole("button", { name: `Delete ${RENEWAL}` }).click();
    await panel(`Delete “${RENEWAL}”?`).getByRole("button", { name: "Delete rule" }).click();
    await expect.poll(() => rowOf(RENEWAL).count(), { timeout: 15_000 }).toBe(0);
    await page.getByRole("button", { name: "Restore the presets" }).click();
    await expect.poll(() => page.getByText(`Restored 1 preset: ${RENEWAL}.`).count(), { timeout: 15_000 }).toBe(1);
    expect(await cells(rowOf(RENEWAL))).toEqual(["calendar intervals of 1,201–36,525 days", "3 months", "none", "yes", "no"]);
    await screenshot(page, "tolerance-rules-restored");
    // As found: the same rules with the same figures, in the same order.
    expect(await storedRules()).toEqual(found);
  });

  it("reads well at night on a tablet", async () => {
    await page
      .getByRole("button", { name: /Day|Night/ })
      .first()
      .click();
    expect(await page.evaluate(() => document.documentElement.classList.contains("dark"))).toBe(true);
    await page.setViewportSize({ width: 820, height: 1180 });
    await screenshot(page, "tolerance-rules-night-tablet");
    await page.getByRole("button", { name: `Edit ${ANNUAL}` }).click();
    await panel(`Edit “${ANNUAL}”`).waitFor();
    // Class counts the whole window on time (HSSC, IMO Res. A.1104(29) 4.2.1): no late under it.
    expect(await panel(`Edit “${ANNUAL}”`).getByLabel("The whole window counts as on time (class surveys)").isChecked()).toBe(true);
    expect(await states(panel(`Edit “${ANNUAL}”`)).textContent()).toBe(
      "States: scheduled until the window opens; window open — on time — from 3 months before the due date to 3 months after the due date; out of tolerance from the day after. Late only past a date agreed in a deferral.",
    );
    await screenshot(page, "tolerance-rules-edit-night-tablet");
    await panel(`Edit “${ANNUAL}”`).getByRole("button", { name: "Close" }).click();
    await page
      .getByRole("button", { name: /Day|Night/ })
      .first()
      .click();
    expect(await storedRules()).toEqual(found);
  });
});
