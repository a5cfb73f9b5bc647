// The demo second engineer keeps the engine store: finds the critical spares under their minimum,
// receives a delivery (refused half a tube first), and is refused taking more off a shelf than is
// recorded there, with nothing changed.
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

const row = (number: string) => page.locator("tbody tr").filter({ has: page.getByText(number, { exact: true }) });
const onBoard = async (number: string) => Number(((await row(number).locator("td").nth(1).textContent()) ?? "").trim().split(" ")[0]);

describe("the stores on board", () => {
  it("shows what is on board and which critical spares are under their minimum", async () => {
    await signInThroughForm(page, "second@brightwater.example", DEMO_PASSWORD);
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/hour-log$/);
    await page.getByRole("navigation", { name: "Vessel sections" }).getByRole("link", { name: "Stores" }).click();
    await page.getByRole("heading", { name: "Stores on board" }).waitFor();
    await expect.poll(() => page.locator("tbody tr").count(), { timeout: 15_000 }).toBeGreaterThan(10);
    await screenshot(page, "stores");
    await page.getByLabel("Only under the minimum").check();
    const low = await page.locator("tbody tr").count();
    expect(low).toBeGreaterThan(0);
    expect(await page.locator("tbody tr").filter({ hasText: /under the minimum of/ }).count()).toBe(low);
    await page.getByLabel("Only under the minimum").uncheck();
  });

  it("receives a delivery, refusing half a tube first", async () => {
    const before = await onBoard("BW-1040");
    await page.getByRole("button", { name: "Receive BW-1040" }).click();
    const panel = page.getByRole("dialog", { name: "Receive parts" });
    await panel.getByLabel(/^Quantity/).fill("2.5");
    await panel.getByRole("button", { name: "Receive" }).click();
    await expect.poll(() => panel.getByText("This part is counted in whole pieces; enter a whole number.").count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, "stores-half-tube");
    await panel.getByLabel(/^Quantity/).fill("4");
    await panel.getByLabel("Remark").fill("Delivered in port");
    await panel.getByRole("button", { name: "Receive" }).click();
    await expect.poll(() => page.getByText(/^BW-1040 Liquid gasket sealant, 100 ml tube: \d+ pcs on board now\.$/).count(), { timeout: 10_000 }).toBe(1);
    await expect.poll(() => onBoard("BW-1040")).toBe(before + 4);
  });

  it("is refused moving more than a shelf holds, and nothing changes", async () => {
    const before = await onBoard("BW-1003");
    await page.getByRole("button", { name: "Move BW-1003" }).click();
    const panel = page.getByRole("dialog", { name: "Move parts" });
    await panel.getByLabel("To").selectOption({ label: "Workshop" });
    await panel.getByLabel(/^Quantity/).fill(String(before + 5));
    await panel.getByRole("button", { name: "Move" }).click();
    await expect.poll(() => panel.getByText(/If more is on the shelf, count it first/).count(), { timeout: 10_000 }).toBe(1);
    await screenshot(page, "stores-refused");
    await panel.getByRole("button", { name: "Cancel" }).click();
    expect(await onBoard("BW-1003")).toBe(before);
  });
});
