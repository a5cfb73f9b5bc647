// Every day a person enters, in every contract, is refused outside its kind's range with the field
// named, and accepted on the range's first and last day. "Today" is fixed at 4 Dec 2026 12:00 UTC.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { z } from "zod";
import { PlannedDateInput } from "@/server/calendar/contract";
import { CompletionInput } from "@/server/completions/contract";
import { DeferralRequestInput } from "@/server/deferrals/contract";
import { PackageInput, PortStayInput, PortStayPatch } from "@/server/port-stays/contract";
import { ReadingBatchInput } from "@/server/readings/contract";
import { MeterReplacementInput } from "@/server/register/contract";
import { RoutineInput } from "@/server/routines/contract";
import { dayRange, type DayKind } from "./dates";
import { fieldErrorsFromZod } from "./problem";

beforeAll(() => {
  vi.useFakeTimers({ toFake: ["Date"] });
  vi.setSystemTime(new Date("2026-12-04T12:00:00Z"));
});
afterAll(() => {
  vi.useRealTimers();
});

type DateField = {
  schema: z.ZodType;
  /** The field as the 422 names it. */
  field: string;
  input: (day: string) => unknown;
  kind: DayKind;
  /** The words the range message starts with. */
  words: string;
};

const stayTime = (field: string) => (day: string) => ({ [field]: `${day}T07:00` });

const FIELDS: DateField[] = [
  {
    schema: ReadingBatchInput,
    field: "shipDay",
    input: (d) => ({ shipDay: d }),
    kind: "recorded",
    words: "The reading’s ship’s day",
  },
  {
    schema: CompletionInput,
    field: "doneOn",
    input: (d) => ({ doneOn: d }),
    kind: "recorded",
    words: "The day the job was done",
  },
  {
    schema: MeterReplacementInput,
    field: "replacedAt.shipDay",
    input: (d) => ({ replacedAt: { shipDay: d, time: "12:00" } }),
    kind: "recorded",
    words: "The day the meter was replaced",
  },
  {
    schema: RoutineInput,
    field: "baselineAt",
    input: (d) => ({ baselineAt: d }),
    kind: "history",
    words: "The day last done",
  },
  {
    schema: RoutineInput,
    field: "anchorDate",
    input: (d) => ({ anchorDate: d }),
    kind: "anniversary",
    words: "The anniversary date",
  },
  {
    schema: DeferralRequestInput,
    field: "proposedDueDay",
    input: (d) => ({ proposedDueDay: d }),
    kind: "planned",
    words: "The proposed due day",
  },
  {
    schema: PlannedDateInput,
    field: "plannedDate",
    input: (d) => ({ plannedDate: d }),
    kind: "planned",
    words: "The planned day",
  },
  {
    schema: PackageInput,
    field: "items.0.start",
    input: (d) => ({ items: [{ start: `${d}T08:00` }] }),
    kind: "planned",
    words: "The job's start",
  },
  { schema: PortStayInput, field: "arrivesAt", input: stayTime("arrivesAt"), kind: "planned", words: "The arrival" },
  { schema: PortStayInput, field: "departsAt", input: stayTime("departsAt"), kind: "planned", words: "The departure" },
  { schema: PortStayPatch, field: "arrivesAt", input: stayTime("arrivesAt"), kind: "planned", words: "The arrival" },
];

function messagesFor(f: DateField, day: string): string[] {
  const result = f.schema.safeParse(f.input(day));
  if (result.success) return [];
  return fieldErrorsFromZod(result.error)
    .filter((e) => e.field === f.field)
    .map((e) => e.message);
}

const dayAfter = (day: string, n: number) =>
  new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

describe("the range of each kind of day", () => {
  it("follows today: a week ahead for records, three years for plans, six for anniversaries", () => {
    expect(dayRange("recorded")).toEqual({ from: "2000-01-01", until: "2026-12-11" });
    expect(dayRange("history")).toEqual({ from: "1980-01-01", until: "2026-12-11" });
    expect(dayRange("planned")).toEqual({ from: "2000-01-01", until: "2029-12-04" });
    expect(dayRange("anniversary")).toEqual({ from: "1980-01-01", until: "2032-12-04" });
  });
});

describe.each(FIELDS.map((f) => [f.field, f.schema === PortStayPatch ? "(patch)" : "", f] as const))(
  "%s %s",
  (_field, _patch, f) => {
    it.each(["9999-12-31", "1900-01-01"])("refuses %s, naming the field in words", (day) => {
      const { from, until } = dayRange(f.kind);
      expect(messagesFor(f, day)).toEqual([`${f.words} must lie between ${from} and ${until}.`]);
    });

    it.each(["0000-00-00", "275760-09-13"])("refuses %s as no date at all", (day) => {
      const messages = messagesFor(f, day);
      expect(messages).toHaveLength(1);
      expect(messages[0]).not.toMatch(/must lie between/);
    });

    it("accepts the first and last day of the range and refuses the days beyond", () => {
      const { from, until } = dayRange(f.kind);
      expect(messagesFor(f, from)).toEqual([]);
      expect(messagesFor(f, until)).toEqual([]);
      expect(messagesFor(f, dayAfter(from, -1))).toHaveLength(1);
      expect(messagesFor(f, dayAfter(until, 1))).toHaveLength(1);
    });
  },
);
