import { writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import type { FleetOverdue, FleetOverdueItem } from "@/server/fleet/overdue-contract";
import { rankWords } from "@/server/routines/rank-names";
import { readPdf } from "@/tests/support/pdf-text";
import { renderOverdueList } from "./overdue-list";
import { overdueListOf } from "./overdue-list-data";

const vessels = [
  { id: "11111111-1111-4111-8111-111111111111", name: "Sula Meridian", code: "SUL" },
  { id: "22222222-2222-4222-8222-222222222222", name: "Aster Gale", code: "AST" },
];

function item(n: number, over: Partial<FleetOverdueItem> = {}): FleetOverdueItem {
  const v = vessels[n % 2]!;
  return {
    id: `wo-${n}`,
    number: `WO-${v.code}-${String(n).padStart(5, "0")}`,
    title: `Overdue job ${n}`,
    state: n % 3 === 0 ? "out-of-tolerance" : "late",
    rank: "second-engineer",
    critical: n % 4 === 0,
    classRelated: n % 5 === 0,
    plannedDate: null,
    vessel: v,
    component: { code: `AE.${n}`, name: `Generator ${n}` },
    since: "2026-11-20T00:00:00.000Z",
    dueDay: "2026-11-01",
    dueHours: n % 2 ? 12_000 : null,
    daysOverdue: 34,
    hoursOverdue: n % 2 ? 150.5 : null,
    pendingDeferral: n === 1,
    awaitingApproval: false,
    ...over,
  };
}

const list = (items: FleetOverdueItem[]): FleetOverdue => ({ generatedAt: "2026-12-05T19:50:00.000Z", vessels, items, truncated: false });

describe("the fleet's overdue list", () => {
  it("prints each work order with its vessel, state, due point and how far over, under the filters", async () => {
    const words = overdueListOf(list([item(1), item(3)]), { flagged: true }, "Meridian Shipping", rankWords({ "second-engineer": "2nd engineer" }));
    expect(words.counts).toBe("1 out of tolerance · 1 late");
    expect(words.filters).toBe("Every vessel · late and out of tolerance · critical or class-related only");
    expect(words.lines[0]).toMatchObject({ due: "1 Nov 2026\n12,000 h", overdue: "34 days · 150.5 h over", rank: "2nd engineer", notes: "deferral asked" });
    const pdf = await renderOverdueList(words);
    if (process.env.REPORTS_SAMPLE_DIR) writeFileSync(`${process.env.REPORTS_SAMPLE_DIR}/overdue.pdf`, pdf);
    const { all, pages } = await readPdf(pdf);
    expect(pages).toHaveLength(1);
    for (const text of ["OVERDUE WORK", "Meridian Shipping", "WO-AST-00001", "WO-AST-00003", "out of tolerance", "Listed 5 Dec 2026 19:50 UTC", "34 days · 150.5 h over"]) {
      expect(all, text).toContain(text);
    }
  });

  it("runs a long list over landscape pages with the header row on each", async () => {
    const items = Array.from({ length: 90 }, (_, i) => item(i + 1));
    const { pages } = await readPdf(await renderOverdueList(overdueListOf(list(items), {}, "Meridian Shipping", rankWords())));
    expect(pages.length).toBeGreaterThanOrEqual(3);
    const bare = pages.map((p) => p.replace(/\s+/g, ""));
    for (const i of items) expect(bare.filter((p) => p.includes(`${i.number}${i.title}`.replace(/\s+/g, ""))), i.number).toHaveLength(1);
    for (const page of pages.slice(1)) expect(page.replace(/\s+/g, " ")).toMatch(/Vessel Work order State Due Overdue by Rank Notes/);
  });

  it("says so when nothing is overdue", async () => {
    const { all } = await readPdf(await renderOverdueList(overdueListOf(list([]), { state: "late" }, "Meridian Shipping", rankWords())));
    expect(all).toContain("Nothing is late or out of tolerance under these filters.");
    expect(all).toContain("0 out of tolerance · 0 late");
  });
});
