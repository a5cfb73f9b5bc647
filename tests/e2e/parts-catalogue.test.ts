// The demo chief engineer says which components a part fits from the Parts page: picks Aster Gale's
// fuel oil purifier for the purifier O-ring kit, saves, sees it listed, then takes it off again.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

beforeAll(async () => {
  ({ browser, page } = await openPage({ width: 1440, height: 900 }));
});
afterAll(async () => {
  await browser?.close();
});

const row = () => page.locator("tbody tr").filter({ has: page.getByText("BW-1020", { exact: true }) });

describe("the components a part fits", () => {
  it("are chosen from a vessel's register and saved with the part", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("navigation", { name: "Company" }).getByRole("link", { name: "Parts" }).click();
    await row().waitFor();
    await page.getByRole("button", { name: "Edit BW-1020" }).click();
    const panel = page.getByRole("dialog", { name: "Edit BW-1020" });
    await panel.getByLabel("Vessel of the components").selectOption({ label: "Aster Gale" });
    await panel.getByLabel("Find a component by code or name").fill("PU.FO");
    await panel.getByRole("checkbox", { name: /^PU\.FO\.1 / }).check();
    expect(await panel.getByRole("list", { name: "Components it fits" }).getByText("AG PU.FO.1", { exact: true }).count()).toBe(1);
    await screenshot(page, "part-fits");
    await panel.getByRole("button", { name: "Save part" }).click();
    await page.getByText("BW-1020 saved.").waitFor({ timeout: 10_000 });
    await expect.poll(() => row().textContent()).toContain("AG PU.FO.1");
  });

  it("are taken off again with the chip's remove button", async () => {
    await page.getByRole("button", { name: "Edit BW-1020" }).click();
    const panel = page.getByRole("dialog", { name: "Edit BW-1020" });
    await panel.getByRole("button", { name: "Remove AG PU.FO.1" }).click();
    await panel.getByRole("button", { name: "Save part" }).click();
    await page.getByText("BW-1020 saved.").waitFor({ timeout: 10_000 });
    await expect.poll(() => row().textContent()).not.toContain("PU.FO.1");
  });
});
