// A defect's state follows its work, worked by hand.
import { describe, expect, it } from "vitest";
import { closeProblems, defectState } from "./rules";

const found = { closedAt: null, dueDate: null, completion: null } as const;
const target = new Date("2026-12-09T04:00:00Z");

describe("a defect's state", () => {
  it("moves reported → planned → done → closed with its work", () => {
    expect(defectState(found)).toBe("reported");
    expect(defectState({ ...found, dueDate: target })).toBe("planned");
    expect(defectState({ ...found, dueDate: target, completion: "awaiting-approval" })).toBe("done");
    expect(defectState({ ...found, dueDate: target, completion: "approved", closedAt: new Date() })).toBe("closed");
  });
  it("goes back to planned when the chief returns the repair's record", () => {
    expect(defectState({ ...found, dueDate: target, completion: "returned" })).toBe("planned");
  });
  it("is closed only with its cause and the action against a repeat", () => {
    expect(closeProblems({ cause: "", action: "Renewed the gasket" }).map((p) => p.field)).toEqual(["cause"]);
    expect(closeProblems({ cause: "Gasket hardened with age", action: " " }).map((p) => p.field)).toEqual(["action"]);
    expect(closeProblems({ cause: "Gasket hardened with age", action: "Gasket added to the 2-yearly overhaul" })).toEqual([]);
  });
});
