// The chief engineer keeps a vessel's maintenance plan on the Routines page. Everything happens on
// Corran Ness's purifiers: the other browser tests count on Aster Gale (Backlog states, the
// compressor wash, the Hour log), and the routines made here are retired again at the end.
import { writeFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import type { BacklogPage } from "@/server/backlog/contract";
import type { HourLogView } from "@/server/readings/contract";
import type { RoutineList, RoutineView } from "@/server/routines/contract";
import { BASE_URL, OUTPUT, openPage, screenshot, signInThroughForm } from "../support/browser";

// The worker's recompute, not the page: on a loaded CI machine a queued run can take a while.
const WORKER_WAIT_MS = 45_000;

let browser: Browser;
let page: Page;
let vesselId = "";
// A title of its own, so that a second run against the same database finds only its own routine.
const TITLE = `Lube oil purifier: sludge port check ${Date.now().toString(36)}`;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

async function getJson<T>(url: string): Promise<{ status: number; body: T; bytes: number }> {
  const response = await page.request.get(`${BASE_URL}${url}`);
  const text = await response.text();
  return { status: response.status(), body: JSON.parse(text) as T, bytes: Buffer.byteLength(text) };
}

const listed = (q: string) => getJson<RoutineList>(`/api/vessels/${vesselId}/routines?q=${encodeURIComponent(q)}`);
const rows = () => page.locator("main tbody tr");
const rowOf = (title: string) => rows().filter({ hasText: title });
const search = () => page.getByLabel("Search routines");

/** The side panel the page opened, by its title. */
const panel = (name: string | RegExp): Locator => page.getByRole("dialog", { name });

describe("the demo chief engineer keeps Corran Ness's routines", () => {
  it("opens the Routines page, sees the list and narrows it by component and by text", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    // The chief engineer sails with two vessels: the Vessels page comes first.
    await page.locator("main li").filter({ hasText: "Corran Ness" }).getByRole("link", { name: "Hour log" }).click();
    await page.getByRole("link", { name: "Routines" }).click();
    await page.waitForURL(/\/vessels\/[0-9a-f-]+\/routines$/);
    vesselId = /\/vessels\/([0-9a-f-]+)\//.exec(page.url())![1]!;

    await rows().first().waitFor();
    for (const header of ["Component", "Routine", "Interval", "Team", "Man-hours", "Marks"]) {
      expect(await page.getByRole("columnheader", { name: header, exact: true }).count(), header).toBe(1);
    }
    const all = await rows().count();
    expect(all).toBeGreaterThan(20);
    await expect.poll(() => page.getByText(`${all} routines`, { exact: true }).count()).toBe(1);
    // The seed's lube-oil purifier routine, its interval said in words.
    const purifier = rowOf("Lube oil purifier: bowl cleaning and inspection");
    expect(await purifier.count()).toBe(1);
    expect(await purifier.textContent()).toMatch(/every [\d,]+ h/);
    await screenshot(page, "routines-list");

    // By component: the purifiers group holds both purifiers' routines and nothing else.
    await page.getByLabel("Component", { exact: true }).selectOption({ label: "PU — Purifiers" });
    await expect.poll(async () => rows().count(), { timeout: 10_000 }).toBeLessThan(all);
    const codes = await rows().locator("td:first-child span:first-child").allTextContents();
    expect(codes.length).toBeGreaterThan(0);
    expect(codes.every((c) => c.startsWith("PU."))).toBe(true);
    await page.getByLabel("Component", { exact: true }).selectOption({ label: "All components" });

    // By text: the search matches titles, codes and names.
    await search().fill("fire pump");
    await expect
      .poll(async () => (await rows().allTextContents()).every((t) => /fire pump/i.test(t)), { timeout: 10_000 })
      .toBe(true);
    expect(await rows().count()).toBeGreaterThan(0);
    await search().fill("no routine is called this");
    await expect.poll(() => page.getByText("No routines match.").count(), { timeout: 10_000 }).toBe(1);
    await search().fill("");
    await expect.poll(() => rows().count(), { timeout: 10_000 }).toBe(all);
  });

  it("is told which field is missing when the routine has no interval, and nothing is saved", async () => {
    await page.getByRole("button", { name: "Add routine" }).click();
    const form = panel("Add a routine");
    await form.waitFor();
    await form.getByLabel("Component", { exact: true }).selectOption({ label: "PU.LO.1 — Lube oil purifier" });
    await form.getByLabel("Title").fill(TITLE);
    await form.getByRole("button", { name: "Add routine" }).click();

    const hours = form.getByLabel("Running hours");
    await expect.poll(() => hours.getAttribute("aria-invalid")).toBe("true");
    // The keyboard lands on the field to correct; above the buttons, what to do next.
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("routine-hours");
    expect(await form.getByText("Nothing was saved: correct the marked field and save again.").count()).toBe(1);
    const message = form.locator("#routine-hours-error");
    expect(await message.textContent()).toBe(
      "Give the routine an interval in running hours, a calendar rule, both (whichever comes first), or tie it to every port stay.",
    );
    // The preview says the same in its own words.
    expect(await form.getByText("not yet: give running hours, a calendar rule, or both").count()).toBe(1);
    await screenshot(page, "routines-no-interval");
    expect((await listed(TITLE)).body.total).toBe(0);
  });

  it("adds the routine with running hours and a calendar rule in words, and its work order reaches the Backlog", async () => {
    const form = panel("Add a routine");
    // The baseline is where the count starts: today's reading of the purifier's own counter.
    const hourLog = await getJson<HourLogView>(`/api/vessels/${vesselId}/hour-log`);
    const counter = hourLog.body.counters.find((c) => c.name === "Lube oil purifier");
    const baseline = Math.floor(counter!.last!.totalHours);

    await form.getByLabel("Running hours").fill("2000");
    await form.getByLabel("Every N days, weeks, months or years").check();
    await form.getByLabel("Every", { exact: true }).fill("3");
    await form.getByLabel("Unit", { exact: true }).selectOption({ label: "months" });
    await expect.poll(() => form.getByText("every 2,000 h or every 3 months, whichever first").count()).toBe(1);
    // The message about the missing interval goes once there is one.
    expect(await form.getByLabel("Running hours").getAttribute("aria-invalid")).toBeNull();
    await form.getByLabel("Baseline: at counter hours").fill(String(baseline));
    // The team: a third engineer and a motorman for 1.5 h — the form says what that makes.
    await form.getByLabel("Rank, row 1", { exact: true }).selectOption({ label: "Third engineer" });
    await form.getByRole("button", { name: "Add a rank" }).click();
    await form.getByLabel("Rank, row 2", { exact: true }).selectOption({ label: "Motorman" });
    await form.getByLabel(/^Elapsed time/).fill("1.5");
    await expect.poll(() => form.getByTestId("routine-man-hours").textContent()).toBe("2 people × 1.5 h = 3 man-hours");
    await form.getByLabel("Isolation and lock-out before opening machinery").check();
    await screenshot(page, "routines-add-filled");
    await form.getByRole("button", { name: "Add routine" }).click();

    await expect
      .poll(() => page.getByText(`${TITLE} added; its work order appears in the Backlog in a moment.`).count(), {
        timeout: 15_000,
      })
      .toBe(1);
    expect(await panel("Add a routine").count()).toBe(0);
    const row = rowOf(TITLE);
    await expect.poll(() => row.count()).toBe(1);
    expect(await row.textContent()).toContain("every 2,000 h or every 3 months, whichever first");
    expect(await row.textContent()).toContain("Third engineer");

    // The worker writes the work order: poll the Backlog's route until it is there.
    // Worked example: due at the baseline + 2,000 h; 2,000 h at the purifier's ~23 h a day is about
    // 87 days, before the 3 months of the calendar rule, so hours govern and the job is scheduled.
    let found: BacklogPage["items"][number] | undefined;
    await expect
      .poll(
        async () => {
          const backlog = await getJson<BacklogPage>(`/api/vessels/${vesselId}/backlog?q=${encodeURIComponent(TITLE)}`);
          found = backlog.body.items[0];
          return backlog.body.items.length;
        },
        { timeout: WORKER_WAIT_MS, interval: 500 },
      )
      .toBe(1);
    expect(found).toMatchObject({ dueHours: baseline + 2000, governing: "hours", state: "scheduled" });

    // And a person sees it in the Backlog, its state in words.
    await page.getByRole("link", { name: "Backlog" }).click();
    await page.getByLabel("Find").fill(TITLE);
    await page.getByLabel("Find").press("Enter");
    const wo = page.locator("tbody tr").filter({ hasText: TITLE });
    await expect.poll(() => wo.count(), { timeout: 15_000 }).toBe(1);
    expect(await wo.textContent()).toContain(found!.number);
    expect(await wo.locator('[data-state="scheduled"]').textContent()).toContain("scheduled");
    await screenshot(page, "routines-new-work-order-in-backlog");
  });

  it("edits the routine: the form opens with the whole definition, and the list shows the change", async () => {
    await page.getByRole("link", { name: "Routines" }).click();
    await search().fill("sludge port check");
    await expect.poll(() => rowOf(TITLE).count(), { timeout: 10_000 }).toBe(1);
    await page.getByRole("button", { name: `Edit ${TITLE}` }).click();
    const form = panel(`Edit ${TITLE}`);
    // Loaded on opening: what the list does not carry (rank, cautions, baseline) is in the form.
    await expect.poll(() => form.getByLabel("Running hours").inputValue(), { timeout: 10_000 }).toBe("2000");
    expect(await form.getByLabel("Every", { exact: true }).inputValue()).toBe("3");
    expect(await form.getByLabel("Isolation and lock-out before opening machinery").isChecked()).toBe(true);
    expect(await form.getByLabel("Rank, row 1", { exact: true }).inputValue()).toBe("third-engineer");
    expect(await form.getByLabel("Rank, row 2", { exact: true }).inputValue()).toBe("motorman");

    await form.getByLabel("Running hours").fill("1500");
    await form.getByRole("button", { name: "Save routine" }).click();
    await expect
      .poll(() => page.getByText(`${TITLE} saved; the Backlog follows in a moment.`).count(), { timeout: 15_000 })
      .toBe(1);
    await expect.poll(() => rowOf(TITLE).textContent()).toContain("every 1,500 h or every 3 months, whichever first");
    const stored = await listed(TITLE);
    const full = await getJson<RoutineView>(`/api/vessels/${vesselId}/routines/${stored.body.routines[0]!.id}`);
    expect(full.body).toMatchObject({ intervalHours: 1500, calendarRule: "FREQ=MONTHLY;INTERVAL=3", revision: 2 });
    await screenshot(page, "routines-edited");
  });

  it("copies it to the other purifier of the vessel, finding it by its code", async () => {
    await page.getByRole("button", { name: `Copy ${TITLE}` }).click();
    const form = panel("Copy routine");
    await form.getByRole("group", { name: "Corran Ness" }).waitFor();
    // Sister ships' purifiers with the same code are offered too, under their vessel's name.
    expect(await form.getByRole("group", { name: "Aster Gale" }).getByLabel("PU.LO.1 Lube oil purifier").count()).toBe(
      1,
    );
    const offered = await form.getByRole("checkbox").count();
    // The register is long: the list narrows to what one types, and Enter there sends nothing.
    const find = form.getByLabel("Find a component");
    await find.fill("pu.fo");
    await expect.poll(() => form.getByRole("checkbox").count()).toBe(1);
    expect(offered).toBeGreaterThan(20);
    expect(await form.getByRole("group", { name: "Aster Gale" }).count()).toBe(0);
    await find.press("Enter");
    expect(await form.getByText("Choose at least one component to copy to.").count()).toBe(0);
    await form.getByLabel("PU.FO.1 Fuel oil purifier 1").check();
    expect(await form.getByText("1 chosen", { exact: true }).count()).toBe(1);
    await screenshot(page, "routines-copy");
    await form.getByRole("button", { name: "Copy", exact: true }).click();
    await expect
      .poll(() => page.getByText(`${TITLE} copied to PU.FO.1 (Corran Ness).`, { exact: false }).count(), {
        timeout: 15_000,
      })
      .toBe(1);
    await expect.poll(() => rowOf(TITLE).count()).toBe(2);
    expect(await rows().locator("td:first-child span:first-child").allTextContents()).toEqual(["PU.FO.1", "PU.LO.1"]);
  });

  it("retires both: they leave the list and the Backlog, and the history is kept", async () => {
    for (const code of ["PU.FO.1", "PU.LO.1"]) {
      await rowOf(TITLE)
        .filter({ hasText: code })
        .getByRole("button", { name: `Retire ${TITLE}` })
        .click();
      const form = panel("Retire routine");
      expect(await form.textContent()).toContain("completed work orders and their records stay for audits and surveys");
      await form.getByRole("button", { name: "Retire routine" }).click();
      await expect
        .poll(() => page.getByText(`${TITLE} on ${code} retired.`, { exact: false }).count(), { timeout: 15_000 })
        .toBe(1);
      expect(await page.getByText("Its history stays on record.", { exact: false }).count()).toBe(1);
    }
    await expect.poll(() => rowOf(TITLE).count()).toBe(0);
    expect((await listed(TITLE)).body.total).toBe(0);
    await expect
      .poll(
        async () =>
          (await getJson<BacklogPage>(`/api/vessels/${vesselId}/backlog?q=${encodeURIComponent(TITLE)}`)).body.items
            .length,
        { timeout: WORKER_WAIT_MS, interval: 500 },
      )
      .toBe(0);
    await screenshot(page, "routines-retired");
  });

  it("reads well at night and on a tablet", async () => {
    // A short list, so that the picture shows the table and the panel rather than 45 rows.
    await search().fill("purifier");
    await expect.poll(() => rows().count(), { timeout: 10_000 }).toBe(2);
    await page
      .getByRole("button", { name: /Day|Night/ })
      .first()
      .click();
    expect(await page.evaluate(() => document.documentElement.classList.contains("dark"))).toBe(true);
    await page.setViewportSize({ width: 820, height: 1180 });
    await screenshot(page, "routines-night-tablet");
    await page.getByRole("button", { name: "Add routine" }).click();
    await panel("Add a routine").waitFor();
    await screenshot(page, "routines-add-night-tablet");
    await panel("Add a routine").getByRole("button", { name: "Cancel" }).click();
    await page
      .getByRole("button", { name: /Day|Night/ })
      .first()
      .click();
    await page.setViewportSize({ width: 1280, height: 900 });
  });

  it("the list sends only the rows' summary: measured against the whole definitions it used to send", async () => {
    const sizes: Record<
      string,
      { routines: number; summaryBytes: number; fullBytes: number; summaryGzip: number; fullGzip: number }
    > = {};
    const list = await getJson<RoutineList>(`/api/vessels/${vesselId}/routines`);
    expect(list.status).toBe(200);
    // The list before this change sent each row as GET …/routines/[id] sends it now (the same view).
    const full: RoutineView[] = [];
    for (const r of list.body.routines)
      full.push((await getJson<RoutineView>(`/api/vessels/${vesselId}/routines/${r.id}`)).body);
    const before = JSON.stringify({ ...list.body, routines: full });
    const after = JSON.stringify(list.body);
    sizes[list.body.vessel.name] = {
      routines: list.body.routines.length,
      summaryBytes: Buffer.byteLength(after),
      fullBytes: Buffer.byteLength(before),
      summaryGzip: gzipSync(after).length,
      fullGzip: gzipSync(before).length,
    };
    writeFileSync(path.join(OUTPUT, "routines-list-size.json"), JSON.stringify(sizes, null, 2));
    expect(list.bytes).toBe(Buffer.byteLength(after));
    // No checklist, measurement, caution or baseline travels with the list.
    expect(after).not.toMatch(/"checklist"|"measurements"|"cautions"|"baselineHours"|"description"/);
    expect(Buffer.byteLength(after)).toBeLessThan(Buffer.byteLength(before) / 2);
  });
});
