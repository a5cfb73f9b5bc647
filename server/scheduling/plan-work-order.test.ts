import { describe, expect, it } from "vitest";
import { planCorrective, planWorkOrder, type PlannedRoutine } from "./plan-work-order";
import { presetToleranceRules } from "./presets";

const rules = presetToleranceRules();
const now = new Date("2026-06-15T04:00:00Z");
const routine = (r: Partial<PlannedRoutine>): PlannedRoutine => ({
  intervalHours: null,
  calendarRule: null,
  anchored: false,
  anchorDate: null,
  baseline: null,
  toleranceRuleId: null,
  ...r,
});

// Worked examples computed by hand with the presets' hours rule (window 10 % of the interval,
// grace 5 %, capped at 500 h: PRODUCT.md's example).
describe("planWorkOrder", () => {
  it("hours: done at 12,000 h, every 2,000 h, now 13,200 h at 20 h/day → due 14,000 h, 40 days, scheduled", () => {
    const plan = planWorkOrder({
      routine: routine({ intervalHours: 2000 }),
      rules,
      last: { at: new Date("2026-01-01T00:00:00Z"), counterHours: 12000, previousCalendarDue: null },
      counter: { totalHours: 13200, readAt: now, hoursPerDay: 20 },
      now,
      timeZone: "UTC",
    });
    expect(plan.dueHours).toBe(14000);
    expect(plan.remainingHours).toBe(800);
    expect(plan.projectedDate?.toISOString()).toBe("2026-07-25T04:00:00.000Z");
    expect(plan.hoursWindow).toEqual({ opensAtHours: 13800, dueHours: 14000, graceEndsHours: 14100 });
    expect(plan.state).toBe("scheduled");
    expect(plan.governing).toBe("hours");
  });

  it("hours: at 14,050 h the same routine is late, past 14,100 h out of tolerance", () => {
    const base = {
      routine: routine({ intervalHours: 2000 }),
      rules,
      last: { at: new Date("2026-01-01T00:00:00Z"), counterHours: 12000, previousCalendarDue: null },
      now,
      timeZone: "UTC",
    };
    expect(planWorkOrder({ ...base, counter: { totalHours: 13900, readAt: now, hoursPerDay: 20 } }).state).toBe(
      "window-open",
    );
    expect(planWorkOrder({ ...base, counter: { totalHours: 14050, readAt: now, hoursPerDay: 20 } }).state).toBe("late");
    expect(planWorkOrder({ ...base, counter: { totalHours: 14100.1, readAt: now, hoursPerDay: 20 } }).state).toBe(
      "out-of-tolerance",
    );
  });

  it("whichever first: a monthly calendar rule beats a far hours limit", () => {
    const plan = planWorkOrder({
      routine: routine({ intervalHours: 2000, calendarRule: "FREQ=MONTHLY" }),
      rules,
      last: { at: new Date("2026-06-01T04:00:00Z"), counterHours: 13000, previousCalendarDue: null },
      counter: { totalHours: 13200, readAt: now, hoursPerDay: 20 },
      now,
      timeZone: "UTC",
    });
    expect(plan.governing).toBe("calendar");
    expect(plan.calendarDue!.toISOString().slice(0, 10)).toBe("2026-07-01");
  });

  it("anchored yearly item done inside its window keeps the anniversary (HSSC A.1104(29) renewal rule)", () => {
    // Anniversary 15 April 2026, done 1 April 2026 (inside 3 months before) → next 15 April 2027.
    const plan = planWorkOrder({
      routine: routine({ calendarRule: "FREQ=YEARLY", anchored: true, anchorDate: "2026-04-15" }),
      rules,
      last: {
        at: new Date("2026-04-01T10:00:00Z"),
        counterHours: 0,
        previousCalendarDue: new Date("2026-04-15T23:59:59Z"),
      },
      counter: null,
      now,
      timeZone: "UTC",
    });
    expect(plan.calendarDue!.toISOString().slice(0, 10)).toBe("2027-04-15");
    expect(plan.state).toBe("scheduled");
  });

  it("anchored yearly item never done: the window 16 Jan–15 Jul around 15 April (IACS booklet)", () => {
    const plan = planWorkOrder({
      routine: routine({ calendarRule: "FREQ=YEARLY", anchored: true, anchorDate: "2026-04-15" }),
      rules,
      last: null,
      counter: null,
      now,
      timeZone: "UTC",
    });
    expect(plan.calendarWindow!.opensAt.toISOString().slice(0, 10)).toBe("2026-01-16");
    expect(plan.calendarWindow!.graceEndsAt.toISOString().slice(0, 10)).toBe("2026-07-15");
    // 15 June is after the anniversary, inside the grace: on time for class (HSSC, IMO Res.
    // A.1104(29) 4.2.1, within 3 months after the anniversary), so the window is still open.
    expect(plan.state).toBe("window-open");
    // Under a company rule that counts the grace late, the same day is late.
    const plain = rules.map((r) => ({ ...r, graceOnTime: false }));
    expect(
      planWorkOrder({
        routine: routine({ calendarRule: "FREQ=YEARLY", anchored: true, anchorDate: "2026-04-15" }),
        rules: plain,
        last: null,
        counter: null,
        now,
        timeZone: "UTC",
      }).state,
    ).toBe("late");
  });
});

// Worked by hand, UTC vessel, the presets (hours: window 10 % capped at 500 h, grace 5 %;
// annual: 3 months either side).
describe("plan range", () => {
  it("dates an hours window by the running rate: 13,800–14,100 h from 13,200 h at 20 h/day", () => {
    const plan = planWorkOrder({
      routine: routine({ intervalHours: 2000 }),
      rules,
      last: { at: new Date("2026-01-01T00:00:00Z"), counterHours: 12000, previousCalendarDue: null },
      counter: { totalHours: 13200, readAt: now, hoursPerDay: 20 },
      now,
      timeZone: "UTC",
    });
    // 600 h to the window at 20 h/day = 30 days → 15 July; 900 h to the grace end = 45 days → 30 July.
    expect(plan.planFrom).toBe("2026-07-15");
    expect(plan.planUntil).toBe("2026-07-30");
    expect(plan.outOfToleranceAt?.toISOString()).toBe("2026-07-30T04:00:00.000Z");
  });

  it("takes the earlier window and the earlier grace end when both limits apply", () => {
    const plan = planWorkOrder({
      routine: routine({ intervalHours: 2000, calendarRule: "FREQ=MONTHLY" }),
      rules,
      last: { at: new Date("2026-06-01T04:00:00Z"), counterHours: 13000, previousCalendarDue: null },
      counter: { totalHours: 13200, readAt: now, hoursPerDay: 20 },
      now,
      timeZone: "UTC",
    });
    // Calendar due 1 July; hours due 15,000 h ≈ 15 Sep: the calendar window and grace come first.
    expect(plan.planFrom! <= "2026-07-01").toBe(true);
    expect(plan.planUntil).toBe(plan.calendarWindow && plan.calendarWindow.graceEndsAt.toISOString().slice(0, 10));
  });
});

describe("deferred work orders: the tolerance rules apply to the new limit", () => {
  const annual = {
    routine: routine({ calendarRule: "FREQ=YEARLY" }),
    rules,
    // Done 1 June 2025: due 1 June 2026, late on 15 June 2026 without the deferral.
    last: { at: new Date("2025-06-01T04:00:00Z"), counterHours: 0, previousCalendarDue: null },
    counter: null,
    timeZone: "UTC",
    deferral: { dueDate: new Date("2026-09-30T12:00:00Z"), dueHours: null },
  };

  it("a calendar deferral to 30 Sep: deferred now, late in October, out of tolerance after 30 Dec", () => {
    // Without the deferral the annual preset counts its grace on time (HSSC, IMO Res. A.1104(29)
    // 4.2.1); the deferral's date is a hard limit, late after it.
    expect(planWorkOrder({ ...annual, deferral: null, now }).state).toBe("window-open");
    const plan = planWorkOrder({ ...annual, now });
    expect(plan.state).toBe("deferred");
    // 3 months before 30 Sep is 30 Jun, so the window opens on 1 Jul; the grace ends 30 Dec.
    expect(plan.planFrom).toBe("2026-07-01");
    expect(plan.planUntil).toBe("2026-12-30");
    // 15 Jun → 30 Sep: 15 + 31 + 31 + 30 = 107 days.
    expect(plan.remainingDays).toBe(107);
    expect(plan.calendarDue?.toISOString().slice(0, 10)).toBe("2026-06-01"); // the computed due stays
    expect(planWorkOrder({ ...annual, now: new Date("2026-10-05T04:00:00Z") }).state).toBe("late");
    expect(planWorkOrder({ ...annual, now: new Date("2026-12-31T04:00:00Z") }).state).toBe("out-of-tolerance");
  });

  it("an hours deferral from 14,000 h to 14,600 h: window 14,400 h, grace to 14,700 h", () => {
    const base = {
      routine: routine({ intervalHours: 2000 }),
      rules,
      last: { at: new Date("2026-01-01T00:00:00Z"), counterHours: 12000, previousCalendarDue: null },
      now,
      timeZone: "UTC",
      deferral: { dueDate: null, dueHours: 14600 },
    };
    const at = (totalHours: number) => ({ totalHours, readAt: now, hoursPerDay: 20 });
    const plan = planWorkOrder({ ...base, counter: at(14050) });
    expect(plan.state).toBe("deferred");
    expect(plan.hoursWindow).toEqual({ opensAtHours: 14400, dueHours: 14600, graceEndsHours: 14700 });
    expect(plan.remainingHours).toBe(550);
    // 350 h to 14,400 h at 20 h/day = 17.5 days → 2 Jul 16:00; 650 h = 32.5 days → 17 Jul 16:00.
    expect(plan.planFrom).toBe("2026-07-02");
    expect(plan.planUntil).toBe("2026-07-17");
    expect(planWorkOrder({ ...base, counter: at(14650) }).state).toBe("late");
    expect(planWorkOrder({ ...base, counter: at(14700.1) }).state).toBe("out-of-tolerance");
  });
});

describe("corrective follow-ups", () => {
  const raised = {
    dueDate: new Date("2026-06-17T08:00:00Z"),
    raisedAt: new Date("2026-06-10T08:00:00Z"),
    timeZone: "UTC",
  };
  it("open from the day raised, late for a week past the due day, then out of tolerance", () => {
    const plan = planCorrective({ ...raised, now });
    expect(plan.state).toBe("window-open");
    expect(plan.planFrom).toBe("2026-06-10");
    expect(plan.planUntil).toBe("2026-06-24"); // 17 June + CORRECTIVE_GRACE_DAYS (7)
    expect(plan.remainingDays).toBe(2);
    expect(planCorrective({ ...raised, now: new Date("2026-06-20T00:00:00Z") }).state).toBe("late");
    expect(planCorrective({ ...raised, now: new Date("2026-06-25T00:00:00Z") }).state).toBe("out-of-tolerance");
  });
  it("a deferral's date takes the due day's place", () => {
    const deferral = { dueDate: new Date("2026-07-10T12:00:00Z"), dueHours: null };
    expect(planCorrective({ ...raised, deferral, now: new Date("2026-06-20T00:00:00Z") }).state).toBe("deferred");
    expect(planCorrective({ ...raised, deferral, now: new Date("2026-07-12T00:00:00Z") }).state).toBe("late");
  });
});

describe("a deferral names one limit; the other stays in force", () => {
  it("deferring the hours of a whichever-first job leaves its calendar limit deciding", () => {
    const base = {
      // Every 2,000 h or every month: done 1 June at 13,000 h, so due 1 July by the calendar.
      routine: routine({ intervalHours: 2000, calendarRule: "FREQ=MONTHLY" }),
      rules,
      last: { at: new Date("2026-06-01T04:00:00Z"), counterHours: 13000, previousCalendarDue: null },
      counter: { totalHours: 15050, readAt: now, hoursPerDay: 20 },
      timeZone: "UTC",
      deferral: { dueDate: null, dueHours: 16000 },
    };
    // On 15 June the hours (15,050 > 15,000 h) are late but deferred to 16,000 h; the calendar
    // limit (1 July) is not yet reached: deferred.
    expect(planWorkOrder({ ...base, now }).state).toBe("deferred");
    // On 20 July the monthly limit is past its grace (the monthly preset), deferral or not.
    const later = planWorkOrder({ ...base, now: new Date("2026-07-20T04:00:00Z") });
    expect(later.state).not.toBe("deferred");
    expect(later.calendarWindow?.dueAt.toISOString().slice(0, 10)).toBe("2026-07-01");
  });
});
