// The demo administrator gives a rank the company's own name, and the pages use it. The other
// browser tests read rank words, so the test ends with Keelson's words back.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { AdminVesselList } from "@/server/admin/contract";
import type { RoutineList } from "@/server/routines/contract";
import type { RankNamesView } from "@/server/routines/rank-names";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;

const stored = async () => {
  const res = await page.request.get(`${BASE_URL}/api/admin/rank-names`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as RankNamesView).ranks.filter((r) => r.name).map((r) => [r.rank, r.name]);
};
const section = () => page.getByRole("region", { name: "Rank names" });

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  // Keelson's words back, whatever happened above.
  await page?.request.put(`${BASE_URL}/api/admin/rank-names`, { data: {}, headers: { origin: BASE_URL } });
  await browser?.close();
});

describe("the company names its ranks", () => {
  it("is told when a name is another rank's, and nothing is saved", async () => {
    await signInThroughForm(page, "admin@brightwater.example", DEMO_PASSWORD);
    expect(await stored()).toEqual([]);
    await page.getByRole("navigation", { name: "Company" }).getByRole("link", { name: "Company" }).click();
    await page.getByRole("link", { name: "Settings" }).click();
    await section().waitFor();
    await section().getByLabel("Motorman").fill("Oiler");
    await section().getByRole("button", { name: "Save names" }).click();
    const motorman = section().getByLabel("Motorman");
    await expect.poll(() => motorman.getAttribute("aria-invalid")).toBe("true");
    expect(await section().locator("#rank-name-motorman-error").textContent()).toBe(
      "“Oiler” is already the name of oiler: give each rank its own name.",
    );
    await screenshot(page, "rank-names-refused");
    expect(await stored()).toEqual([]);
  });

  it("saves “Wiper” for the motorman, and the Routines page writes the teams with it", async () => {
    await section().getByLabel("Motorman").fill("Wiper");
    await section().getByRole("button", { name: "Save names" }).click();
    await expect
      .poll(() => section().getByText("Saved: 1 rank under the company’s own name.").count(), { timeout: 15_000 })
      .toBe(1);
    expect(await stored()).toEqual([["motorman", "Wiper"]]);
    await screenshot(page, "rank-names-saved");

    // A demo vessel with a motorman in some routine's team.
    const { vessels } = (await (await page.request.get(`${BASE_URL}/api/admin/vessels`)).json()) as AdminVesselList;
    let vesselId: string | undefined;
    for (const v of vessels) {
      const list = (await (await page.request.get(`${BASE_URL}/api/vessels/${v.id}/routines`)).json()) as RoutineList;
      if (list.routines?.some((r) => r.team.some((t) => t.rank === "motorman"))) vesselId ??= v.id;
    }
    expect(vesselId).toBeDefined();
    await page.goto(`${BASE_URL}/vessels/${vesselId}/routines`);
    const teams = page.locator("tbody td").filter({ hasText: /wiper/i });
    await expect.poll(() => teams.count(), { timeout: 15_000 }).toBeGreaterThan(0);
    expect(
      await page
        .locator("tbody td")
        .filter({ hasText: /motorman/i })
        .count(),
    ).toBe(0);
    await screenshot(page, "rank-names-routines");
  });

  it("gives the rank back Keelson's word when the name is cleared", async () => {
    await page.goto(`${BASE_URL}/admin/settings`);
    // A field emptied before the form has hydrated is set back to the stored name when it does;
    // empty it until the form knows it was changed.
    const save = section().getByRole("button", { name: "Save names" });
    await expect
      .poll(
        async () => {
          await section().getByLabel("Motorman").fill("");
          return save.count();
        },
        { timeout: 15_000 },
      )
      .toBe(1);
    await save.click();
    await expect
      .poll(() => section().getByText("Saved: every rank under Keelson’s word.").count(), { timeout: 15_000 })
      .toBe(1);
    expect(await stored()).toEqual([]);
  });
});
