import { describe, expect, it } from "vitest";
import { parseCalendarRule } from "./calendar-rule";
import { presetToleranceRules, TOLERANCE_PRESETS } from "./presets";
import { calendarIntervalDays, matchToleranceRule, toleranceRuleProblems } from "./tolerance";

describe("tolerance presets", () => {
  it("each names its source: a document marked seen, or common practice", () => {
    for (const preset of TOLERANCE_PRESETS) expect(preset.source).toMatch(/\(seen\)|common practice/);
  });

  it("are valid rules with unique ids", () => {
    for (const preset of TOLERANCE_PRESETS) expect(toleranceRuleProblems(preset)).toEqual([]);
    expect(new Set(TOLERANCE_PRESETS.map((p) => p.id)).size).toBe(TOLERANCE_PRESETS.length);
  });

  it("cover every calendar size from 1 day to 100 years exactly once: no gap, no overlap", () => {
    const calendar = TOLERANCE_PRESETS.filter((p) => p.kind === "calendar");
    for (let days = 1; days <= 36_525; days += 1) {
      const covering = calendar.filter((p) => p.minInterval <= days && days <= p.maxInterval);
      if (covering.length !== 1) throw new Error(`${days} days: ${covering.length} presets`);
    }
  });

  // SOURCES.md intervals: SOLAS III/20.6 weekly, III/20.7 monthly, III/20.8 12 months, III/20.4
  // 5 years, boilers 36 months (one society's rules, seen); the rest are common practice.
  it.each([
    ["FREQ=DAILY", "preset-daily"],
    ["FREQ=WEEKLY", "preset-weekly"],
    ["FREQ=WEEKLY;INTERVAL=2", "preset-monthly"],
    ["FREQ=MONTHLY", "preset-monthly"],
    ["FREQ=MONTHLY;INTERVAL=3", "preset-quarterly"],
    ["FREQ=MONTHLY;INTERVAL=6", "preset-half-yearly"],
    ["FREQ=MONTHLY;INTERVAL=12", "preset-annual"],
    ["FREQ=YEARLY", "preset-annual"],
    ["FREQ=MONTHLY;INTERVAL=36", "preset-intermediate"],
    ["FREQ=YEARLY;INTERVAL=5", "preset-renewal"],
    ["FREQ=MONTHLY;INTERVAL=60", "preset-renewal"],
  ])("%s → %s", (text, id) => {
    const rule = parseCalendarRule(text);
    expect(calendarIntervalDays(rule)).toBeGreaterThan(0);
    expect(matchToleranceRule(TOLERANCE_PRESETS, { calendarRule: rule }, "calendar")?.rule.id).toBe(id);
  });

  it("the hours preset covers turbocharger washes (25 h) to cylinder-head overhauls (16,000 h)", () => {
    // Intervals from SOURCES.md, "Running-hour facts" (common practice).
    for (const intervalHours of [25, 100, 1_500, 3_000, 8_000, 16_000]) {
      expect(matchToleranceRule(TOLERANCE_PRESETS, { intervalHours }, "hours")?.rule.id).toBe("preset-running-hours");
    }
  });

  it("a company gets its own copies to change", () => {
    const mine = presetToleranceRules();
    const first = mine[0];
    if (!first) throw new Error("no presets");
    first.windowBefore.value = 99;
    expect(TOLERANCE_PRESETS[0]?.windowBefore.value).toBe(10);
    expect(first).not.toHaveProperty("source");
  });
});
