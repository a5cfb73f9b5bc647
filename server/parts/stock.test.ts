// Stock is the sum of its movements, worked by hand: what each location holds, a count stored as
// its difference, and the refusals that keep a shelf from going below zero.
import { describe, expect, it } from "vitest";
import { MovementInput, Quantity } from "./contract";
import { countDifference, drawFrom, isLow, onBoard, stockByLocation, takeProblem, unitProblem } from "./stock";

describe("stock on board", () => {
  // Engine store: received 10, used 4, counted 7 (+1: found one in the wrong bin); moved 3 to the
  // workshop. Engine store 10 − 4 + 1 − 3 = 4; workshop 3; on board 7.
  const moves = [
    { locationId: "store", quantity: 10 },
    { locationId: "store", quantity: -4 },
    { locationId: "store", quantity: 1 },
    { locationId: "store", quantity: -3 },
    { locationId: "workshop", quantity: 3 },
  ];
  it("is the sum of the movements, per location and on board", () => {
    expect(stockByLocation(moves)).toEqual(new Map([["store", 4], ["workshop", 3]]));
    expect(onBoard(moves)).toBe(7);
  });

  it("keeps litres to the thousandth: 0.1 + 0.2 l is 0.3 l", () => {
    expect(onBoard([{ locationId: "a", quantity: 0.1 }, { locationId: "a", quantity: 0.2 }])).toBe(0.3);
  });

  it("stores a count as its difference, and nothing when the count agrees", () => {
    expect(countDifference(4, 6)).toBe(2);
    expect(countDifference(4, 1.5)).toBe(-2.5);
    expect(countDifference(4, 4)).toBeNull();
  });

  it("is low only under a minimum the company set", () => {
    expect(isLow(1, 2)).toBe(true);
    expect(isLow(2, 2)).toBe(false);
    expect(isLow(0, 0)).toBe(false);
  });
});

describe("refusals", () => {
  it("never takes a location below zero, and sends the person to count it", () => {
    expect(takeProblem(4, 4, "Engine store", "piece")).toBeNull();
    expect(takeProblem(4, 5, "Engine store", "piece")?.message).toBe(
      "Only 4 pcs recorded at Engine store, not 5. If more is on the shelf, count it first (a count correction with its reason).",
    );
    expect(takeProblem(0, 1, "Workshop", "piece")?.message).toMatch(/^Nothing is recorded at Workshop\./);
  });

  it("says one set, not one sets", () => {
    expect(takeProblem(1, 2, "Workshop", "set")?.message).toMatch(/^Only 1 set recorded at Workshop, not 2\./);
    expect(takeProblem(3, 4, "Workshop", "set")?.message).toMatch(/^Only 3 sets recorded/);
  });

  it("counts pieces and sets whole, litres in parts", () => {
    expect(unitProblem("piece", 1.5, "quantity")?.message).toBe("This part is counted in whole pieces; enter a whole number.");
    expect(unitProblem("set", 2, "quantity")).toBeNull();
    expect(unitProblem("litre", 2.25, "quantity")).toBeNull();
  });

  it("reads quantities as people type them, and names what is wrong", () => {
    expect(Quantity.parse("2,5")).toBe(2.5);
    expect(Quantity.parse(4)).toBe(4);
    expect(Quantity.safeParse("0").error?.issues[0]?.message).toBe("The quantity is more than 0 and at most 1,000,000.");
    expect(Quantity.safeParse("four").error?.issues[0]?.message).toBe("Enter a quantity, e.g. 4 or 2.5 (at most three decimals).");
    const count = MovementInput.safeParse({ kind: "counted", partId: crypto.randomUUID(), locationId: crypto.randomUUID(), counted: 3, reason: "" });
    expect(count.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["reason", "Say why the count differs, e.g. “found two in the wrong bin”."]]);
  });
});

describe("parts taken for a job", () => {
  // Engine store holds 3 sets, workshop 1, spare store 0. A job using 4 takes the engine store's 3
  // first (the most), then the workshop's 1; one using 2 empties nothing but the engine store.
  const held = new Map([["workshop", 1], ["engine store", 3], ["spare store", 0]]);
  it("comes off the fullest shelf first", () => {
    expect(drawFrom(held, 2)).toEqual([{ locationId: "engine store", quantity: 2 }]);
    expect(drawFrom(held, 4)).toEqual([
      { locationId: "engine store", quantity: 3 },
      { locationId: "workshop", quantity: 1 },
    ]);
  });
  it("takes no more than is held: what is missing is left to the caller to refuse", () => {
    const taken = drawFrom(held, 6);
    expect(taken.reduce((n, t) => n + t.quantity, 0)).toBe(4);
    expect(drawFrom(new Map(), 1)).toEqual([]);
  });
  it("keeps litres to the thousandth", () => {
    expect(drawFrom(new Map([["a", 0.3], ["b", 0.2]]), 0.45)).toEqual([
      { locationId: "a", quantity: 0.3 },
      { locationId: "b", quantity: 0.15 },
    ]);
  });
});
