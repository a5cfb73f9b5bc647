// The demo chief engineer names the parts a routine needs on the Routines page: the demo's piston
// overhaul already takes a ring set, an O-ring set and sealant; the chief adds fuel valve nozzles, is
// refused half a nozzle, and saves.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

const TITLE = "Cylinder unit 3: piston overhaul and liner gauging";

describe("the parts a routine needs", () => {
  it("are chosen from the catalogue with their quantities, and a half piece is refused", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    // The chief engineer sails with two vessels: the Vessels page comes first.
    await page.locator("main li").filter({ hasText: "Aster Gale" }).getByRole("link", { name: "Hour log" }).click();
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Routines" }).click();
    await page.getByLabel("Search routines").fill("piston overhaul");
    await page.getByRole("button", { name: `Parts for ${TITLE}` }).first().click();
    const panel = page.getByRole("dialog", { name: "Parts it needs" });
    await expect.poll(() => panel.getByLabel("Part 1", { exact: true }).inputValue(), { timeout: 15_000 }).not.toBe("");
    const before = await panel.locator("select").count();
    await panel.getByRole("button", { name: "Add a part" }).click();
    const next = before + 1;
    await panel.getByLabel(`Part ${next}`, { exact: true }).selectOption({ label: "BW-1003 — Fuel valve nozzle" });
    await panel.getByLabel(/^Quantity/).nth(next - 1).fill("1.5");
    await panel.getByRole("button", { name: "Save parts" }).click();
    await expect.poll(() => panel.getByText("This part is counted in whole pieces; enter a whole number.").count(), { timeout: 10_000 }).toBe(1);
    expect(await panel.getByText("Nothing was saved: correct the rows marked.").count()).toBe(1);
    await panel.getByLabel(/^Quantity/).nth(next - 1).fill("2");
    await panel.getByRole("button", { name: "Save parts" }).click();
    await expect.poll(() => page.getByText(new RegExp(`^${TITLE} needs ${next} parts each time`)).count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, "routine-parts-saved");
  });
});
