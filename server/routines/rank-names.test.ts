// The company's own rank names: what the settings form may send, and how pages and the planner's
// reasons then write a rank and a team.
import { describe, expect, it } from "vitest";
import { planPortStay } from "@/server/planning/stay-planner";
import { lowerFirst, RankNamesInput, rankWords } from "./rank-names";

const issues = (input: unknown) => {
  const r = RankNamesInput.safeParse(input);
  return r.success ? [] : r.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
};

describe("the rank names a company may send", () => {
  it("keeps only the ranks renamed: an empty name or Keelson's own word gives the rank back", () => {
    expect(RankNamesInput.parse({ oiler: "  Wiper ", motorman: "", "third-engineer": "Third engineer" })).toEqual({
      oiler: "Wiper",
    });
  });

  it("refuses two ranks under one name, naming the second rank", () => {
    expect(issues({ oiler: "motorman" })).toEqual([
      "oiler: “motorman” is already the name of motorman: give each rank its own name.",
    ]);
    // The rank typed into is the one named, even when it comes first.
    expect(issues({ motorman: "Oiler" })).toEqual([
      "motorman: “Oiler” is already the name of oiler: give each rank its own name.",
    ]);
    expect(issues({ motorman: "Wiper", oiler: "WIPER" })).toEqual([
      "oiler: “WIPER” is already the name of motorman: give each rank its own name.",
    ]);
    // Renaming both away from each other's word is allowed: motorman → Oiler, oiler → Wiper.
    expect(issues({ motorman: "Oiler", oiler: "Wiper" })).toEqual([]);
  });

  it("refuses a rank Keelson does not have, a long name and control characters", () => {
    expect(issues({ cadet: "Engine cadet" })).toEqual([
      ": cadet is not one of Keelson’s ranks: name only chief-engineer, second-engineer, third-engineer, fourth-engineer, electro-technical-officer, motorman, oiler.",
    ]);
    expect(issues("Wiper")).toEqual([': Send the rank names as an object, e.g. { "oiler": "Wiper" }.']);
    expect(issues({ oiler: "W".repeat(41) })).toEqual(["oiler: Keep the name for oiler to 40 characters or fewer."]);
    expect(issues({ oiler: "Wi\u0000per" })).toEqual(["oiler: The name for oiler may not hold control characters."]);
    expect(issues({ oiler: 3 })).toEqual(["oiler: The name for oiler must be text."]);
  });
});

describe("a rank and a team in the company's words", () => {
  it("uses the company's name where there is one and Keelson's word elsewhere", () => {
    const words = rankWords({ oiler: "Wiper", "electro-technical-officer": "ETO" });
    expect(words.label("oiler")).toBe("Wiper");
    expect(words.label("motorman")).toBe("Motorman");
    expect(words.label("no-such-rank")).toBe("no-such-rank");
    expect(
      words.team([
        { rank: "second-engineer", count: 1 },
        { rank: "oiler", count: 2 },
        { rank: "electro-technical-officer", count: 1 },
      ]),
    ).toBe("Second engineer, wiper ×2, ETO");
  });

  it("lowers a name's first letter inside a sentence, not an abbreviation", () => {
    expect([lowerFirst("Wiper"), lowerFirst("ETO"), lowerFirst("eto")]).toEqual(["wiper", "ETO", "eto"]);
  });

  it("writes the planner's reason with the company's names", () => {
    const at = (local: string) => new Date(`${local}:00Z`);
    const plan = planPortStay({
      stay: {
        arrivesAt: at("2026-12-10T08:00"),
        departsAt: at("2026-12-11T17:00"),
        timeZone: "UTC",
        workday: { from: 8 * 60, to: 17 * 60 },
        immobilisation: null,
        crew: [{ rank: "motorman", count: 1 }],
        watches: [],
      },
      nextStayArrivesAt: at("2027-01-20T08:00"),
      rankNames: { oiler: "Wiper", motorman: "Rating" },
      jobs: [
        {
          id: "a",
          number: "WO-1",
          title: "Purifier clean",
          state: "late",
          team: [{ rank: "oiler", count: 2 }],
          elapsedHours: 2,
          needsEngineStop: false,
          needsPort: true,
          critical: false,
          classRelated: false,
          dueAt: at("2026-12-01T00:00"),
          outOfToleranceAt: null,
          planFrom: null,
          planUntil: null,
          tiedTo: null,
        },
      ],
    });
    expect(plan.leftOut[0]?.message).toMatch(/its team \(wiper ×2\) is more than the crew on board/);
  });
});
