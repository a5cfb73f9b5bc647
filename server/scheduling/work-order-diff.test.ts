import { describe, expect, it } from "vitest";
import type { WorkOrderRow, WrittenFields } from "@/server/work-orders/fields";
import { planCorrective, planWorkOrder } from "./plan-work-order";
import { presetToleranceRules } from "./presets";
import { correctiveFields, diffWorkOrders, type PlannedWorkOrder, routineFields } from "./work-order-diff";

const now = new Date("2026-06-15T04:00:00Z");
const vessel = { code: "HR", workOrderSeq: 41 };

const job = {
  componentId: "component-1",
  title: "Overhaul fuel pump",
  rank: "second-engineer",
  team: [{ rank: "second-engineer", count: 1 }],
  elapsedHours: 6,
  estimatedManHours: 6,
  needsPort: false,
  needsEngineStop: true,
  portEvent: null,
  portEventHours: null,
  critical: false,
  classRelated: true,
};

// The hours example of plan-work-order.test.ts, worked by hand: done at 12,000 h, every 2,000 h,
// now 13,200 h at 20 h/day → due 14,000 h, projected 25 July, window from 13,800 h, grace to 14,100 h.
const plan = planWorkOrder({
  routine: {
    intervalHours: 2000,
    calendarRule: null,
    anchored: false,
    anchorDate: null,
    baseline: null,
    toleranceRuleId: null,
  },
  rules: presetToleranceRules(),
  last: { at: new Date("2026-01-01T00:00:00Z"), counterHours: 12000, previousCalendarDue: null },
  counter: { totalHours: 13200, readAt: now, hoursPerDay: 20 },
  now,
  timeZone: "UTC",
});
const fields = routineFields(job, "counter-1", plan);

/** The open row the worker wrote last run for these figures (fresh Date objects, as a query gives). */
function row(overrides: Partial<WorkOrderRow> = {}): WorkOrderRow {
  const copy = Object.fromEntries(
    Object.entries(fields).map(([k, v]) => [k, v instanceof Date ? new Date(v.getTime()) : v]),
  ) as WrittenFields;
  return {
    id: "wo-1",
    companyId: "company-1",
    vesselId: "vessel-1",
    routineId: "routine-1",
    number: "WO-HR-00007",
    occurrence: 7,
    kind: "planned",
    state: "scheduled",
    stateChangedAt: new Date("2026-06-01T00:00:00Z"),
    plannedDate: null,
    deferredDueDate: null,
    deferredDueHours: null,
    computedAt: new Date("2026-06-14T04:00:00Z"),
    completedAt: null,
    createdAt: new Date("2026-01-01T00:00:00Z"),
    ...copy,
    ...overrides,
  };
}

describe("routineFields", () => {
  it("copies the routine's job and the plan's figures, the hours window included", () => {
    expect(fields).toMatchObject({
      ...job,
      counterId: "counter-1",
      dueHours: 14000,
      remainingHours: 800,
      governing: "hours",
      windowOpensHours: 13800,
      graceEndsHours: 14100,
      windowOpensAt: null,
      graceEndsAt: null,
    });
    expect(fields.projectedDate?.toISOString()).toBe("2026-07-25T04:00:00.000Z");
  });

  it("keeps remaining days to the tenth, as the column does", () => {
    expect(routineFields(job, null, { ...plan, remainingDays: 40.26 }).remainingDays).toBe(40.3);
    expect(routineFields(job, null, { ...plan, remainingDays: null }).remainingDays).toBeNull();
  });
});

describe("diffWorkOrders", () => {
  it("numbers new work orders on from the vessel's sequence, in the order planned", () => {
    const planned: PlannedWorkOrder[] = [
      { existing: null, routineId: "routine-1", occurrence: 8, state: "scheduled", fields },
      { existing: null, routineId: "routine-2", occurrence: 1, state: "window-open", fields },
    ];
    const diff = diffWorkOrders(planned, vessel);
    expect(diff.inserts.map((i) => [i.routineId, i.number, i.occurrence, i.state])).toEqual([
      ["routine-1", "WO-HR-00042", 8, "scheduled"],
      ["routine-2", "WO-HR-00043", 1, "window-open"],
    ]);
    expect(diff.sequence).toBe(43);
    expect(diff.updates).toEqual([]);
    expect(diff.stateChanges).toEqual([]);
  });

  it("leaves an open row alone when its state and figures are as planned, instants compared by time", () => {
    const diff = diffWorkOrders([{ existing: row(), state: "scheduled", fields }], vessel);
    expect(diff).toEqual({ inserts: [], updates: [], stateChanges: [], sequence: 41 });
  });

  it("updates a row whose due instant moved by a millisecond, without a state change", () => {
    const moved = new Date(fields.projectedDate!.getTime() - 1);
    const diff = diffWorkOrders([{ existing: row({ projectedDate: moved }), state: "scheduled", fields }], vessel);
    expect(diff.updates).toEqual([{ id: "wo-1", state: "scheduled", stateChanged: false, ...fields }]);
    expect(diff.stateChanges).toEqual([]);
  });

  it("updates a row whose figure went from none to a value, or a number changed", () => {
    const fromNone = diffWorkOrders([{ existing: row({ projectedDate: null }), state: "scheduled", fields }], vessel);
    expect(fromNone.updates).toHaveLength(1);
    const hours = diffWorkOrders([{ existing: row({ dueHours: 13999.9 }), state: "scheduled", fields }], vessel);
    expect(hours.updates.map((u) => u.dueHours)).toEqual([14000]);
  });

  it("records the change when the state moves, even with the same figures", () => {
    const diff = diffWorkOrders([{ existing: row(), state: "window-open", fields }], vessel);
    expect(diff.updates).toEqual([{ id: "wo-1", state: "window-open", stateChanged: true, ...fields }]);
    expect(diff.stateChanges).toEqual([{ workOrderId: "wo-1", fromState: "scheduled", toState: "window-open" }]);
    expect(diff.sequence).toBe(41);
  });

  it("mixes updates and inserts in the order planned", () => {
    const diff = diffWorkOrders(
      [
        { existing: null, routineId: "routine-3", occurrence: 1, state: "scheduled", fields },
        { existing: row({ id: "wo-2", state: "late" }), state: "out-of-tolerance", fields },
        { existing: row({ id: "wo-3" }), state: "scheduled", fields },
        { existing: row({ id: "wo-4", title: "Old title" }), state: "scheduled", fields },
      ],
      vessel,
    );
    expect(diff.inserts.map((i) => i.number)).toEqual(["WO-HR-00042"]);
    expect(diff.updates.map((u) => [u.id, u.stateChanged])).toEqual([
      ["wo-2", true],
      ["wo-4", false],
    ]);
    expect(diff.stateChanges).toEqual([{ workOrderId: "wo-2", fromState: "late", toState: "out-of-tolerance" }]);
  });
});

describe("correctiveFields", () => {
  it("keeps what the follow-up was raised with and moves only its calendar figures", () => {
    // Raised 10 June, due 14 June (UTC): open from the 10th, due end of the 14th, 7 days' grace.
    const followUp = row({
      routineId: null,
      kind: "corrective",
      title: "Replace cracked gauge glass",
      dueDate: new Date("2026-06-14T23:59:59.999Z"),
      createdAt: new Date("2026-06-10T08:00:00Z"),
    });
    const corrective = planCorrective({
      dueDate: followUp.dueDate!,
      raisedAt: followUp.createdAt,
      deferral: null,
      now,
      timeZone: "UTC",
    });
    const result = correctiveFields(followUp, corrective);
    expect(result).toMatchObject({
      title: "Replace cracked gauge glass",
      rank: "second-engineer",
      dueHours: 14000,
      remainingDays: -1,
      planFrom: "2026-06-10",
      planUntil: "2026-06-21",
    });
    expect(result.windowOpensAt?.toISOString()).toBe("2026-06-10T00:00:00.000Z");
    expect(result.graceEndsAt?.toISOString()).toBe("2026-06-21T23:59:59.999Z");
    expect(corrective.state).toBe("late");
  });
});
