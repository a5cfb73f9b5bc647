// Worked examples of the package capacity check, computed by hand (hours in tenths: a rank's
// capacity rounds down, a job's hours round up — Keelson's own rule, so decimals never add up to
// a day that runs over).
import { describe, expect, it } from "vitest";
import { capacityProblems, type PackageJob, type StayCapacity } from "./capacity";

const stay: StayCapacity = {
  crew: [
    { rank: "second-engineer", manHoursPerDay: 8 },
    { rank: "motorman", manHoursPerDay: 7.5 },
  ],
  engineMayStop: true,
  immobilisationHours: 6,
};
const job = (over: Partial<PackageJob>): PackageJob => ({
  number: "WO-1",
  rank: "second-engineer",
  manHours: 4,
  needsEngineStop: false,
  date: "2026-12-10",
  ...over,
});

describe("capacityProblems", () => {
  it("fits a day filled exactly: 4 h + 4 h of the second engineer's 8 h", () => {
    expect(capacityProblems(stay, [job({}), job({ number: "WO-2" })])).toEqual([]);
  });

  it("names the job that runs a rank's day over, and counts it nowhere", () => {
    // 4 + 4 = 8 h; the third job would make 8.5 h of 8 h. The fourth (0.5 h next day) still fits.
    const problems = capacityProblems(stay, [
      job({}),
      job({ number: "WO-2" }),
      job({ number: "WO-3", manHours: 0.5 }),
      job({ number: "WO-4", manHours: 0.5, date: "2026-12-11" }),
    ]);
    expect(problems).toEqual([
      { index: 2, kind: "crew", message: "On 10 Dec 2026 the second engineer would have 8.5 h of work, more than the 8 h on board." },
    ]);
  });

  it("keeps ranks apart, and a rank not on board has 0 h", () => {
    const problems = capacityProblems(stay, [
      job({ rank: "motorman", manHours: 7.5 }),
      job({ number: "WO-2", rank: "electrician", manHours: 1 }),
    ]);
    expect(problems.map((p) => [p.index, p.kind])).toEqual([[1, "crew"]]);
    expect(problems[0]!.message).toMatch(/electrician would have 1 h of work, more than the 0 h on board/);
  });

  it("counts engine-stop hours against the immobilisation allowed: 4 h + 3 h of 6 h refuses the second", () => {
    const problems = capacityProblems(stay, [
      job({ needsEngineStop: true }),
      job({ number: "WO-2", rank: "motorman", manHours: 3, needsEngineStop: true }),
    ]);
    expect(problems).toEqual([
      {
        index: 1,
        kind: "engine-stop",
        message: "WO-2 needs the engine stopped: with it the package would take 7 h of the 6 h immobilisation allowed.",
      },
    ]);
  });

  it("refuses every engine-stop job when the engine may not stop, whatever hours are entered", () => {
    const problems = capacityProblems({ ...stay, engineMayStop: false }, [job({ needsEngineStop: true })]);
    expect(problems[0]!.message).toBe("WO-1 needs the engine stopped, and no immobilisation is allowed in this stay.");
  });
});
