// Hand-worked port-stay plans (issue 11's list): each expected start, end and team below was worked
// out by hand from the stay's clock and the rules, not read back from the planner.
import { describe, expect, it } from "vitest";
import type { PlanJob } from "./job-classes";
import { planPortStay, type StayPlanInput } from "./stay-planner";

// Port Kelang keeps UTC+8 all year: a ship's clock time is "+08:00".
const kl = (local: string) => new Date(`${local}:00+08:00`);
const h = (hh: number) => hh * 60;

function job(id: string, over: Partial<PlanJob> = {}): PlanJob {
  return {
    id,
    number: id,
    title: id,
    state: "scheduled",
    team: [{ rank: "motorman", count: 1 }],
    elapsedHours: 1,
    needsEngineStop: false,
    needsPort: true,
    critical: false,
    classRelated: false,
    dueAt: kl("2026-12-11T00:00"),
    outOfToleranceAt: null,
    planFrom: null,
    planUntil: null,
    tiedTo: null,
    ...over,
  };
}

function stay(over: Partial<StayPlanInput["stay"]> = {}): StayPlanInput["stay"] {
  return {
    arrivesAt: kl("2026-12-10T08:00"),
    departsAt: kl("2026-12-12T17:00"),
    timeZone: "Asia/Kuala_Lumpur",
    workday: { from: h(8), to: h(17) },
    immobilisation: { from: kl("2026-12-10T08:00"), to: kl("2026-12-11T17:00") },
    crew: [
      { rank: "second-engineer", count: 1 },
      { rank: "third-engineer", count: 1 },
      { rank: "motorman", count: 2 },
    ],
    watches: [],
    ...over,
  };
}

const plan = (s: StayPlanInput["stay"], jobs: PlanJob[]) =>
  planPortStay({ stay: s, nextStayArrivesAt: kl("2027-01-20T08:00"), jobs });

describe("a two-day overhaul by a team of three", () => {
  it("starts in the engine stop on day 1 and finishes on day 2 with the same three people", () => {
    const overhaul = job("piston", {
      state: "out-of-tolerance",
      needsEngineStop: true,
      team: [
        { rank: "second-engineer", count: 1 },
        { rank: "motorman", count: 2 },
      ],
      elapsedHours: 12,
      critical: true,
    });
    const result = plan(stay(), [overhaul]);
    const [placed] = result.placed;
    // 9 working hours on day 1 (08:00–17:00), the other 3 on day 2 from 08:00.
    expect(placed?.segments).toEqual([
      { from: kl("2026-12-10T08:00"), to: kl("2026-12-10T17:00") },
      { from: kl("2026-12-11T08:00"), to: kl("2026-12-11T11:00") },
    ]);
    expect(placed?.people).toEqual(["second-engineer#1", "motorman#1", "motorman#2"]);
    expect(placed?.manHours).toBe(36);
    expect(placed?.reason).toContain("second engineer, motorman ×2 from 10 Dec 08:00 to 11 Dec 11:00");
    expect(placed?.reason).toContain("12 h of work over 2 days, 36 man-hours");
    expect(placed?.reason).toContain("inside the engine stop");
    // Engine-stop work (100) × out of tolerance (8) × critical (2) × 36 man-hours.
    expect(result.value).toBe(57_600);
  });
});

describe("work already out of tolerance", () => {
  it("goes into the stay although its plannable days ended before it (it is due now)", () => {
    const overdue = job("overdue", { state: "out-of-tolerance", needsEngineStop: true, planFrom: "2026-09-01", planUntil: "2026-09-26", elapsedHours: 4 });
    const result = plan(stay(), [overdue]);
    expect(result.placed).toMatchObject([{ number: "overdue", start: kl("2026-12-10T08:00"), end: kl("2026-12-10T12:00") }]);
    expect(result.leftOut).toEqual([]);
  });
});

describe("two engine-stop jobs in one slot", () => {
  it("overlap when the crew allows, both inside the stop", () => {
    const s = stay({ immobilisation: { from: kl("2026-12-10T08:00"), to: kl("2026-12-10T17:00") } });
    const exhaust = job("exhaust", {
      needsEngineStop: true,
      team: [
        { rank: "second-engineer", count: 1 },
        { rank: "motorman", count: 1 },
      ],
      elapsedHours: 6,
    });
    const fuel = job("fuel", {
      needsEngineStop: true,
      team: [
        { rank: "third-engineer", count: 1 },
        { rank: "motorman", count: 1 },
      ],
      elapsedHours: 4,
    });
    const result = plan(s, [exhaust, fuel]);
    const at = Object.fromEntries(result.placed.map((p) => [p.number, [p.start, p.end, p.people]]));
    expect(at.exhaust).toEqual([kl("2026-12-10T08:00"), kl("2026-12-10T14:00"), ["second-engineer#1", "motorman#1"]]);
    expect(at.fuel).toEqual([kl("2026-12-10T08:00"), kl("2026-12-10T12:00"), ["third-engineer#1", "motorman#2"]]);
    expect(result.leftOut).toEqual([]);
  });

  it("one after the other when they need the same person", () => {
    const s = stay({ immobilisation: { from: kl("2026-12-10T08:00"), to: kl("2026-12-10T17:00") } });
    const a = job("a", { needsEngineStop: true, team: [{ rank: "second-engineer", count: 1 }], elapsedHours: 5 });
    const b = job("b", { needsEngineStop: true, team: [{ rank: "second-engineer", count: 1 }], elapsedHours: 4 });
    const result = plan(s, [a, b]);
    expect(result.placed.map((p) => [p.number, p.start, p.end])).toEqual([
      ["a", kl("2026-12-10T08:00"), kl("2026-12-10T13:00")],
      ["b", kl("2026-12-10T13:00"), kl("2026-12-10T17:00")],
    ]);
  });
});

describe("a job that cannot fit the slot", () => {
  it("is left out with the slot named, while a job that fits goes in", () => {
    const s = stay({ immobilisation: { from: kl("2026-12-10T08:00"), to: kl("2026-12-10T16:00") } });
    const long = job("long", { state: "out-of-tolerance", needsEngineStop: true, elapsedHours: 10 });
    const short = job("short", { needsEngineStop: true, elapsedHours: 2 });
    const result = plan(s, [long, short]);
    expect(result.placed.map((p) => p.number)).toEqual(["short"]);
    expect(result.leftOut).toMatchObject([{ number: "long", reason: "longer-than-engine-stop" }]);
    expect(result.leftOut[0]?.message).toBe(
      "Already out of tolerance — needs the engine stopped, but it takes 10 h of work, more than the working hours inside the engine stop.",
    );
  });

  it("is left out when the engine may not stop at all", () => {
    const result = plan(stay({ immobilisation: null }), [job("stop", { needsEngineStop: true })]);
    expect(result.leftOut).toMatchObject([{ reason: "engine-stop-not-allowed" }]);
  });
});

describe("rest hours", () => {
  // One motorman, a 16-hour working day. Day 1 he works 08:00–22:00 (14 h, the most in any 24 h:
  // MLC 2006 Standard A2.3 §5(a)(i), 10 h of rest in any 24 — memory, ../shared/SOURCES.md).
  const s = (departsAt: Date) =>
    stay({
      departsAt,
      workday: { from: h(6), to: h(22) },
      immobilisation: null,
      crew: [{ rank: "motorman", count: 1 }],
    });
  const first = job("first", { state: "out-of-tolerance", elapsedHours: 14 });
  const second = job("second", { elapsedHours: 6 });

  it("push day 2's job from 06:00 to 08:00", () => {
    // Started at 06:00, the window from 07:00 on day 1 would hold 14 h + 1 h = 15 h of work.
    const result = plan(s(kl("2026-12-12T17:00")), [first, second]);
    expect(result.placed.map((p) => [p.number, p.start, p.end])).toEqual([
      ["first", kl("2026-12-10T08:00"), kl("2026-12-10T22:00")],
      ["second", kl("2026-12-11T08:00"), kl("2026-12-11T14:00")],
    ]);
  });

  it("leave the job out, saying so, when the stay ends before the rest is done", () => {
    const result = plan(s(kl("2026-12-11T12:00")), [first, second]);
    expect(result.placed.map((p) => p.number)).toEqual(["first"]);
    expect(result.leftOut).toMatchObject([{ number: "second", reason: "rest-hours" }]);
    expect(result.leftOut[0]?.message).toContain("would go under the rest-hour minimum");
  });

  it("count a port watch as work", () => {
    // Bunkering 06:00–10:00 on day 2 for the only motorman: day 2's job waits for it, then starts at 10:00
    // (the window from 10:00 on day 1 holds 12 h of day 1, 4 h of watch: 16 h — so not before).
    const watches = [{ rank: "motorman", person: 1, from: kl("2026-12-11T06:00"), to: kl("2026-12-11T10:00"), label: "bunkering" }];
    const short = job("short", { elapsedHours: 4 });
    const result = plan({ ...s(kl("2026-12-12T17:00")), watches }, [short]);
    expect(result.placed[0]?.start).toEqual(kl("2026-12-10T08:00"));
    const busy = plan({ ...s(kl("2026-12-12T17:00")), watches, arrivesAt: kl("2026-12-11T06:00") }, [short]);
    expect(busy.placed[0]?.start).toEqual(kl("2026-12-11T10:00"));
    expect(busy.people).toEqual([{ key: "motorman#1", rank: "motorman", number: 1, jobHours: 4, watchHours: 4 }]);
  });
});

describe("work tied to the departure", () => {
  it("puts the steering-gear test within 12 h before departure, never left for a deferral", () => {
    // SOLAS chapter V, regulation 26: steering gear checked and tested within 12 hours before
    // departure (memory, ../shared/SOURCES.md).
    const steering = job("steering", {
      team: [{ rank: "second-engineer", count: 1 }],
      tiedTo: { event: "departure", withinHours: 12 },
      needsPort: false,
      dueAt: null,
      critical: true,
    });
    const result = plan(stay(), [steering]);
    // The window opens at 05:00 on the departure day; the working day at 08:00.
    expect(result.placed).toMatchObject([{ number: "steering", start: kl("2026-12-12T08:00"), end: kl("2026-12-12T09:00") }]);
    expect(result.placed[0]?.reason).toMatch(/^Required within 12 h before each departure — critical;/);
  });
});

describe("sea work", () => {
  const seaJob = (id: string, outOfToleranceAt: Date) =>
    job(id, { needsPort: false, dueAt: kl("2026-12-11T00:00"), outOfToleranceAt });

  it("stays at sea while it can wait, and is placed when it would go out of tolerance first", () => {
    const canWait = seaJob("oil-change", kl("2026-12-20T00:00"));
    const cannot = seaJob("fire-pump", kl("2026-12-12T20:00"));
    const result = plan(stay(), [canWait, cannot]);
    expect(result.placed.map((p) => p.number)).toEqual(["fire-pump"]);
    expect(result.placed[0]?.reason).toMatch(/^Can be done at sea, but goes out of tolerance on 12 Dec, before the end of the first day at sea \(13 Dec\)/);
    expect(result.atSea).toMatchObject([{ number: "oil-change" }]);
    expect(result.atSea[0]?.message).toBe(
      "Left for the voyage: it can be done at sea, falls due on 11 Dec and stays within tolerance until 20 Dec, after the first day at sea.",
    );
  });

  it("comes after the engine-stop and port-only work of the same urgency (the fill order)", () => {
    // One motorman, one working day of 9 h: the engine-stop job (6 h) and the port job (3 h) take it.
    const s = stay({ departsAt: kl("2026-12-10T17:00"), crew: [{ rank: "motorman", count: 1 }] });
    const soon = kl("2026-12-30T00:00");
    const stop = job("stop", { needsEngineStop: true, elapsedHours: 6, outOfToleranceAt: soon });
    const port = job("port", { elapsedHours: 3, outOfToleranceAt: soon });
    const sea = job("sea", { needsPort: false, elapsedHours: 3, outOfToleranceAt: kl("2026-12-10T20:00") });
    const result = plan(s, [sea, port, stop]);
    expect(result.placed.map((p) => p.number)).toEqual(["stop", "port"]);
    expect(result.leftOut).toMatchObject([{ number: "sea", reason: "crew-taken" }]);
    expect(result.order).toBe("fill");
  });

  it("keeps port work that is merely due before sea work about to go out of tolerance: port time is what the stay is for", () => {
    const s = stay({ departsAt: kl("2026-12-10T11:00"), crew: [{ rank: "motorman", count: 1 }] });
    const port = job("port", { elapsedHours: 3 });
    const sea = job("sea", { needsPort: false, elapsedHours: 3, outOfToleranceAt: kl("2026-12-10T20:00") });
    const result = plan(s, [sea, port]);
    expect(result.placed.map((p) => p.number)).toEqual(["port"]);
    expect(result.leftOut).toMatchObject([{ number: "sea", reason: "crew-taken" }]);
    // Port-only (10) × falls due (1) × 3 h, and sea (1) × going out of tolerance (4) × 3 h left out.
    expect([result.value, result.possible]).toEqual([30, 42]);
  });
});
