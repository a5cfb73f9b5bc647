// A requisition's flow and a port stay's shortfalls, worked by hand.
import { describe, expect, it } from "vitest";
import { fullyReceived, moveProblem, stayShortfalls } from "./requisition-rules";

describe("a requisition's flow", () => {
  const chief = { plan: true, order: false };
  const office = { plan: false, order: true };
  it("is drafted and sent by the chief engineer, ordered by the office", () => {
    expect(moveProblem("drafted", "sent", chief)).toBeNull();
    expect(moveProblem("sent", "ordered", office)).toBeNull();
    expect(moveProblem("drafted", "sent", office)).toBe("The vessel’s chief engineer does that.");
    expect(moveProblem("sent", "ordered", chief)).toBe("The office orders it (superintendent or administrator).");
  });
  it("is cancelled by whoever holds it: a draft by the chief, a sent one by either, an ordered one by the office", () => {
    expect(moveProblem("drafted", "cancelled", chief)).toBeNull();
    expect(moveProblem("sent", "cancelled", chief)).toBeNull();
    expect(moveProblem("sent", "cancelled", office)).toBeNull();
    expect(moveProblem("ordered", "cancelled", chief)).not.toBeNull();
    expect(moveProblem("ordered", "cancelled", office)).toBeNull();
  });
  it("never skips a step, goes back, or is delivered by hand", () => {
    expect(moveProblem("drafted", "ordered", office)).toBe("A requisition drafted on board cannot become ordered by the office.");
    expect(moveProblem("ordered", "sent", chief)).not.toBeNull();
    expect(moveProblem("delivered", "cancelled", office)).not.toBeNull();
    expect(moveProblem("ordered", "delivered", chief)).toBe("A requisition is delivered by receiving its parts into the stores.");
  });
  it("is received in full when every line has at least what was asked", () => {
    expect(fullyReceived([{ quantity: 2, received: 2 }, { quantity: 1.5, received: 2 }])).toBe(true);
    expect(fullyReceived([{ quantity: 2, received: 2 }, { quantity: 1.5, received: 1 }])).toBe(false);
    expect(fullyReceived([])).toBe(false);
  });
});

describe("a port stay's parts", () => {
  // Two overhauls need 1 ring set each (WO-1, WO-2) and one needs 4 l of sealant (WO-2). On board:
  // 1 ring set, 10 l of sealant; 0 gaskets against a minimum of 2; 1 ring set already on order.
  const parts = new Map([
    ["rings", { minimumOnBoard: 2 }],
    ["sealant", { minimumOnBoard: 0 }],
    ["gasket", { minimumOnBoard: 2 }],
  ]);
  const needs = [
    { partId: "rings", quantity: 1, job: "WO-1" },
    { partId: "rings", quantity: 1, job: "WO-2" },
    { partId: "sealant", quantity: 4, job: "WO-2" },
  ];
  const onBoard = new Map([["rings", 1], ["sealant", 10]]);
  const onOrder = new Map([["rings", 1]]);

  it("adds up what the jobs need and sets it against what is on board and on order", () => {
    const lines = stayShortfalls(needs, parts, onBoard, onOrder, false);
    expect(lines).toEqual([
      // Needed 2, on board 1: short 1, already on order 1, nothing more to ask.
      { partId: "rings", jobs: ["WO-1", "WO-2"], needed: 2, onBoard: 1, onOrder: 1, short: 1, toOrder: 0, low: true },
      { partId: "sealant", jobs: ["WO-2"], needed: 4, onBoard: 10, onOrder: 0, short: 0, toOrder: 0, low: false },
    ]);
  });

  it("with the minimum kept, asks what brings each part back to it after the jobs, and adds the parts under it", () => {
    const lines = stayShortfalls(needs, parts, onBoard, onOrder, true);
    // Rings: 2 needed + 2 minimum − 1 on board − 1 on order = 2. Gasket: 0 + 2 − 0 = 2.
    expect(lines.find((l) => l.partId === "rings")?.toOrder).toBe(2);
    expect(lines.find((l) => l.partId === "gasket")).toMatchObject({ needed: 0, short: 0, toOrder: 2, low: true, jobs: [] });
    expect(lines.find((l) => l.partId === "sealant")?.toOrder).toBe(0);
  });

  it("takes a stock recorded below zero as none on board", () => {
    expect(stayShortfalls([{ partId: "sealant", quantity: 1, job: "WO-3" }], parts, new Map([["sealant", -2]]), new Map(), false)[0]).toMatchObject({ onBoard: 0, short: 1, toOrder: 1 });
  });
});
