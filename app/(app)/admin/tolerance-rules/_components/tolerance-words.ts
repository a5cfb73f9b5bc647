// A tolerance rule in plain words, for the table and the form's preview.
import type { ToleranceKind, ToleranceUnit } from "@/server/scheduling/tolerance";

type Span = { value: number; unit: ToleranceUnit };
type RuleWords = {
  kind: ToleranceKind;
  minInterval: number;
  maxInterval: number;
  windowBefore: Span;
  graceAfter: Span;
  capHours?: number | null;
  keepsAnniversary: boolean;
  graceOnTime?: boolean;
};

const number = (n: number) => n.toLocaleString("en-GB", { maximumFractionDigits: 2 });

/** "calendar intervals of 335–395 days", "running-hours intervals of 0–1,000,000 h". */
export function matchesWords(rule: Pick<RuleWords, "kind" | "minInterval" | "maxInterval">): string {
  const range =
    rule.minInterval === rule.maxInterval
      ? number(rule.minInterval)
      : `${number(rule.minInterval)}–${number(rule.maxInterval)}`;
  return rule.kind === "hours"
    ? `running-hours intervals of ${range} h`
    : `calendar intervals of ${range} ${rule.maxInterval === 1 ? "day" : "days"}`;
}

/** "3 months", "10 % of the interval, at most 500 h", "none". */
export function spanWords(span: Span, capHours?: number | null): string {
  if (!Number.isFinite(span.value)) return "—";
  if (span.value === 0) return "none";
  if (span.unit === "percent") {
    const cap = capHours ? `, at most ${number(capHours)} h` : "";
    return `${number(span.value)} % of the interval${cap}`;
  }
  if (span.unit === "hours") return `${number(span.value)} h`;
  const one = span.unit === "days" ? "day" : "month";
  return `${number(span.value)} ${span.value === 1 ? one : `${one}s`}`;
}

/**
 * "Opens 3 months before the due date; out of tolerance 3 months after; an early completion moves
 * the anniversary, one inside the window keeps it."
 */
export function previewWords(rule: RuleWords): string {
  const due = rule.kind === "hours" ? "the due hours" : "the due date";
  const cap = rule.kind === "hours" ? rule.capHours : null;
  const opens =
    rule.windowBefore.value === 0 ? `Opens at ${due}` : `Opens ${spanWords(rule.windowBefore, cap)} before ${due}`;
  const grace =
    rule.graceAfter.value === 0
      ? "out of tolerance as soon as it is past due"
      : `out of tolerance ${spanWords(rule.graceAfter, cap)} after`;
  const anniversary = rule.keepsAnniversary
    ? "an early completion moves the anniversary, one inside the window keeps it"
    : "every completion moves the anniversary, even one inside the window";
  return `${opens}; ${grace}; ${anniversary}.`;
}

/**
 * What each state of a work order means under the rule, in the order a job passes through them:
 * "Scheduled until the window opens; window open from 3 months before the due date to the due
 * date; late for 3 months after it; out of tolerance from the day after."
 */
export function stateWords(rule: RuleWords): string {
  const due = rule.kind === "hours" ? "the due hours" : "the due date";
  const cap = rule.kind === "hours" ? rule.capHours : null;
  const opens = rule.windowBefore.value === 0 ? `at ${due}` : `${spanWords(rule.windowBefore, cap)} before ${due}`;
  const after = rule.kind === "hours" ? "once past them" : "from the day after";
  if (rule.graceAfter.value === 0) {
    return `States: scheduled until the window opens; window open from ${opens} to ${due}; out of tolerance ${after} — there is no late.`;
  }
  const grace = spanWords(rule.graceAfter, cap);
  if (rule.graceOnTime && rule.kind === "calendar") {
    return `States: scheduled until the window opens; window open — on time — from ${opens} to ${grace} after ${due}; out of tolerance from the day after. Late only past a date agreed in a deferral.`;
  }
  return `States: scheduled until the window opens; window open from ${opens} to ${due}; late for ${grace} after it; out of tolerance ${rule.kind === "hours" ? "past that" : "from the day after"}.`;
}
