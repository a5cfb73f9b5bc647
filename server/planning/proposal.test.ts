import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { AppError } from "@/server/http/problem";
import { proposeWorkPackage, type Candidate, type PlanningState, type Proposal, type ProposalInput } from "./proposal";

const utc = (iso: string) => new Date(`${iso}Z`);

let serial = 0;
/** A window-open, 4 h second-engineer job due on 10 Dec unless told otherwise. */
function wo(number: string, over: Partial<Candidate> = {}): Candidate {
  serial += 1;
  return {
    id: `id-${number}-${serial}`,
    number,
    title: `Job ${number}`,
    state: "window-open",
    rank: "second-engineer",
    estimatedManHours: 4,
    needsEngineStop: false,
    critical: false,
    classRelated: false,
    dueAt: utc("2026-12-10T12:00"),
    outOfToleranceAt: null,
    planFrom: null,
    planUntil: null,
    ...over,
  };
}

/** A two-day stay (3–4 Dec), 12 h of immobilisation allowed, the next stay arriving 20 Dec. */
type InputChange = Partial<Omit<ProposalInput, "stay">> & { stay?: Partial<ProposalInput["stay"]> };
function input(over: InputChange = {}): ProposalInput {
  return {
    nextStayArrivesAt: utc("2026-12-20T06:00"),
    crew: [{ rank: "second-engineer", manHoursPerDay: 12 }],
    candidates: [],
    ...over,
    stay: {
      days: ["2026-12-03", "2026-12-04"],
      departsAt: utc("2026-12-04T18:00"),
      engineMayStop: true,
      immobilisationHours: 12,
      ...over.stay,
    },
  };
}

const placed = (p: Proposal) => p.items.map((i) => [i.number, i.date]);
const out = (p: Proposal) => p.leftOut.map((l) => [l.number, l.reason]);
const usageOf = (p: Proposal, date: string, rank = "second-engineer") =>
  p.usage.find((u) => u.date === date && u.rank === rank);

describe("proposeWorkPackage: capacity", () => {
  it("fills a day exactly, then moves to the next day", () => {
    // 12 h of second engineer a day. WO-1..3: 4 + 4 + 4 = 12 h → all on 3 Dec, 0 h left that day.
    // WO-4 (4 h) finds 0 h on 3 Dec → 4 Dec, leaving 12 − 4 = 8 h there.
    const p = proposeWorkPackage(input({ candidates: ["WO-1", "WO-2", "WO-3", "WO-4"].map((n) => wo(n)) }));
    expect(placed(p)).toEqual([
      ["WO-1", "2026-12-03"],
      ["WO-2", "2026-12-03"],
      ["WO-3", "2026-12-03"],
      ["WO-4", "2026-12-04"],
    ]);
    expect(p.leftOut).toEqual([]);
    expect(usageOf(p, "2026-12-03")).toEqual({ date: "2026-12-03", rank: "second-engineer", available: 12, used: 12 });
    expect(usageOf(p, "2026-12-04")).toEqual({ date: "2026-12-04", rank: "second-engineer", available: 12, used: 4 });
    expect(p.items[0]!.reason).toBe("Its window is open (due on 10 Dec); 4 h of second engineer on 3 Dec.");
  });

  it("leaves out a job larger than any day, though the stay has more hours in all", () => {
    // 14 h > 12 h a day; the two days hold 24 h, but a job is never split across days. 12 h fits exactly.
    const p = proposeWorkPackage(
      input({ candidates: [wo("WO-1", { estimatedManHours: 14 }), wo("WO-2", { estimatedManHours: 12 })] }),
    );
    expect(out(p)).toEqual([["WO-1", "larger-than-any-day"]]);
    expect(p.leftOut[0]!.message).toBe(
      "Its window is open (due on 10 Dec), but it needs 14 h of second engineer, more than the 12 h a day on board, and a job is not split across days.",
    );
    expect(placed(p)).toEqual([["WO-2", "2026-12-03"]]);
  });

  it("counts two ranks on the same days independently", () => {
    // 8 h each of second engineer (SE) and motorman (MM) a day.
    // WO-1 SE 6 h → 3 Dec (SE 2 h left). WO-2 MM 6 h → 3 Dec (MM 2 h left).
    // WO-3 SE 4 h > 2 h → 4 Dec (SE 4 h left). WO-4 MM 2 h = 2 h → 3 Dec (MM 0 h left).
    // WO-5 electrician: not in the crew. WO-6 fourth engineer: on the list with 0 h a day.
    const p = proposeWorkPackage(
      input({
        crew: [
          { rank: "second-engineer", manHoursPerDay: 8 },
          { rank: "motorman", manHoursPerDay: 8 },
          { rank: "fourth-engineer", manHoursPerDay: 0 },
        ],
        candidates: [
          wo("WO-1", { estimatedManHours: 6 }),
          wo("WO-2", { estimatedManHours: 6, rank: "motorman" }),
          wo("WO-3", { estimatedManHours: 4 }),
          wo("WO-4", { estimatedManHours: 2, rank: "motorman" }),
          wo("WO-5", { estimatedManHours: 1, rank: "electrician" }),
          wo("WO-6", { estimatedManHours: 1, rank: "fourth-engineer" }),
        ],
      }),
    );
    expect(placed(p)).toEqual([
      ["WO-1", "2026-12-03"],
      ["WO-2", "2026-12-03"],
      ["WO-3", "2026-12-04"],
      ["WO-4", "2026-12-03"],
    ]);
    expect(p.usage.map((u) => [u.date, u.rank, u.used, u.available])).toEqual([
      ["2026-12-03", "second-engineer", 6, 8],
      ["2026-12-03", "motorman", 8, 8],
      ["2026-12-03", "fourth-engineer", 0, 0],
      ["2026-12-04", "second-engineer", 4, 8],
      ["2026-12-04", "motorman", 0, 8],
      ["2026-12-04", "fourth-engineer", 0, 0],
    ]);
    expect(out(p)).toEqual([
      ["WO-5", "no-rank-on-board"],
      ["WO-6", "no-rank-on-board"],
    ]);
    expect(p.leftOut[0]!.message).toContain("no electrician is on board for this stay (it needs 1 h)");
    expect(p.leftOut[1]!.message).toContain("the fourth engineer has no hours for maintenance in this stay");
  });

  it("adds up two crew entries of one rank, and fits a 0 h job on a full day", () => {
    // 5 h + 3 h of motorman = 8 h a day; WO-1 of 8 h fills 3 Dec; WO-2 of 0 h still goes on 3 Dec.
    const p = proposeWorkPackage(
      input({
        stay: { days: ["2026-12-03"] },
        crew: [
          { rank: "motorman", manHoursPerDay: 5 },
          { rank: "motorman", manHoursPerDay: 3 },
        ],
        candidates: [
          wo("WO-1", { rank: "motorman", estimatedManHours: 8 }),
          wo("WO-2", { rank: "motorman", estimatedManHours: 0 }),
        ],
      }),
    );
    expect(placed(p)).toEqual([
      ["WO-1", "2026-12-03"],
      ["WO-2", "2026-12-03"],
    ]);
    expect(p.usage).toEqual([{ date: "2026-12-03", rank: "motorman", available: 8, used: 8 }]);
  });

  it("counts in tenths, so 0.1 h jobs fill 0.3 h exactly (no float overrun)", () => {
    // 0.1 + 0.2 is 0.30000000000000004 in floating point; in tenths it is 1 + 2 = 3 of 3.
    const p = proposeWorkPackage(
      input({
        stay: { days: ["2026-12-03"] },
        crew: [{ rank: "electrician", manHoursPerDay: 0.3 }],
        candidates: [
          wo("WO-1", { rank: "electrician", estimatedManHours: 0.1 }),
          wo("WO-2", { rank: "electrician", estimatedManHours: 0.2 }),
          wo("WO-3", { rank: "electrician", estimatedManHours: 0.1 }),
        ],
      }),
    );
    expect(placed(p)).toEqual([
      ["WO-1", "2026-12-03"],
      ["WO-2", "2026-12-03"],
    ]);
    expect(out(p)).toEqual([["WO-3", "no-capacity-for-rank"]]);
    expect(p.usage[0]!.used).toBe(0.3);
  });
});

describe("proposeWorkPackage: engine stops", () => {
  const stopJob = (number: string, hours: number, day: number) =>
    wo(number, {
      state: "scheduled",
      needsEngineStop: true,
      estimatedManHours: hours,
      dueAt: utc(`2026-12-${String(day).padStart(2, "0")}T12:00`),
    });

  it("leaves out an engine-stop job when no immobilisation is allowed", () => {
    const noHours = proposeWorkPackage(
      input({ stay: { immobilisationHours: 0 }, candidates: [stopJob("WO-1", 2, 5), wo("WO-2")] }),
    );
    expect(out(noHours)).toEqual([["WO-1", "engine-stop-not-allowed"]]);
    expect(noHours.leftOut[0]!.tier).toBe("engine-stop");
    expect(noHours.leftOut[0]!.message).toBe(
      "Needs the engine stopped and falls due on 5 Dec, before the next port stay (20 Dec), but it needs the engine stopped, and no immobilisation time is allowed in this stay.",
    );
    expect(placed(noHours)).toEqual([["WO-2", "2026-12-03"]]);
    expect(noHours.immobilisation).toEqual({ allowed: 0, used: 0 });

    const mayNotStop = proposeWorkPackage(
      input({ stay: { engineMayStop: false }, candidates: [stopJob("WO-1", 0, 5)] }),
    );
    expect(out(mayNotStop)).toEqual([["WO-1", "engine-stop-not-allowed"]]);
    expect(mayNotStop.leftOut[0]!.message).toContain("the engine may not stop in this stay");
    expect(mayNotStop.immobilisation).toEqual({ allowed: 0, used: 0 });
  });

  it("spends the immobilisation budget in priority order until it runs out", () => {
    // 10 h allowed. WO-1 6 h (due 5 Dec) → 10 − 6 = 4 h left. WO-2 5 h (due 6 Dec) > 4 h → left out.
    // WO-3 4 h (due 7 Dec) ≤ 4 h → in, 0 h left. WO-4 11 h (due 8 Dec) is more than the whole 10 h.
    // Second engineer on 3 Dec: 6 + 4 = 10 of 12 h, so every placed job goes on 3 Dec.
    const p = proposeWorkPackage(
      input({
        stay: { immobilisationHours: 10 },
        candidates: [stopJob("WO-4", 11, 8), stopJob("WO-3", 4, 7), stopJob("WO-2", 5, 6), stopJob("WO-1", 6, 5)],
      }),
    );
    expect(placed(p)).toEqual([
      ["WO-1", "2026-12-03"],
      ["WO-3", "2026-12-03"],
    ]);
    expect(out(p)).toEqual([
      ["WO-2", "exceeds-immobilisation"],
      ["WO-4", "exceeds-immobilisation"],
    ]);
    expect(p.immobilisation).toEqual({ allowed: 10, used: 10 });
    expect(p.items[0]!.reason).toBe(
      "Needs the engine stopped and falls due on 5 Dec, before the next port stay (20 Dec); 6 h of second engineer on 3 Dec, with the engine stopped (6 h of the 10 h immobilisation used).",
    );
    expect(p.leftOut[0]!.message).toContain(
      "it needs 5 h with the engine stopped, and only 4 h of the 10 h immobilisation is left",
    );
    expect(p.leftOut[1]!.message).toContain(
      "it needs 11 h with the engine stopped, more than the 10 h of immobilisation allowed",
    );
  });
});

describe("proposeWorkPackage: tiers and order", () => {
  it("gives the capacity to a tier-1 job over an earlier-listed, critical tier-3 job", () => {
    // One day, 8 h. WO-9 (window open, critical, 8 h) is listed first but is tier 3; WO-1 goes out of
    // tolerance on 14 Dec, before the next stay on 20 Dec → tier 1, takes the 8 h; WO-9 finds 0 h left.
    const p = proposeWorkPackage(
      input({
        stay: { days: ["2026-12-03"] },
        crew: [{ rank: "second-engineer", manHoursPerDay: 8 }],
        candidates: [
          wo("WO-9", { critical: true, estimatedManHours: 8, dueAt: utc("2026-12-04T00:00") }),
          wo("WO-1", { state: "scheduled", estimatedManHours: 8, outOfToleranceAt: utc("2026-12-14T00:00") }),
        ],
      }),
    );
    expect(p.items).toEqual([
      {
        workOrderId: expect.stringContaining("WO-1"),
        number: "WO-1",
        date: "2026-12-03",
        rank: "second-engineer",
        manHours: 8,
        needsEngineStop: false,
        tier: "would-go-out-of-tolerance",
        reason: "Goes out of tolerance on 14 Dec, before the next port stay (20 Dec); 8 h of second engineer on 3 Dec.",
      },
    ]);
    expect(p.leftOut).toEqual([
      {
        workOrderId: expect.stringContaining("WO-9"),
        number: "WO-9",
        tier: "urgency",
        reason: "no-capacity-for-rank",
        message:
          "Its window is open (due on 4 Dec) — critical, but no day of the stay it may go on has 8 h of second engineer left (at most 0 h), taken by work ranked before it.",
      },
    ]);
  });

  it("puts engine-stop jobs before urgency, and orders inside a tier by state, critical, class, date, number", () => {
    const states: [string, PlanningState, Partial<Candidate>][] = [
      ["WO-0001", "scheduled", { dueAt: utc("2026-12-10T00:00") }],
      ["WO-0002", "late", { dueAt: utc("2026-12-01T00:00") }],
      ["WO-0003", "window-open", { critical: true, dueAt: utc("2026-12-12T00:00") }],
      ["WO-0004", "window-open", { classRelated: true, dueAt: utc("2026-12-09T00:00") }],
      ["WO-0006", "window-open", { dueAt: utc("2026-12-08T00:00") }],
      ["WO-0005", "window-open", { dueAt: utc("2026-12-08T00:00") }],
      ["WO-0007", "deferred", { dueAt: utc("2026-12-07T00:00") }],
      ["WO-0008", "scheduled", { needsEngineStop: true, dueAt: utc("2026-12-19T00:00") }],
      ["WO-0009", "out-of-tolerance", {}],
    ];
    const p = proposeWorkPackage(
      input({ candidates: states.map(([n, state, over]) => wo(n, { state, estimatedManHours: 1, ...over })) }),
    );
    expect(p.items.map((i) => [i.number, i.tier])).toEqual([
      ["WO-0009", "would-go-out-of-tolerance"],
      ["WO-0008", "engine-stop"],
      ["WO-0002", "urgency"],
      ["WO-0003", "urgency"],
      ["WO-0004", "urgency"],
      ["WO-0005", "urgency"],
      ["WO-0006", "urgency"],
      ["WO-0007", "urgency"],
      ["WO-0001", "urgency"],
    ]);
    const reasons = Object.fromEntries(p.items.map((i) => [i.number, i.reason]));
    expect(reasons["WO-0009"]).toBe("Already out of tolerance; 1 h of second engineer on 3 Dec.");
    expect(reasons["WO-0002"]).toBe("Late (was due on 1 Dec); 1 h of second engineer on 3 Dec.");
    expect(reasons["WO-0004"]).toBe(
      "Its window is open (due on 9 Dec) — class-related; 1 h of second engineer on 3 Dec.",
    );
    expect(reasons["WO-0007"]).toBe(
      "Deferred, and falls due on 7 Dec, before the next port stay (20 Dec); 1 h of second engineer on 3 Dec.",
    );
  });
});

describe("proposeWorkPackage: planning windows", () => {
  it("keeps each job within its [planFrom, planUntil]", () => {
    // Days 3–5 Dec, 8 h a day. WO-A (critical, 6 h) → 3 Dec, 2 h left there.
    // WO-B (planFrom 4 Dec) → 4 Dec although 3 Dec has room. WO-C (planUntil 3 Dec, 4 h) > 2 h → no capacity,
    // though 4 and 5 Dec are free. WO-D opens 8 Dec, after the stay. WO-E's last day was 1 Dec.
    const p = proposeWorkPackage(
      input({
        stay: { days: ["2026-12-03", "2026-12-04", "2026-12-05"], departsAt: utc("2026-12-05T18:00") },
        crew: [{ rank: "second-engineer", manHoursPerDay: 8 }],
        candidates: [
          wo("WO-A", { critical: true, estimatedManHours: 6 }),
          wo("WO-B", { estimatedManHours: 2, planFrom: "2026-12-04" }),
          wo("WO-C", { planUntil: "2026-12-03" }),
          wo("WO-D", { state: "scheduled", dueAt: utc("2026-12-15T00:00"), planFrom: "2026-12-08" }),
          wo("WO-E", { state: "out-of-tolerance", outOfToleranceAt: utc("2026-12-02T00:00"), planUntil: "2026-12-01" }),
        ],
      }),
    );
    expect(placed(p)).toEqual([
      ["WO-A", "2026-12-03"],
      ["WO-B", "2026-12-04"],
    ]);
    expect(out(p)).toEqual([
      ["WO-E", "past-grace"],
      ["WO-C", "no-capacity-for-rank"],
      ["WO-D", "window-not-open"],
    ]);
    const messages = Object.fromEntries(p.leftOut.map((l) => [l.number, l.message]));
    expect(messages["WO-D"]).toBe(
      "Falls due on 15 Dec, before the next port stay (20 Dec), but its window opens on 8 Dec, after the stay (last day 5 Dec); consider an early completion or a deferral.",
    );
    expect(messages["WO-E"]).toBe(
      "Out of tolerance since 2 Dec, but it may be planned only until 1 Dec, before the stay begins (3 Dec); do it before arrival or request a deferral.",
    );
    expect(messages["WO-C"]).toContain("(at most 2 h)");
  });
});

describe("proposeWorkPackage: the horizon", () => {
  const candidates = () => [
    wo("WO-1", { state: "scheduled", dueAt: utc("2026-12-19T00:00") }),
    wo("WO-2", { state: "scheduled", dueAt: utc("2026-12-20T06:00") }),
    wo("WO-3", { state: "scheduled", dueAt: utc("2027-01-10T00:00"), outOfToleranceAt: utc("2026-12-21T00:00") }),
    wo("WO-4", { state: "scheduled", dueAt: utc("2027-01-04T00:00") }),
  ];

  it("is the next stay's arrival, strictly before it", () => {
    // Due 19 Dec < 20 Dec 06:00 → in. Due exactly 20 Dec 06:00 → not before → not a candidate.
    // Out of tolerance 21 Dec, due 10 Jan → after the horizon → not a candidate.
    const p = proposeWorkPackage(input({ candidates: candidates() }));
    expect(p.horizon).toEqual(utc("2026-12-20T06:00"));
    expect(placed(p)).toEqual([["WO-1", "2026-12-03"]]);
    expect(p.leftOut).toEqual([]);
  });

  it("is the departure plus the look-ahead when no next stay is planned", () => {
    // 4 Dec 18:00 + 30 days = 3 Jan 2027 18:00: WO-1, WO-2 and WO-3 (out of tolerance 21 Dec) are in; WO-4 is not.
    const p = proposeWorkPackage(input({ nextStayArrivesAt: null, candidates: candidates() }));
    expect(p.horizon).toEqual(utc("2027-01-03T18:00"));
    expect(p.items.map((i) => [i.number, i.tier])).toEqual([
      ["WO-3", "would-go-out-of-tolerance"],
      ["WO-1", "urgency"],
      ["WO-2", "urgency"],
    ]);
    expect(p.items[0]!.reason).toBe(
      "Goes out of tolerance on 21 Dec, within the 30-day look-ahead (to 3 Jan 2027); 4 h of second engineer on 3 Dec.",
    );
    // 4 Dec 18:00 + 10 days = 14 Dec 18:00: none of them.
    const short = proposeWorkPackage(input({ nextStayArrivesAt: null, lookAheadDays: 10, candidates: candidates() }));
    expect(short.horizon).toEqual(utc("2026-12-14T18:00"));
    expect(short.items).toEqual([]);
  });

  it("names instants by the ship's day in the vessel's zone", () => {
    // 9 Dec 20:00 UTC is 10 Dec 04:00 in Singapore (UTC+8).
    const p = proposeWorkPackage(
      input({ timeZone: "Asia/Singapore", candidates: [wo("WO-1", { dueAt: utc("2026-12-09T20:00") })] }),
    );
    expect(p.items[0]!.reason).toBe("Its window is open (due on 10 Dec); 4 h of second engineer on 3 Dec.");
  });
});

describe("proposeWorkPackage: bad input", () => {
  it("refuses a stay without days or with days out of order, naming the field", () => {
    expect(() => proposeWorkPackage(input({ stay: { days: [] } }))).toThrow(AppError);
    try {
      proposeWorkPackage(input({ stay: { days: ["2026-12-04", "2026-12-03"] } }));
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(AppError);
      expect((error as AppError).errors).toEqual([
        { field: "stay.days.1", message: "The stay's days must be in order: 2026-12-03 follows 2026-12-04." },
      ]);
    }
  });
});

describe("proposeWorkPackage: properties", () => {
  const DAYS = Array.from({ length: 14 }, (_, i) => `2026-12-${String(i + 1).padStart(2, "0")}`);
  const RANKS = ["second-engineer", "third-engineer", "motorman", "electrician"];
  const STATES: PlanningState[] = ["scheduled", "window-open", "late", "out-of-tolerance", "deferred"];
  const tenthsOf = (max: number) => fc.integer({ min: 0, max: max * 10 }).map((t) => t / 10);
  const instant = fc.option(
    fc.integer({ min: 0, max: 40 * 24 }).map((h) => new Date(Date.UTC(2026, 10, 25) + h * 3_600_000)),
  );
  const day = fc.option(fc.constantFrom(...DAYS));
  const candidate = fc.record({
    number: fc.constantFrom("WO-1", "WO-2", "WO-3"),
    title: fc.constant("Job"),
    state: fc.constantFrom(...STATES),
    rank: fc.constantFrom(...RANKS, "fitter"),
    estimatedManHours: tenthsOf(14),
    needsEngineStop: fc.boolean(),
    critical: fc.boolean(),
    classRelated: fc.boolean(),
    dueAt: instant,
    outOfToleranceAt: instant,
    planFrom: day,
    planUntil: day,
  });
  const anyInput: fc.Arbitrary<ProposalInput> = fc
    .record({
      start: fc.integer({ min: 2, max: 8 }),
      length: fc.integer({ min: 1, max: 4 }),
      engineMayStop: fc.boolean(),
      immobilisationHours: tenthsOf(24),
      nextStay: instant,
      lookAheadDays: fc.option(fc.integer({ min: 0, max: 60 }), { nil: undefined }),
      crew: fc.array(fc.record({ rank: fc.constantFrom(...RANKS), manHoursPerDay: tenthsOf(16) }), { maxLength: 5 }),
      candidates: fc.array(candidate, { maxLength: 30 }),
    })
    .map((r) => {
      const days = DAYS.slice(r.start, r.start + r.length);
      return {
        stay: {
          days,
          departsAt: new Date(`${days[days.length - 1]}T18:00:00Z`),
          engineMayStop: r.engineMayStop,
          immobilisationHours: r.immobilisationHours,
        },
        nextStayArrivesAt: r.nextStay,
        lookAheadDays: r.lookAheadDays,
        crew: r.crew,
        candidates: r.candidates.map((c, i) => ({ ...c, id: `c${i}` })),
      };
    });
  const tenths = (h: number) => Math.round(h * 10);

  it("never exceeds a day's rank capacity or the immobilisation, and places each work order at most once", () => {
    fc.assert(
      fc.property(anyInput, (inp) => {
        const p = proposeWorkPackage(inp);
        const byId = new Map(inp.candidates.map((c) => [c.id, c]));
        for (const u of p.usage) expect(u.used).toBeLessThanOrEqual(u.available);
        expect(p.immobilisation.used).toBeLessThanOrEqual(p.immobilisation.allowed);
        expect(p.immobilisation.allowed).toBeLessThanOrEqual(inp.stay.engineMayStop ? inp.stay.immobilisationHours : 0);

        const ids = [...p.items, ...p.leftOut].map((x) => x.workOrderId);
        expect(new Set(ids).size).toBe(ids.length);
        // Out of tolerance, late and window-open are always candidates, so each is proposed or left out.
        for (const c of inp.candidates) {
          if (c.state !== "scheduled" && c.state !== "deferred") expect(ids).toContain(c.id);
        }

        const sums = new Map<string, number>();
        let stopped = 0;
        for (const item of p.items) {
          const c = byId.get(item.workOrderId)!;
          expect(inp.stay.days).toContain(item.date);
          if (c.planFrom) expect(item.date >= c.planFrom).toBe(true);
          if (c.planUntil) expect(item.date <= c.planUntil).toBe(true);
          expect(item.rank).toBe(c.rank);
          const key = `${item.date}|${item.rank}`;
          sums.set(key, (sums.get(key) ?? 0) + tenths(item.manHours));
          if (item.needsEngineStop) stopped += tenths(item.manHours);
        }
        // The usage is the sum of the items, for every day × crew rank.
        const ranks = new Set(inp.crew.map((c) => c.rank));
        expect(p.usage).toHaveLength(inp.stay.days.length * ranks.size);
        for (const u of p.usage) expect(tenths(u.used)).toBe(sums.get(`${u.date}|${u.rank}`) ?? 0);
        for (const key of sums.keys()) expect(p.usage.some((u) => `${u.date}|${u.rank}` === key)).toBe(true);
        expect(tenths(p.immobilisation.used)).toBe(stopped);

        // Left out for capacity: no day it may go on has its hours left even at the end (days only fill up).
        for (const l of p.leftOut.filter((x) => x.reason === "no-capacity-for-rank")) {
          const c = byId.get(l.workOrderId)!;
          for (const u of p.usage.filter((x) => x.rank === c.rank)) {
            const open = (!c.planFrom || u.date >= c.planFrom) && (!c.planUntil || u.date <= c.planUntil);
            if (open) expect(tenths(u.available) - tenths(u.used)).toBeLessThan(tenths(c.estimatedManHours));
          }
        }
      }),
      { numRuns: 400 },
    );
  });

  it("does not depend on the order the work orders come in", () => {
    fc.assert(
      fc.property(
        anyInput.chain((inp) =>
          fc.shuffledSubarray(inp.candidates, { minLength: inp.candidates.length }).map((s) => [inp, s] as const),
        ),
        ([inp, shuffled]) => {
          expect(proposeWorkPackage({ ...inp, candidates: shuffled })).toEqual(proposeWorkPackage(inp));
        },
      ),
      { numRuns: 200 },
    );
  });
});
