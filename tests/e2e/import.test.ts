// The demo chief engineer imports a small plan into Aster Gale from the Machinery register: downloads
// the example, uploads files with a mistake, reads the preview's problem with its file, row and
// column, fixes the file, applies it, and finds the new routine's work in the Backlog. The codes are
// made per run, so a second run against the same database imports new rows rather than none.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { RoutineList } from "@/server/routines/contract";
import { BASE_URL, openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let vesselId = "";
const run = Date.now().toString(36).toUpperCase();
const CODE = `BW.${run}`;

const components = `code,name,parent,critical\n${CODE},Ballast water treatment unit ${run},,yes\n${CODE}.UV,UV reactor,${CODE},no\n`;
const routines = (every: string) =>
  [
    "code,component,title,every,team,elapsed_hours,critical,checklist",
    `${CODE}.UV/LAMP,${CODE}.UV,UV lamp check ${run},${every},third engineer,1,yes,Isolate the unit | Check lamp hours`,
  ].join("\n");
const lastDone = `routine,done_on\n${CODE}.UV/LAMP,2026-06-01\n`;
const asFile = (name: string, text: string) => ({ name, mimeType: "text/csv", buffer: Buffer.from(text) });

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  // The other browser tests read Aster Gale's Backlog and port stays: the imported routine is
  // retired again (its open work order goes with it); the two components stay, harmless.
  if (page && vesselId) {
    const list = await page.request.get(`${BASE_URL}/api/vessels/${vesselId}/routines?q=${encodeURIComponent(run)}`);
    const { routines } = (await list.json()) as RoutineList;
    for (const r of routines) {
      await page.request.delete(`${BASE_URL}/api/vessels/${vesselId}/routines/${r.id}`, { headers: { origin: BASE_URL } });
    }
  }
  await browser?.close();
});

describe("the chief engineer imports a plan from files", () => {
  it("opens the import from the Machinery register and reads the layout", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    // The chief engineer sails with two vessels: the Vessels page comes first.
    await page.locator("main li").filter({ hasText: "Aster Gale" }).getByRole("link", { name: "Machinery register" }).click();
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/register$/);
    await page.getByRole("link", { name: "Import from files" }).click();
    await page.waitForURL(/\/register\/import$/);
    await page.getByRole("heading", { name: /^Import Aster Gale’s plan from files$/ }).waitFor();
    await page.locator("summary").filter({ hasText: /^routines — / }).click();
    const example = await page.request.get(
      `${BASE_URL}${await page.getByRole("link", { name: "Example routines.csv" }).getAttribute("href")}`,
    );
    expect(example.status()).toBe(200);
    expect((await example.text()).split("\r\n")[0]).toMatch(/^\uFEFFcode,component,title,every_hours,every,rrule/);
  });

  it("uploads files with a mistake and reads the problem by file, row and column", async () => {
    await page.getByLabel(/The plan’s files/).setInputFiles([
      asFile("components.csv", components),
      asFile("routines.csv", routines("every 3 mnths")),
      asFile("last-done.csv", lastDone),
    ]);
    await page.getByRole("button", { name: "Check the files" }).click();
    await page.getByRole("heading", { name: "What the import would do" }).waitFor({ timeout: 30_000 });
    const problem = page.locator("[data-import-problem]");
    await expect.poll(() => problem.count()).toBe(1);
    expect((await problem.locator("td").allTextContents()).map((t) => t.trim())).toEqual([
      "routines.csv",
      "2",
      "every",
      "“every 3 mnths” is not a rule Keelson reads — try “every 3 months”.",
    ]);
    expect(await page.getByRole("button", { name: "Apply the import" }).count()).toBe(0);
    await screenshot(page, "import-problem");
  });

  it("checks what copying the sister ship's plan would do, without copying it", async () => {
    const copy = page.getByRole("region", { name: "Copy the plan of a sister ship" });
    await copy.getByLabel("Copy from").selectOption({ label: "Corran Ness" });
    await copy.getByRole("button", { name: "Check the copy" }).click();
    await copy.getByRole("heading", { name: "What the copy would do" }).waitFor({ timeout: 30_000 });
    expect(await copy.getByText("From: the plan of Corran Ness").count()).toBe(1);
    // Corran Ness's routines are all new here; nothing is written until "Copy the plan".
    const routinesNew = Number((await copy.getByRole("row", { name: /^Routines/ }).locator("td").first().textContent()) ?? "0");
    expect(routinesNew).toBeGreaterThan(0);
    expect(await copy.getByRole("button", { name: "Copy the plan" }).count()).toBeLessThanOrEqual(1);
    await screenshot(page, "import-copy-preview");
  });

  it("fixes the file, sees what would be created, applies it, and finds the work in the Backlog", async () => {
    await page.getByLabel(/The plan’s files/).setInputFiles([
      asFile("components.csv", components),
      asFile("routines.csv", routines("every 3 months")),
      asFile("last-done.csv", lastDone),
    ]);
    await page.getByRole("button", { name: "Check the files" }).click();
    const preview = page.getByRole("region", { name: "What the import would do" });
    await preview.getByText("No problems: every row reads.").waitFor({ timeout: 30_000 });
    const row = (kind: string) => preview.getByRole("row", { name: new RegExp(`^${kind}`) }).locator("td");
    expect((await row("Components").allTextContents()).slice(0, 2)).toEqual(["2", "0"]);
    expect((await row("Routines").allTextContents()).slice(0, 2)).toEqual(["1", "0"]);
    await screenshot(page, "import-preview");
    await preview.getByRole("button", { name: "Apply the import" }).click();
    await page.getByText(/^Imported: 2 components, 0 counters and 1 routine created/).waitFor({ timeout: 30_000 });
    await page.getByRole("heading", { name: "Earlier imports" }).waitFor();
    await screenshot(page, "import-applied");

    // The worker plans the new routine; the Backlog finds its work order by the title.
    await page.getByRole("link", { name: "Open the Backlog" }).click();
    await page.waitForURL(/\/backlog/);
    vesselId = /\/vessels\/([0-9a-f-]+)\//.exec(page.url())![1]!;
    const q = encodeURIComponent(`UV lamp check ${run}`);
    // The worker's recompute, not the page: on a loaded machine a queued run can take a while.
    await expect
      .poll(
        async () => {
          const res = await page.request.get(`${BASE_URL}/api/vessels/${vesselId}/backlog?q=${q}`);
          return ((await res.json()) as { items: unknown[] }).items.length;
        },
        { timeout: 60_000, interval: 1_000 },
      )
      .toBe(1);
    await page.goto(`${BASE_URL}/vessels/${vesselId}/backlog?q=${q}`);
    await page.locator("tbody tr").filter({ hasText: `UV lamp check ${run}` }).waitFor();
    await screenshot(page, "import-in-backlog");
  });
});
