// Routines tied to a port stay's event, worked by hand. SOLAS chapter V, regulation 26 (memory,
// ../shared/SOURCES.md): the steering gear is checked and tested within 12 hours before departure.
import { describe, expect, it } from "vitest";
import { type EventTie, planEventWorkOrder } from "./plan-event-work-order";

const kl = (local: string) => new Date(`${local}:00+08:00`);
const steering: EventTie = { event: "departure", withinHours: 12 };
const stays = [
  { arrivesAt: kl("2026-12-20T07:00"), departsAt: kl("2026-12-21T19:00") },
  { arrivesAt: kl("2026-12-10T07:00"), departsAt: kl("2026-12-11T19:00") },
];
const made = kl("2026-12-01T00:00");
const plan = (now: Date, lastDone: Date | null, tie = steering) =>
  planEventWorkOrder({ tie, stays, createdAt: made, lastDone, now, timeZone: "Asia/Kuala_Lumpur" });

describe("a routine tied to the departure", () => {
  it("falls due at the next departure, its window the 12 h before it, no grace", () => {
    const p = plan(kl("2026-12-05T12:00"), null);
    expect(p).toMatchObject({
      dueDate: kl("2026-12-11T19:00"),
      calendarWindow: { opensAt: kl("2026-12-11T07:00"), dueAt: kl("2026-12-11T19:00"), graceEndsAt: kl("2026-12-11T19:00") },
      state: "scheduled",
      planFrom: "2026-12-11",
      planUntil: "2026-12-11",
      outOfToleranceAt: kl("2026-12-11T19:00"),
      remainingDays: 6,
      governing: "calendar",
    });
  });

  it("is open on the departure day, and out of tolerance once the ship has sailed untested", () => {
    expect(plan(kl("2026-12-11T08:00"), null)?.state).toBe("window-open");
    expect(plan(kl("2026-12-11T19:01"), null)?.state).toBe("out-of-tolerance");
  });

  it("moves to the next stay's departure once done for this one", () => {
    const p = plan(kl("2026-12-11T20:00"), kl("2026-12-11T09:30"));
    expect(p?.dueDate).toEqual(kl("2026-12-21T19:00"));
    expect(p?.state).toBe("scheduled");
  });

  it("counts a test done too early (before the window) for nothing", () => {
    expect(plan(kl("2026-12-11T08:00"), kl("2026-12-11T05:00"))?.dueDate).toEqual(kl("2026-12-11T19:00"));
  });

  it("waits for a stay to be planned when none is left", () => {
    expect(plan(kl("2026-12-22T00:00"), kl("2026-12-21T10:00"))).toBeNull();
  });
});

describe("a routine tied to the arrival", () => {
  it("opens at the arrival and falls due N h after it, never after the departure", () => {
    const p = plan(kl("2026-12-05T12:00"), null, { event: "arrival", withinHours: 6 });
    expect(p?.calendarWindow).toEqual({ opensAt: kl("2026-12-10T07:00"), dueAt: kl("2026-12-10T13:00"), graceEndsAt: kl("2026-12-10T13:00") });
    const long = plan(kl("2026-12-05T12:00"), null, { event: "arrival", withinHours: 48 });
    expect(long?.dueDate).toEqual(kl("2026-12-11T19:00"));
  });
});
