import { describe, expect, it } from "vitest";
import { dueDigest } from "./schedule";
import {
  type DigestWorkOrder,
  digestRecipients,
  escalationRecipients,
  fleetSummaryRecipients,
  type Member,
  missingReadingsRecipients,
  selectDigest,
  splitEscalations,
  type StateChangeRow,
} from "./selection";

const SGT = "Asia/Singapore"; // UTC+8
// The digest of Wed 2 Dec at 06:00 SGT: changes in (30 Nov 22:00 UTC, 1 Dec 22:00 UTC], due 2–8 Dec.
const occasion = dueDigest(new Date("2026-12-01T22:05:00Z"), SGT, 6)!;

function wo(id: string, state: DigestWorkOrder["state"], dueDate: string | null, extra: Partial<DigestWorkOrder> = {}) {
  return {
    id,
    number: `WO-AST-${id}`,
    title: `Job ${id}`,
    state,
    dueDate: dueDate ? new Date(dueDate) : null,
    deferredDueDate: null,
    deferredDueHours: null,
    critical: false,
    classRelated: false,
    ...extra,
  } satisfies DigestWorkOrder;
}
const change = (workOrderId: string, toState: StateChangeRow["toState"], at: string): StateChangeRow => ({
  workOrderId,
  toState,
  changedAt: new Date(at),
});

describe("selectDigest", () => {
  it("lists the changes of its window and the work due in its 7 ship's days", () => {
    const workOrders = [
      wo("A", "out-of-tolerance", "2026-10-31T15:59:59.999Z"),
      wo("B", "late", "2026-11-28T15:59:59.999Z"),
      wo("C", "window-open", "2026-12-05T15:59:59.999Z"),
      wo("D", "out-of-tolerance", "2026-11-20T15:59:59.999Z"),
      wo("E", "done", "2026-12-03T15:59:59.999Z"),
      wo("F", "scheduled", "2026-12-08T15:59:59.999Z"),
      wo("G", "scheduled", "2026-12-08T16:00:00.000Z"),
      wo("H", "deferred", "2026-11-20T15:59:59.999Z", { deferredDueDate: new Date("2026-12-02T15:59:59.999Z") }),
      wo("I", "deferred", "2026-12-03T15:59:59.999Z", { deferredDueHours: 5000 }),
      wo("J", "scheduled", null),
      wo("K", "late", "2026-12-01T15:59:59.999Z"),
    ];
    const changes = [
      change("A", "out-of-tolerance", "2026-12-01T10:00:00Z"), // inside the window
      change("B", "late", "2026-11-30T22:00:00Z"), // exactly yesterday's cut-off: in yesterday's digest
      change("C", "window-open", "2026-12-01T22:00:00Z"), // exactly this cut-off: in this one
      change("D", "late", "2026-12-01T05:00:00Z"), // late inside the window …
      change("D", "out-of-tolerance", "2026-12-01T23:00:00Z"), // … out of tolerance after the cut-off: tomorrow's
      change("E", "window-open", "2026-12-01T08:00:00Z"), // opened, but done since
      change("J", "scheduled", "2026-12-01T08:00:00Z"), // not a state the digest reports
    ];
    const s = selectDigest({ occasion, timeZone: SGT, changes, workOrders });
    const ids = (list: { id: string }[]) => list.map((w) => w.id);
    expect(ids(s.outOfTolerance)).toEqual(["A"]);
    expect(ids(s.late)).toEqual(["D"]);
    expect(ids(s.windowOpen)).toEqual(["C"]); // due 5 Dec too, but listed once
    // H: deferred to the end of 2 Dec SGT (15:59:59.999 UTC) → 2 Dec; F: end of 8 Dec SGT → the
    // last day; G: 16:00 UTC on 8 Dec is 00:00 on 9 Dec SGT → outside; I: deferred to running
    // hours, no date binds; K: due 1 Dec, yesterday; E: done.
    expect(ids(s.dueSoon)).toEqual(["H", "F"]);
    expect(s.dueSoon.map((w) => w.dueDay)).toEqual(["2026-12-02", "2026-12-08"]);
  });
});

describe("splitEscalations", () => {
  const now = new Date("2026-12-02T00:00:00Z");
  it("sends recent changes of work still out of tolerance, marks the rest", () => {
    const { send, markOnly } = splitEscalations(
      [
        { id: "recent", changedAt: new Date("2026-12-01T12:00:00Z"), workOrderState: "out-of-tolerance" },
        // exactly 7 days old: still sent
        { id: "week", changedAt: new Date("2026-11-25T00:00:00Z"), workOrderState: "out-of-tolerance" },
        { id: "old", changedAt: new Date("2026-11-24T23:59:59Z"), workOrderState: "out-of-tolerance" },
        { id: "done-since", changedAt: new Date("2026-12-01T12:00:00Z"), workOrderState: "done" },
        { id: "future", changedAt: new Date("2026-12-02T00:00:01Z"), workOrderState: "out-of-tolerance" },
      ],
      now,
    );
    expect(send.map((c) => c.id)).toEqual(["recent", "week"]);
    expect(markOnly.map((c) => c.id)).toEqual(["old", "done-since"]);
  });
});

describe("recipients", () => {
  const m = (userId: string, role: Member["role"], vesselIds: string[], banned = false): Member => ({
    userId,
    email: `${userId}@example.test`,
    name: userId,
    role,
    banned,
    vesselIds,
  });
  const members = [
    m("eng-a", "engineer", ["A"]),
    m("eng-b", "engineer", ["B"]),
    m("eng-off", "engineer", ["A"], true),
    m("chief-a", "chief-engineer", ["A", "B"]),
    m("chief-b", "chief-engineer", ["B"]),
    m("super", "superintendent", []),
    m("super-off", "superintendent", [], true),
    m("admin", "admin", []),
    m("viewer", "viewer", ["A"]),
  ];
  const ids = (list: Member[]) => list.map((x) => x.userId);
  it("chooses by role, assignment and whether the account is enabled", () => {
    expect(ids(digestRecipients(members, "A"))).toEqual(["eng-a", "chief-a"]);
    expect(ids(missingReadingsRecipients(members, "A", 1))).toEqual(["eng-a"]);
    expect(ids(missingReadingsRecipients(members, "A", 2))).toEqual(["chief-a"]);
    expect(ids(missingReadingsRecipients(members, "A", 3))).toEqual(["super"]);
    expect(ids(escalationRecipients(members, "B"))).toEqual(["chief-a", "chief-b", "super"]);
    expect(ids(fleetSummaryRecipients(members))).toEqual(["super"]);
  });
});
