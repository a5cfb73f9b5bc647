import { describe, expect, it } from "vitest";
import {
  buildTree,
  descendantIds,
  inTreeOrder,
  matchesWithAncestors,
  resolveCounters,
  type TreeRow,
  wouldCreateCycle,
} from "./tree";

// A hand-drawn register, as on a small ship (the demo scenario's shape):
//
//   ME            Main engine          counter c-me
//   ├─ ME.TC      Turbocharger                         (uses c-me of ME)
//   └─ ME.CYL     Cylinder units                       (uses c-me of ME)
//      ├─ ME.CYL.1                                     (uses c-me of ME)
//      └─ ME.CYL.2                    counter c-cyl2   (own)
//         └─ ME.CYL.2.INJ                              (uses c-cyl2 of ME.CYL.2)
//   AC            Starting air        no counter
//   └─ AC.RCV     Air receivers                        (no counter)
const row = (id: string, parentId: string | null, counterId: string | null = null, sortOrder = 0): TreeRow => ({
  id,
  parentId,
  code: id,
  counterId,
  sortOrder,
});
const rows: TreeRow[] = [
  row("ME.CYL.2.INJ", "ME.CYL.2"),
  row("AC.RCV", "AC"),
  row("ME", null, "c-me", 0),
  row("ME.CYL", "ME", null, 2),
  row("ME.TC", "ME", null, 1),
  row("ME.CYL.2", "ME.CYL", "c-cyl2"),
  row("ME.CYL.1", "ME.CYL"),
  row("AC", null, null, 5),
];

describe("buildTree", () => {
  it("nests rows under their parents, siblings by sort order then code", () => {
    const order = inTreeOrder(buildTree(rows)).map((n) => `${"  ".repeat(n.depth)}${n.row.code}`);
    expect(order).toEqual([
      "ME",
      "  ME.TC",
      "  ME.CYL",
      "    ME.CYL.1",
      "    ME.CYL.2",
      "      ME.CYL.2.INJ",
      "AC",
      "  AC.RCV",
    ]);
  });

  it("sorts codes with numbers as an engineer counts: CYL.2 before CYL.10", () => {
    const cylinders = [row("CYL.10", null), row("CYL.2", null), row("CYL.1", null)];
    expect(buildTree(cylinders).map((n) => n.row.code)).toEqual(["CYL.1", "CYL.2", "CYL.10"]);
  });

  it("keeps a row whose parent is not in the list, as a root", () => {
    const roots = buildTree([row("ME.TC", "gone")]);
    expect(roots.map((n) => [n.row.code, n.depth])).toEqual([["ME.TC", 0]]);
  });

  it("keeps rows that sit on a loop of parents instead of losing them", () => {
    const loop = [row("A", "B"), row("B", "A"), row("C", null)];
    const codes = inTreeOrder(buildTree(loop)).map((n) => n.row.code);
    expect(codes.sort()).toEqual(["A", "B", "C"]);
  });

  it("gives an empty forest for a vessel without components", () => {
    expect(buildTree([])).toEqual([]);
  });
});

describe("resolveCounters", () => {
  const counters = resolveCounters(rows);

  it("a component with its own counter uses it", () => {
    expect(counters.get("ME")).toEqual({ kind: "own", counterId: "c-me" });
    expect(counters.get("ME.CYL.2")).toEqual({ kind: "own", counterId: "c-cyl2" });
  });

  it("a child uses its parent's counter, a grandchild its grandparent's", () => {
    expect(counters.get("ME.TC")).toEqual({ kind: "inherited", counterId: "c-me", fromComponentId: "ME" });
    expect(counters.get("ME.CYL.1")).toEqual({ kind: "inherited", counterId: "c-me", fromComponentId: "ME" });
  });

  it("the nearest ancestor with a counter wins over one further up", () => {
    expect(counters.get("ME.CYL.2.INJ")).toEqual({
      kind: "inherited",
      counterId: "c-cyl2",
      fromComponentId: "ME.CYL.2",
    });
  });

  it("no counter anywhere above: none", () => {
    expect(counters.get("AC")).toEqual({ kind: "none" });
    expect(counters.get("AC.RCV")).toEqual({ kind: "none" });
  });

  it("stops on a loop of parents rather than running forever", () => {
    const loop = resolveCounters([row("A", "B"), row("B", "A")]);
    expect(loop.get("A")).toEqual({ kind: "none" });
  });
});

describe("descendantIds", () => {
  it("lists every component below, at any depth, and not the component itself", () => {
    expect([...descendantIds(rows, "ME.CYL")].sort()).toEqual(["ME.CYL.1", "ME.CYL.2", "ME.CYL.2.INJ"]);
    expect(descendantIds(rows, "ME.CYL.2.INJ").size).toBe(0);
  });
});

describe("wouldCreateCycle", () => {
  it("refuses putting a component under itself", () => {
    expect(wouldCreateCycle(rows, "ME.CYL", "ME.CYL")).toBe(true);
  });

  it("refuses putting a component under its child or a deeper descendant", () => {
    expect(wouldCreateCycle(rows, "ME.CYL", "ME.CYL.1")).toBe(true);
    expect(wouldCreateCycle(rows, "ME", "ME.CYL.2.INJ")).toBe(true);
  });

  it("allows moving under a sibling, an uncle or to the top level", () => {
    expect(wouldCreateCycle(rows, "ME.CYL.1", "ME.CYL.2")).toBe(false);
    expect(wouldCreateCycle(rows, "ME.CYL.2", "AC")).toBe(false);
    expect(wouldCreateCycle(rows, "ME.CYL", null)).toBe(false);
  });

  it("follows parent links, not codes: ME.CYL.9 filed under AC is not part of ME", () => {
    const misfiled = [...rows, { id: "x", parentId: "AC", code: "ME.CYL.9", counterId: null }];
    expect(wouldCreateCycle(misfiled, "ME", "x")).toBe(false);
    expect(wouldCreateCycle(misfiled, "AC", "x")).toBe(true);
  });
});

describe("matchesWithAncestors", () => {
  it("keeps each match with the chain above it, and nothing beside it", () => {
    const kept = matchesWithAncestors(rows, (r) => r.code.endsWith("INJ"));
    expect([...kept].sort()).toEqual(["ME", "ME.CYL", "ME.CYL.2", "ME.CYL.2.INJ"]);
  });
});
