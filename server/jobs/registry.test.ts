// The registry is what the worker loops over: one queue per job name, a cron only where the job
// takes an empty payload (the worker schedules it with `{}`), and the web never reaching into the
// worker process's folder.
import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { jobRegistry } from "./registry";
import { recomputeVesselJob } from "./recompute-vessel";

const ROOT = path.resolve(import.meta.dirname, "../..");

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(name) ? [full] : [];
  });
}

describe("the job registry", () => {
  it("names each queue once", () => {
    const names = jobRegistry.map((j) => j.name);
    expect(new Set(names).size).toBe(names.length);
  });

  it("gives a cron only to jobs whose payload is empty", async () => {
    const cronJobs = jobRegistry.filter((j) => j.cron);
    expect(cronJobs.map((j) => j.name).sort()).toEqual([
      "fleet-recompute-nightly",
      "fleet-snapshot-daily",
      "mail-send",
      "reminders",
      "ship-clocks",
    ]);
  });

  it("refuses a payload that does not fit before anything is loaded", async () => {
    await expect(recomputeVesselJob.run({ vesselId: "not-a-uuid" }, { db: null as never })).rejects.toThrow();
    expect(recomputeVesselJob.singletonKey?.({ companyId: "c", vesselId: "v-1" })).toBe("v-1");
  });

  it("is imported by the web through server/, which imports nothing from workers/", () => {
    const offenders = ["server", "app", "db"]
      .flatMap((dir) => sourceFiles(path.join(ROOT, dir)))
      .filter((file) => /from\s+["'](@\/workers|(\.\.\/)+workers)\//.test(readFileSync(file, "utf8")));
    expect(offenders).toEqual([]);
  });
});
