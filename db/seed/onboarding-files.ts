// The spreadsheets an onboarded demo vessel comes from (written by scripts/demo-plan.ts), with their
// days moved from the day they were written (written-on.txt) to today: the last-done days, the
// readings and the class items' next anniversaries.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { addDays, differenceInCalendarDays, format, parseISO } from "date-fns";

const FOLDER = path.join(import.meta.dirname, "onboarding");
/** The files whose days move with the calendar (routines.csv: its anniversaries; no other cell holds a day). */
const DATED = new Set(["last-done.csv", "readings.csv", "routines.csv"]);

/** The vessel's files, with their days moved by the days since they were written. */
export function onboardingFiles(folder: string, today: string): { name: string; bytes: Uint8Array }[] {
  const dir = path.join(FOLDER, folder);
  const writtenOn = readFileSync(path.join(dir, "written-on.txt"), "utf8").trim();
  const shift = differenceInCalendarDays(parseISO(today), parseISO(writtenOn));
  return readdirSync(dir)
    .filter((name) => name.endsWith(".csv"))
    .sort()
    .map((name) => {
      const text = readFileSync(path.join(dir, name), "utf8");
      const moved = DATED.has(name) ? text.replace(/\b(\d{4}-\d{2}-\d{2})\b/g, (day) => format(addDays(parseISO(day), shift), "yyyy-MM-dd")) : text;
      return { name, bytes: new TextEncoder().encode(moved) };
    });
}
