import { describe, expect, it } from "vitest";
import { planWorkOrder, type PlannedRoutine } from "./plan-work-order";
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
    // 15 June is after the anniversary, inside the grace: late.
    expect(plan.state).toBe("late");
  });
});
