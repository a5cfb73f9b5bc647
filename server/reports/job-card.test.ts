import { writeFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { readPdf } from "@/tests/support/pdf-text";
import { type JobCard, renderJobCard } from "./job-card";

const card: JobCard = {
  vessel: { name: "Sula Meridian", code: "SUL", imoNumber: "9395044" },
  number: "WO-SUL-00042",
  title: "Cylinder unit 3: piston overhaul",
  component: { code: "ME.CYL.3", name: "Main engine cylinder unit 3" },
  kind: "Planned maintenance, occurrence 4",
  due: "14 Mar 2031 · at 48,000 h",
  window: "12 Feb 2031 – 28 Mar 2031 · 47,600 h – 48,200 h",
  interval: "every 16,000 h",
  counter: "Main engine",
  plannedEffort: "Second engineer, motorman ×2 for 12 h · 36 man-hours",
  flags: ["Critical equipment", "Main engine stopped"],
  description: "Pull the piston, renew the rings, gauge the liner.",
  defect: null,
  cautions: [
    { title: "Isolate and lock out", text: "Stop the machinery, isolate its power, lock and tag every isolation." },
    { title: "Turning gear", text: "Engage the turning gear and post a warning at every control stand." },
  ],
  cautionsFootnote: ["Keelson plans and records; the maker’s instruction manual, local regulations and class requirements prevail."],
  checklist: ["Isolate and lock out", "Open up the crankcase", "Measure the liner", "Box up and test run"],
  measurements: [
    { name: "Liner wear", unit: "mm", lower: "—", upper: "0.8 mm" },
    { name: "Ring gap", unit: "mm", lower: "0.4 mm", upper: "1.2 mm" },
  ],
  partsNote: "Piston ring set, O-rings for the liner.",
  parts: [{ number: "ME-PR-450", description: "Piston ring set", needed: "1 sets" }],
};

describe("the job card", () => {
  it("prints the job, its cautions, checklist, measurements with limits, parts and the sign-off on paper", async () => {
    const pdf = await renderJobCard(card);
    if (process.env.REPORTS_SAMPLE_DIR) writeFileSync(`${process.env.REPORTS_SAMPLE_DIR}/job-card.pdf`, pdf);
    const { all, pages, info, fonts } = await readPdf(pdf);
    expect(pages.length).toBeGreaterThanOrEqual(1);
    expect(pages.length).toBeLessThanOrEqual(2);
    expect(info.Title).toBe("Job card WO-SUL-00042: Cylinder unit 3: piston overhaul");
    for (const text of [
      "WO-SUL-00042",
      "Sula Meridian",
      "IMO 9395044",
      "Cylinder unit 3: piston overhaul",
      "ME.CYL.3",
      "14 Mar 2031 · at 48,000 h",
      "Before you start",
      "Isolate and lock out.",
      "the maker’s instruction manual, local regulations and class requirements prevail",
      "Open up the crankcase",
      "Box up and test run",
      "Liner wear",
      "0.8 mm",
      "Ring gap",
      "0.4 mm",
      "1.2 mm",
      "Value measured",
      "ME-PR-450",
      "Counter reading (Main engine)",
      "Man-hours spent",
      "Remarks",
      "Done by",
      "Answered for by",
      "Approved by the chief engineer",
      "Signature",
    ]) {
      expect(all, text).toContain(text);
    }
    // The screen's words for an unticked step are not on paper, and no day is written in for the crew.
    expect(all).not.toContain("Why it was not done");
    expect(all).not.toMatch(/\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) 20(2\d|30)\b/);
    expect(all).toContain("Page 1 of");
    // The font is Inter, embedded as a subset (a six-letter tag before its name), and the file stays small.
    expect(fonts.some((f) => /^[A-Z]{6}\+Inter-Regular$/.test(f))).toBe(true);
    expect(fonts.some((f) => /^[A-Z]{6}\+Inter-Bold$/.test(f))).toBe(true);
    expect(fonts.every((f) => f.includes("Inter"))).toBe(true);
    expect(pdf.length).toBeLessThan(60_000);
  });

  it("runs a long checklist over pages with its header again on each and no step lost", async () => {
    const steps = Array.from(
      { length: 70 },
      (_, i) =>
        `Step ${i + 1} of the long overhaul: ${"check the fastening, the seating and the locking of every part named in the maker’s instruction manual ".repeat(1 + (i % 3))}end ${i + 1}.`,
    );
    const pdf = await renderJobCard({ ...card, checklist: steps });
    const { pages, all } = await readPdf(pdf);
    expect(pages.length).toBeGreaterThanOrEqual(4);
    const squeezed = pages.map((p) => p.replace(/\s+/g, " "));
    // pdf.js may put a space where a line wraps or a kerned pair sits: compare without any.
    const bare = pages.map((p) => p.replace(/\s+/g, ""));
    for (const [i, step] of steps.entries()) {
      // Each step whole, on one page, once.
      const holders = bare.filter((p) => p.includes(step.replace(/\s+/g, "")));
      expect(holders, `step ${i + 1}`).toHaveLength(1);
    }
    squeezed.forEach((page, i) => {
      expect(page, `page ${i + 1}`).toContain(`Page ${i + 1} of ${pages.length}`);
      if (i > 0) expect(page, `running head on page ${i + 1}`).toContain("WO-SUL-00042 · Cylinder unit 3: piston overhaul");
    });
    // Every page the checklist runs onto repeats its header row.
    const checklistPages = squeezed.filter((p) => /Step \d+ of the long overhaul/.test(p));
    expect(checklistPages.length).toBeGreaterThanOrEqual(3);
    for (const page of checklistPages.slice(1)) {
      expect(page).toContain("Checklist (continued)");
      expect(page).toMatch(/No\. Step Done Initials/);
    }
    // After the checklist, the rest of the card follows whole.
    expect(all).toContain("Liner wear");
    expect(squeezed.at(-1)).toContain("Approved by the chief engineer");
  });

  it("keeps a long description whole across a page break", async () => {
    const description = Array.from({ length: 140 }, (_, i) => `Sentence ${i + 1} of the procedure.`).join(" ");
    const { all, pages } = await readPdf(await renderJobCard({ ...card, description }));
    expect(pages.length).toBeGreaterThanOrEqual(2);
    for (let i = 1; i <= 140; i++) expect(all).toContain(`Sentence ${i} of the procedure.`);
  });
});
