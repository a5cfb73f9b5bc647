// The chief's edited package checked against the stay's rules: each case worked out by hand.
import { describe, expect, it } from "vitest";
import type { PlanJob } from "./job-classes";
import { checkPackage, type CheckStay } from "./package-check";

const kl = (local: string) => new Date(`${local}:00+08:00`);

const stay: CheckStay = {
  arrivesAt: kl("2026-12-10T08:00"),
  departsAt: kl("2026-12-11T17:00"),
  timeZone: "Asia/Kuala_Lumpur",
  workday: { from: 8 * 60, to: 17 * 60 },
  immobilisation: { from: kl("2026-12-10T08:00"), to: kl("2026-12-10T20:00") },
  crew: [
    { rank: "second-engineer", count: 1 },
    { rank: "motorman", count: 2 },
  ],
  watches: [{ rank: "motorman", person: 2, from: kl("2026-12-11T08:00"), to: kl("2026-12-11T12:00"), label: "bunkering" }],
};

function job(id: string, over: Partial<PlanJob> = {}): PlanJob {
  return {
    id,
    number: id,
    title: id,
    state: "scheduled",
    team: [{ rank: "motorman", count: 1 }],
    elapsedHours: 2,
    needsEngineStop: false,
    needsPort: true,
    critical: false,
    classRelated: false,
    dueAt: null,
    outOfToleranceAt: null,
    planFrom: null,
    planUntil: null,
    tiedTo: null,
    ...over,
  };
}

describe("a package checked as the chief moved it", () => {
  it("places a job from its start over the working hours, into the next day", () => {
    const overhaul = job("WO-1", { needsEngineStop: false, elapsedHours: 12, team: [{ rank: "second-engineer", count: 1 }, { rank: "motorman", count: 1 }] });
    const { placed, problems } = checkPackage(stay, [{ job: overhaul, start: kl("2026-12-10T10:00"), people: ["second-engineer#1", "motorman#1"] }]);
    expect(problems).toEqual([]);
    // 10:00–17:00 is 7 h; the other 5 h run 08:00–13:00 the next day.
    expect(placed[0]).toEqual({
      segments: [
        { from: kl("2026-12-10T10:00"), to: kl("2026-12-10T17:00") },
        { from: kl("2026-12-11T08:00"), to: kl("2026-12-11T13:00") },
      ],
      people: ["second-engineer#1", "motorman#1"],
    });
  });

  it("refuses a start outside the working day, between slots, or too late to finish", () => {
    const { problems } = checkPackage(stay, [
      { job: job("A"), start: kl("2026-12-10T07:00") },
      { job: job("B"), start: kl("2026-12-10T08:15") },
      { job: job("C"), start: kl("2026-12-11T16:00") },
    ]);
    expect(problems.map((p) => [p.item, p.field])).toEqual([
      [0, "start"],
      [1, "start"],
      [2, "start"],
    ]);
    expect(problems[0]?.message).toBe(
      "A: 10 Dec 07:00 is not a working time of this stay (working day 08:00–17:00, in steps of 30 minutes, from arrival to departure).",
    );
    expect(problems[2]?.message).toBe("C: started at 11 Dec 16:00, its 2 h of work would not be done before departure.");
  });

  it("keeps engine-stop work inside the engine stop", () => {
    const { problems } = checkPackage(stay, [{ job: job("E", { needsEngineStop: true, elapsedHours: 2 }), start: kl("2026-12-11T08:00") }]);
    expect(problems).toEqual([
      { item: 0, field: "start", message: "E: it needs the engine stopped, and 11 Dec 08:00–11 Dec 10:00 is not inside the engine stop (10 Dec 08:00–10 Dec 20:00)." },
    ]);
  });

  it("refuses people of the wrong rank, unknown people, and a person twice at once", () => {
    const { problems, placed } = checkPackage(stay, [
      { job: job("A"), start: kl("2026-12-10T08:00"), people: ["second-engineer#1"] },
      { job: job("B"), start: kl("2026-12-10T08:00"), people: ["motorman#3"] },
      { job: job("C"), start: kl("2026-12-10T08:00"), people: ["motorman#1"] },
      { job: job("D"), start: kl("2026-12-10T09:00"), people: ["motorman#1"] },
      // Motorman 2 is on the bunkering watch from 08:00 on the 11th.
      { job: job("W"), start: kl("2026-12-11T10:00"), people: ["motorman#2"] },
    ]);
    expect(problems).toEqual([
      { item: 0, field: "people", message: "A: its team is motorman; second-engineer#1 is not." },
      { item: 1, field: "people", message: "B: motorman#3 is not in this stay's crew list." },
      { item: 3, field: "people", message: "D: motorman#1 is on another job or a watch between 10 Dec 09:00 and 10 Dec 11:00." },
      { item: 4, field: "people", message: "W: motorman#2 is on another job or a watch between 11 Dec 10:00 and 11 Dec 12:00." },
    ]);
    expect(placed.map((p) => p !== null)).toEqual([false, false, true, false, false]);
  });

  it("picks the people when none are named, and says when no one of the team is free", () => {
    const { placed, problems } = checkPackage(stay, [
      { job: job("A"), start: kl("2026-12-10T08:00") },
      { job: job("B"), start: kl("2026-12-10T08:00") },
      { job: job("C"), start: kl("2026-12-10T09:00") },
    ]);
    expect(placed.map((p) => p?.people)).toEqual([["motorman#1"], ["motorman#2"], undefined]);
    expect(problems).toEqual([
      { item: 2, field: "people", message: "C: not enough of its team (motorman) is free between 10 Dec 09:00 and 10 Dec 11:00." },
    ]);
  });

  it("keeps the rest hours: 14 h of work in any 24 h at most (MLC 2006 Standard A2.3, memory)", () => {
    const long: CheckStay = { ...stay, workday: { from: 6 * 60, to: 22 * 60 }, watches: [] };
    // 08:00–22:00 on the 10th is 14 h; a job from 06:00 on the 11th puts 15 h in the 24 h from 07:00.
    const { problems } = checkPackage(long, [
      { job: job("A", { elapsedHours: 14 }), start: kl("2026-12-10T08:00"), people: ["motorman#1"] },
      { job: job("B", { elapsedHours: 2 }), start: kl("2026-12-11T06:00"), people: ["motorman#1"] },
      { job: job("C", { elapsedHours: 2 }), start: kl("2026-12-11T08:00"), people: ["motorman#1"] },
    ]);
    expect(problems).toEqual([
      {
        item: 1,
        field: "people",
        message: "B: motorman#1 would go under the rest-hour minimum (10 h in any 24 h, 77 h in any 7 days: MLC 2006 Standard A2.3).",
      },
    ]);
  });
});
