// The demo chief engineer plans Aster Gale's next port stay (Port Kelang) on its timeline: has
// Keelson propose a package, finds engine-stop work inside the engine-stop slot, moves a job with the
// keyboard and sees the server's answer, accepts, and finds the package again after a reload. Then
// adds a stay with a port watch, where a wrong engine stop is refused at its field. Writes to the demo
// data (planned dates on Aster Gale). Jobs are found by the data attributes the timeline puts on them,
// never by number: the demo's routines may change.
import type { Browser, Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD } from "@/db/seed/scenario";
import { shipDay } from "@/server/format/hours";
import { openPage, screenshot, signInThroughForm } from "../support/browser";

let browser: Browser;
let page: Page;
let stayUrl = "";
/** The job moved with the keyboard, and its start (ISO) once the server placed it. */
let moved = { number: "", start: "" };
let acceptedCount = 0;

beforeAll(async () => {
  ({ browser, page } = await openPage());
});
afterAll(async () => {
  await browser?.close();
});

const blocks = () => page.locator("[data-work-order][data-start]");
const attr = async (l: Locator, name: string) => (await l.getAttribute(name)) ?? "";
const settled = () => page.locator('[data-draft-status="checked"]').waitFor({ timeout: 15_000 });

describe("the chief engineer plans a port stay on its timeline", () => {
  it("opens the first upcoming stay of Aster Gale", async () => {
    await signInThroughForm(page, "chief@brightwater.example", DEMO_PASSWORD);
    await page.getByRole("link", { name: "Aster Gale" }).first().click();
    await page.getByRole("link", { name: "Port stays", exact: true }).click();
    await page.waitForURL(/\/port-stays$/);
    await page.getByRole("region", { name: "Upcoming" }).getByRole("link", { name: "Port Kelang (demo call)" }).click();
    await page.waitForURL(/\/port-stays\/[0-9a-f-]{36}$/);
    stayUrl = page.url();
    await page.getByRole("heading", { name: /Port Kelang/, level: 1 }).waitFor();
  });

  it("proposes a package: jobs placed, engine-stop work inside the engine-stop slot", async () => {
    // A stay planned by an earlier run shows its package and offers to re-plan.
    await page.getByRole("button", { name: /^(Propose a package|Re-plan)$/ }).click();
    await page.getByRole("button", { name: "Accept package" }).waitFor({ timeout: 30_000 });
    await expect.poll(() => blocks().count(), { timeout: 15_000 }).toBeGreaterThan(0);
    const band = page.locator("[data-engine-stop-band]");
    const [from, to] = [await attr(band, "data-from"), await attr(band, "data-to")];
    const stopJobs = await page.locator('[data-engine-stop="true"][data-start]').evaluateAll((els) =>
      els.map((e) => [e.getAttribute("data-start")!, e.getAttribute("data-end")!] as const),
    );
    expect(stopJobs.length).toBeGreaterThan(0);
    for (const [start, end] of stopJobs) {
      expect(Date.parse(start)).toBeGreaterThanOrEqual(Date.parse(from));
      expect(Date.parse(end)).toBeLessThanOrEqual(Date.parse(to));
    }
    expect(await page.getByText(/^Priority-weighted work placed: \d+ %$/).count()).toBe(1);
    await screenshot(page, "port-stay-proposal-day");
    await page.evaluate(() => document.documentElement.classList.add("dark"));
    await screenshot(page, "port-stay-proposal-night");
    await page.evaluate(() => document.documentElement.classList.remove("dark"));
  });

  it("moves a job a slot later with the arrow key and sees the server's placement", async () => {
    const count = await blocks().count();
    // The first job whose next slot is free: one that is refused goes back with the other arrow.
    for (let i = 0; i < count && !moved.number; i += 1) {
      const block = blocks().nth(i);
      const number = await attr(block, "data-work-order");
      const before = await attr(block, "data-start");
      await block.focus();
      await page.keyboard.press("ArrowRight");
      await settled();
      const after = page.locator(`[data-work-order="${number}"][data-start]`);
      // A move that fits its own lane may still take someone another job needs: the draft's line says.
      const fits = /fits\.$/.test((await page.locator("[data-draft-status]").textContent()) ?? "");
      if (fits && (await attr(after, "data-problem")) !== "true" && (await attr(after, "data-start")) !== before) {
        expect(Date.parse(await attr(after, "data-start"))).toBeGreaterThan(Date.parse(before));
        moved = { number, start: await attr(after, "data-start") };
      } else {
        await after.focus();
        await page.keyboard.press("ArrowLeft");
        await settled();
      }
    }
    expect(moved.number).not.toBe("");
    expect(await page.locator("[data-draft-status]").textContent()).toMatch(/fits\.$/);
    await screenshot(page, "port-stay-moved");
  });

  it("drags the same job an hour later with the pointer, and the server checks the new start", async () => {
    const block = () => page.locator(`[data-work-order="${moved.number}"][data-start]`);
    const wanted = await attr(block(), "data-start-local");
    await block().scrollIntoViewIfNeeded();
    const box = (await block().boundingBox())!;
    const y = box.y + box.height / 2;
    await page.mouse.move(box.x + 8, y);
    await page.mouse.down();
    // HOUR_PX (timeline-geometry.ts): 44 px is an hour of the working day.
    await page.mouse.move(box.x + 8 + 22, y, { steps: 4 });
    await page.mouse.move(box.x + 8 + 44, y, { steps: 4 });
    await page.mouse.up();
    await expect.poll(() => attr(block(), "data-start-local"), { timeout: 15_000 }).not.toBe(wanted);
    await settled();
    const dragged = await attr(block(), "data-start-local");
    await screenshot(page, "port-stay-dragged");
    // Later by the hour, or, where the working day ends first, at the next working day's start.
    expect(dragged > wanted).toBe(true);
    const fits = /fits\.$/.test((await page.locator("[data-draft-status]").textContent()) ?? "");
    if ((await attr(block(), "data-problem")) === "true" || !fits) {
      // Refused (the hour is taken or outside its limits): back where it was with the keyboard (an
      // hour per Shift+←, a slot per ←), and the draft fits again.
      let back = (Date.parse(`${dragged}:00Z`) - Date.parse(`${wanted}:00Z`)) / 60_000;
      while (back > 0) {
        await block().focus();
        await page.keyboard.press(back >= 60 ? "Shift+ArrowLeft" : "ArrowLeft");
        back -= back >= 60 ? 60 : 30;
        await settled();
      }
      expect(await attr(block(), "data-start-local")).toBe(wanted);
      expect(await attr(block(), "data-problem")).toBe("");
    } else {
      expect(await page.locator("[data-draft-status]").textContent()).toMatch(/fits\.$/);
      moved = { number: moved.number, start: await attr(block(), "data-start") };
    }
  });

  it("accepts the package and finds it again after a reload", async () => {
    acceptedCount = await blocks().count();
    const accept = page.getByRole("button", { name: "Accept package" });
    await expect.poll(() => accept.isEnabled()).toBe(true);
    await accept.click();
    await page.getByText(/^Package accepted: \d+ jobs? planned/).waitFor({ timeout: 15_000 });
    await page.reload();
    await page.getByRole("heading", { name: "Accepted work package" }).waitFor();
    await expect.poll(() => blocks().count()).toBe(acceptedCount);
    expect(await attr(page.locator(`[data-work-order="${moved.number}"][data-start]`), "data-start")).toBe(moved.start);
    await screenshot(page, "port-stay-accepted");
  });

  it("prints the package sheet with times, people and cautions", async () => {
    await page.goto(`${stayUrl}/sheet`);
    await page.getByRole("heading", { name: /^Work package: Port Kelang/ }).waitFor();
    // A job over two days is on both.
    expect(await page.getByText(moved.number, { exact: true }).count()).toBeGreaterThan(0);
    expect(await page.getByText(/permit to work/).count()).toBeGreaterThan(0);
    await screenshot(page, "port-stay-sheet");
  });

  it("adds a stay with a port watch; an engine stop past the departure is refused at its field", async () => {
    await page.goto(stayUrl);
    await page.getByRole("link", { name: "Port stays", exact: true }).click();
    await page.waitForURL(/\/port-stays$/);
    await page.getByRole("button", { name: "Add port stay" }).click();
    const panel = page.getByRole("dialog", { name: "Add a port stay" });
    const day = (n: number) => shipDay(new Date(Date.now() + n * 86_400_000), "Asia/Singapore");
    const port = "Penang (test call)";
    await panel.getByLabel("Port", { exact: true }).fill(port);
    await panel.getByLabel("Arrival").fill(`${day(40)}T06:00`);
    await panel.getByLabel("Departure").fill(`${day(41)}T18:00`);
    await panel.getByLabel("Main engine may be immobilised").check();
    await panel.getByLabel("Engine stop from").fill(`${day(41)}T08:00`);
    await panel.getByLabel("Engine stop to").fill(`${day(42)}T08:00`);
    await panel.getByRole("button", { name: "Add a watch" }).click();
    await panel.getByLabel("Watch 1: what (cargo, bunkering…)").fill("Bunkering");
    await panel.getByLabel("Watch 1 from").fill(`${day(40)}T09:00`);
    await panel.getByLabel("Watch 1 to").fill(`${day(40)}T13:00`);
    await panel.getByRole("button", { name: "Add port stay" }).click();
    const error = panel.locator("#stay-engineStop-from-error");
    await error.waitFor();
    expect(await error.textContent()).toBe("The engine stop lies within the stay, between arrival and departure.");
    expect(await panel.getByLabel("Engine stop from").getAttribute("aria-invalid")).toBe("true");
    await screenshot(page, "port-stay-form-refused");
    await page.keyboard.press("Escape");
    await page.reload();
    await page.getByRole("region", { name: "Upcoming" }).waitFor();
    expect(await page.getByRole("link", { name: port }).count()).toBe(0);

    await page.getByRole("button", { name: "Add port stay" }).click();
    await panel.getByLabel("Port", { exact: true }).fill(port);
    await panel.getByLabel("Arrival").fill(`${day(40)}T06:00`);
    await panel.getByLabel("Departure").fill(`${day(41)}T18:00`);
    await panel.getByRole("button", { name: "Add a watch" }).click();
    await panel.getByLabel("Watch 1: what (cargo, bunkering…)").fill("Bunkering");
    await panel.getByLabel("Watch 1 from").fill(`${day(40)}T09:00`);
    await panel.getByLabel("Watch 1 to").fill(`${day(40)}T13:00`);
    await panel.getByRole("button", { name: "Add port stay" }).click();
    await page.getByText(`${port} added.`).waitFor();
    await page.getByRole("link", { name: port }).click();
    await page.getByRole("heading", { name: port, level: 1 }).waitFor();
    expect(await page.getByText(/: Bunkering, /).count()).toBe(1);
    await page.getByRole("button", { name: "Delete" }).click();
    await page.getByRole("dialog").getByRole("button", { name: "Delete stay" }).click();
    await page.waitForURL(/\/port-stays$/);
    await expect.poll(() => page.getByRole("link", { name: port }).count()).toBe(0);
  });
});
