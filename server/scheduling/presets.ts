// The tolerance rules a new company starts with, in the class-survey style (PRODUCT.md, point 3).
// The company can change or delete every one. Calendar ranges are in days as calendarIntervalDays
// counts them (month ≈ 30.44 d, year 365.25 d, rounded) and follow on without gaps, so every
// calendar routine from 1 day to 100 years matches exactly one preset; the hours preset covers
// every hours interval.
import type { ToleranceRule } from "./tolerance";

export type TolerancePreset = ToleranceRule & {
  /** Where the figures come from: a source in ../shared/SOURCES.md, or `common practice`. */
  source: string;
};

export const TOLERANCE_PRESETS: readonly TolerancePreset[] = [
  {
    id: "preset-running-hours",
    name: "Running hours: 10 % before, 5 % after, at most 500 h",
    kind: "hours",
    minInterval: 0,
    maxInterval: 1_000_000,
    windowBefore: { value: 10, unit: "percent" },
    graceAfter: { value: 5, unit: "percent" },
    capHours: 500,
    keepsAnniversary: false,
    source: "PRODUCT.md's example rule (hours: window 10 % of interval, grace 5 %, capped at 500 h); common practice",
  },
  {
    id: "preset-daily",
    name: "Daily checks: on the day",
    kind: "calendar",
    minInterval: 0,
    maxInterval: 1,
    // A window of 1 day is the due day itself; no grace: a daily check not done on its day is missed.
    windowBefore: { value: 1, unit: "days" },
    graceAfter: { value: 0, unit: "days" },
    keepsAnniversary: true,
    source: "common practice",
  },
  {
    id: "preset-weekly",
    name: "Weekly tests: from the day before to the day after",
    kind: "calendar",
    minInterval: 2,
    maxInterval: 10,
    windowBefore: { value: 2, unit: "days" },
    graceAfter: { value: 1, unit: "days" },
    keepsAnniversary: true,
    source:
      "SOLAS III/20.6 sets the weekly interval of lifeboat-engine runs and alarm tests (seen); the one day either side is common practice",
  },
  {
    id: "preset-monthly",
    name: "Monthly tests: the week up to the due day, 3 days after",
    kind: "calendar",
    minInterval: 11,
    maxInterval: 45,
    windowBefore: { value: 7, unit: "days" },
    graceAfter: { value: 3, unit: "days" },
    keepsAnniversary: true,
    source:
      "SOLAS III/20.7 monthly inspection and MSC.1/Circ.1432 monthly fire-pump run set the interval (seen); the window and grace are common practice",
  },
  {
    id: "preset-quarterly",
    name: "Two to three months: 14 days either side",
    kind: "calendar",
    minInterval: 46,
    maxInterval: 120,
    windowBefore: { value: 14, unit: "days" },
    graceAfter: { value: 14, unit: "days" },
    keepsAnniversary: true,
    source: "common practice",
  },
  {
    id: "preset-half-yearly",
    name: "Four to ten months: 1 month either side",
    kind: "calendar",
    minInterval: 121,
    maxInterval: 300,
    windowBefore: { value: 1, unit: "months" },
    graceAfter: { value: 1, unit: "months" },
    keepsAnniversary: true,
    source: "common practice",
  },
  {
    id: "preset-annual",
    name: "Annual: 3 months either side of the anniversary",
    kind: "calendar",
    minInterval: 301,
    maxInterval: 500,
    windowBefore: { value: 3, unit: "months" },
    graceAfter: { value: 3, unit: "months" },
    keepsAnniversary: true,
    // Class counts the whole window on time: a survey item done after the anniversary but inside it is not late.
    graceOnTime: true,
    source:
      "HSSC, IMO Resolution A.1104(29) 1.3 and 4.2.1: annual surveys within 3 months before or after each anniversary date (seen); IACS booklet example 16 Jan – 15 Jul (seen)",
  },
  {
    id: "preset-intermediate",
    name: "Two to three years: 3 months either side",
    kind: "calendar",
    minInterval: 501,
    maxInterval: 1200,
    windowBefore: { value: 3, unit: "months" },
    graceAfter: { value: 3, unit: "months" },
    keepsAnniversary: true,
    // Class counts the whole window on time: a survey item done after the anniversary but inside it is not late.
    graceOnTime: true,
    source:
      "HSSC, IMO Resolution A.1104(29): intermediate survey within 3 months either side of the 2nd or 3rd anniversary (seen); boilers: up to 3 months' extension of the 36-month interval in one society's rules (seen)",
  },
  {
    id: "preset-renewal",
    name: "Five years and more: 3 months before, none after",
    kind: "calendar",
    minInterval: 1201,
    maxInterval: 36_525,
    windowBefore: { value: 3, unit: "months" },
    graceAfter: { value: 0, unit: "months" },
    keepsAnniversary: true,
    source:
      "HSSC, IMO Resolution A.1104(29) renewal: within the 3 months before expiry keeps the expiry date (seen); SOLAS III/20.4: launching falls renewed at intervals not exceeding 5 years, so no grace (seen)",
  },
];

/** Fresh copies of the presets, for a new company to own and change. */
export function presetToleranceRules(): ToleranceRule[] {
  return TOLERANCE_PRESETS.map(({ source: _source, ...rule }) => structuredClone(rule));
}
