// The demo's onboarding files pass Keelson's own import checks on any day the demo is set up: the
// seed moves their days to that day, across a year boundary and the days the ship's clocks change.
import { describe, expect, it } from "vitest";
import { checkImport } from "../../server/import/check-rows";
import { problemLine } from "../../server/import/problems";
import { readImportFiles } from "../../server/import/read-file";
import { instantOfShipTime } from "../../server/format/hours";
import { onboardingFiles } from "./onboarding-files";
import { demoVessels } from "./scenario";

const vessel = demoVessels.find((v) => v.onboardedFrom)!;

async function check(today: string) {
  const files = onboardingFiles(vessel.onboardedFrom!, today);
  const read = await readImportFiles(files);
  const checked = checkImport(read.sheets, {
    components: new Map(),
    counters: new Map(),
    routines: new Map(),
    toleranceRules: new Map(),
    rankNames: {},
    timeZone: vessel.timeZone,
    clock: instantOfShipTime(today, "08:00", vessel.timeZone),
    readings: new Map(),
  });
  return { ...checked, lines: [...read.problems, ...checked.problems].map(problemLine), files };
}

describe("the onboarded demo vessel's files", () => {
  // Pacific/Auckland turns its clocks forward on the last Sunday of September and back on the first
  // Sunday of April: set-ups on those days and on the first day of a year are checked too. (The
  // routine contract refuses last-done days after next week, so the days are not in the future.)
  it.each(["2026-12-01", "2026-01-01", "2026-04-05", "2025-09-28", "2026-09-27"])("pass every check when the demo is set up on %s", async (today) => {
    const r = await check(today);
    expect(r.lines).toEqual([]);
    expect(r.components.length).toBeGreaterThanOrEqual(140);
    expect(r.routines.length).toBeGreaterThanOrEqual(250);
    expect(r.counters).toHaveLength(13);
    // A year of daily readings of every counter, the last at 09:00 on the ship's day before.
    expect(r.readings.reduce((n, c) => n + c.readings.length, 0)).toBe(13 * 365);
    const last = Math.max(...r.readings.flatMap((c) => c.readings.map((x) => x.readAt.getTime())));
    const dayBefore = new Date(Date.parse(`${today}T00:00:00Z`) - 86_400_000).toISOString().slice(0, 10);
    expect(new Date(last)).toEqual(instantOfShipTime(dayBefore, "09:00", vessel.timeZone));
  });

  it("keep each file small enough for the repository and a ship's link", () => {
    for (const f of onboardingFiles(vessel.onboardedFrom!, "2026-12-01")) expect(f.bytes.byteLength, f.name).toBeLessThan(400 * 1024);
  });
});
