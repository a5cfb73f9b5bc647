import { TZDate } from "@date-fns/tz";
import * as rruleModule from "rrule";
import { describe, expect, it } from "vitest";
import { nextOccurrenceAfter, occurrencesBetween } from "./calendar-rule";
import { shipDateKey, shipDateOf } from "./ship-date";

const rrule: typeof rruleModule =
  "RRule" in rruleModule ? rruleModule : (rruleModule as unknown as { default: typeof rruleModule }).default;
const NY = "America/New_York";
const iso = (d: Date | null) => d?.toISOString() ?? null;
const days = (instants: Date[], timeZone: string) => instants.map((d) => shipDateKey(shipDateOf(d, timeZone)));
/** The instant of a wall-clock time in a zone. */
const at = (timeZone: string, y: number, m: number, d: number, h = 12) =>
  new Date(new TZDate(y, m - 1, d, h, 0, 0, timeZone).getTime());

// RFC 5545 section 3.8.5.3, vectors 1–4 as listed in ../shared/SOURCES.md (DTSTART 09:00 America/New_York).
const VECTOR_1 = {
  rule: "FREQ=WEEKLY;INTERVAL=2;UNTIL=19971224T000000Z;WKST=SU;BYDAY=MO,WE,FR",
  start: [1997, 9, 1] as const,
  days: [
    "1997-09-01",
    "1997-09-03",
    "1997-09-05",
    "1997-09-15",
    "1997-09-17",
    "1997-09-19",
    "1997-09-29",
    "1997-10-01",
    "1997-10-03",
    "1997-10-13",
    "1997-10-15",
    "1997-10-17",
    "1997-10-27",
    "1997-10-29",
    "1997-10-31",
    "1997-11-10",
    "1997-11-12",
    "1997-11-14",
    "1997-11-24",
    "1997-11-26",
    "1997-11-28",
    "1997-12-08",
    "1997-12-10",
    "1997-12-12",
    "1997-12-22",
  ],
};
const VECTOR_2 = {
  rule: "FREQ=MONTHLY;COUNT=10;BYDAY=1FR",
  start: [1997, 9, 5] as const,
  days: [
    "1997-09-05",
    "1997-10-03",
    "1997-11-07",
    "1997-12-05",
    "1998-01-02",
    "1998-02-06",
    "1998-03-06",
    "1998-04-03",
    "1998-05-01",
    "1998-06-05",
  ],
};
const VECTOR_3 = {
  rule: "FREQ=MONTHLY;COUNT=10;BYMONTHDAY=1,-1",
  start: [1997, 9, 30] as const,
  days: [
    "1997-09-30",
    "1997-10-01",
    "1997-10-31",
    "1997-11-01",
    "1997-11-30",
    "1997-12-01",
    "1997-12-31",
    "1998-01-01",
    "1998-01-31",
    "1998-02-01",
  ],
};
const VECTOR_4 = {
  rule: "FREQ=MONTHLY;BYMONTHDAY=15,30;COUNT=5",
  start: [2007, 1, 15] as const,
  days: ["2007-01-15", "2007-01-30", "2007-02-15", "2007-03-15", "2007-03-30"],
};
const VECTORS = [VECTOR_1, VECTOR_2, VECTOR_3, VECTOR_4];

describe("RFC 5545 3.8.5.3 vectors through rrule, on floating wall-clock time", () => {
  // The floating trick: rrule computes on New York's wall clock written as UTC, then each result
  // becomes a real instant in America/New_York. UNTIL is an instant, so it is turned into New
  // York's wall clock first: 24 Dec 1997 00:00Z is 23 Dec 19:00 EST.
  it.each(VECTORS.map((v, i) => [i + 1, v] as const))("vector %i gives the RFC's dates at 09:00", (_n, v) => {
    const options = rrule.RRule.parseString(v.rule);
    const [y, m, d] = v.start;
    const until = options.until ? new TZDate(options.until, NY) : null;
    const floatingUntil = until
      ? new Date(Date.UTC(until.getFullYear(), until.getMonth(), until.getDate(), until.getHours(), until.getMinutes()))
      : null;
    const dates = new rrule.RRule({
      ...options,
      dtstart: new Date(Date.UTC(y, m - 1, d, 9)),
      until: floatingUntil,
    }).all();
    expect(dates.map((x) => x.toISOString().slice(0, 10))).toEqual(v.days);
    expect(dates.every((x) => x.getUTCHours() === 9)).toBe(true);
  });

  it("vector 1 as instants: 09:00 EDT is 13:00Z until 26 Oct 1997, then 09:00 EST is 14:00Z", () => {
    // US clocks went back on the last Sunday of October 1997 (IANA tz database, common practice).
    const instants = VECTOR_1.days.map((k) => {
      const [y, m, d] = k.split("-").map(Number) as [number, number, number];
      return at(NY, y, m, d, 9).toISOString();
    });
    expect(instants[0]).toBe("1997-09-01T13:00:00.000Z");
    expect(instants[VECTOR_1.days.indexOf("1997-10-17")]).toBe("1997-10-17T13:00:00.000Z");
    expect(instants[VECTOR_1.days.indexOf("1997-10-27")]).toBe("1997-10-27T14:00:00.000Z");
    expect(instants.at(-1)).toBe("1997-12-22T14:00:00.000Z");
  });
});

describe("RFC 5545 3.8.5.3 vectors through Keelson's day engine in America/New_York", () => {
  it.each(VECTORS.map((v, i) => [i + 1, v] as const))("vector %i gives the RFC's days", (_n, v) => {
    const [y, m, d] = v.start;
    const start = at(NY, y, m, d, 9);
    const found = occurrencesBetween(v.rule, start, start, at(NY, 2008, 12, 31), NY);
    expect(days(found, NY)).toEqual(v.days);
  });

  it("vector 1 stops at UNTIL: 24 Dec 1997 is a Wednesday but starts after 24 Dec 00:00Z (23 Dec 19:00 EST)", () => {
    const start = at(NY, 1997, 9, 1, 9);
    expect(nextOccurrenceAfter(VECTOR_1.rule, start, at(NY, 1997, 12, 22), NY)).toBeNull();
  });

  it("a date UNTIL is the last day that may fall due (inclusive, RFC 5545 3.3.10)", () => {
    const start = at(NY, 1997, 9, 1, 9);
    const rule = "FREQ=WEEKLY;INTERVAL=2;UNTIL=19971222;WKST=SU;BYDAY=MO,WE,FR";
    expect(days(occurrencesBetween(rule, start, start, at(NY, 1998, 6, 1), NY), NY).at(-1)).toBe("1997-12-22");
  });
});

describe("nextOccurrenceAfter on ship's days", () => {
  it("due instant is the end of the ship's day, across the EU spring change (Amsterdam, 29 Mar 2026)", () => {
    // Worked by hand: weekly from Saturday 21 Mar 2026; 28 Mar ends at 24:00 CET = 23:00Z, and
    // 4 Apr at 24:00 CEST = 22:00Z (EU summer time from 29 Mar 2026 01:00Z, common practice).
    const ams = "Europe/Amsterdam";
    const start = at(ams, 2026, 3, 21, 10);
    expect(iso(nextOccurrenceAfter("FREQ=WEEKLY", start, start, ams))).toBe("2026-03-28T22:59:59.999Z");
    expect(iso(nextOccurrenceAfter("FREQ=WEEKLY", start, at(ams, 2026, 3, 28), ams))).toBe("2026-04-04T21:59:59.999Z");
  });

  it("across the US autumn change (New York, 1 Nov 2026): Monday's end moves from 04:00Z to 05:00Z", () => {
    // Worked by hand: 26 Oct ends at 24:00 EDT (UTC−4) = 27 Oct 04:00Z; 2 Nov at 24:00 EST (UTC−5) = 3 Nov 05:00Z.
    const start = at(NY, 2026, 10, 20);
    expect(iso(nextOccurrenceAfter("FREQ=WEEKLY;BYDAY=MO", start, start, NY))).toBe("2026-10-27T03:59:59.999Z");
    expect(iso(nextOccurrenceAfter("FREQ=WEEKLY;BYDAY=MO", start, at(NY, 2026, 10, 26), NY))).toBe(
      "2026-11-03T04:59:59.999Z",
    );
  });

  it("Santiago skips midnight on 6 Sep 2026: 5 Sep ends when 6 Sep starts at 01:00 (04:00Z)", () => {
    const scl = "America/Santiago";
    const start = at(scl, 2026, 9, 4);
    expect(iso(nextOccurrenceAfter("FREQ=DAILY", start, start, scl))).toBe("2026-09-06T03:59:59.999Z");
  });

  it("uses the ship's day, not the UTC day: 1 Dec 19:00Z is already 2 Dec in Auckland", () => {
    const done = new Date("2026-12-01T19:00:00Z");
    const next = nextOccurrenceAfter("FREQ=DAILY;INTERVAL=3", done, done, "Pacific/Auckland");
    expect(shipDateKey(shipDateOf(next ?? new Date(0), "Pacific/Auckland"))).toBe("2026-12-05");
  });

  it("the start counts when it matches and `after` is before it (RFC 5545 3.8.5.3: DTSTART is the first)", () => {
    const start = at("UTC", 2026, 5, 4);
    expect(iso(nextOccurrenceAfter("FREQ=MONTHLY", start, at("UTC", 2026, 1, 1), "UTC"))).toBe(
      "2026-05-04T23:59:59.999Z",
    );
  });

  it("COUNT counts the start: after the last of 3 there is none", () => {
    const start = at("UTC", 2026, 1, 10);
    expect(nextOccurrenceAfter("FREQ=MONTHLY;COUNT=3", start, at("UTC", 2026, 3, 10), "UTC")).toBeNull();
    expect(iso(nextOccurrenceAfter("FREQ=MONTHLY;COUNT=3", start, at("UTC", 2026, 3, 9), "UTC"))).toBe(
      "2026-03-10T23:59:59.999Z",
    );
  });
});

describe("plain every-N-months rules clamp to the month's end (Keelson's convention)", () => {
  const next = (rule: string, y: number, m: number, d: number) => {
    const start = at("UTC", y, m, d);
    return shipDateKey(shipDateOf(nextOccurrenceAfter(rule, start, start, "UTC") ?? new Date(0), "UTC"));
  };
  it("30 Nov 2025 + 3 months → 28 Feb 2026; 30 Nov 2027 + 3 months → 29 Feb 2028", () => {
    expect(next("FREQ=MONTHLY;INTERVAL=3", 2025, 11, 30)).toBe("2026-02-28");
    expect(next("FREQ=MONTHLY;INTERVAL=3", 2027, 11, 30)).toBe("2028-02-29");
  });
  it("29 Feb 2028 + 1 year → 28 Feb 2029, not 29 Feb 2032", () => {
    expect(next("FREQ=YEARLY", 2028, 2, 29)).toBe("2029-02-28");
  });
  it("the series counts from its start, so it does not drift: 31 Jan → 28 Feb → 31 Mar", () => {
    const start = at("UTC", 2026, 1, 31);
    expect(days(occurrencesBetween("FREQ=MONTHLY", start, start, at("UTC", 2026, 4, 30), "UTC"), "UTC")).toEqual([
      "2026-01-31",
      "2026-02-28",
      "2026-03-31",
      "2026-04-30",
    ]);
  });
  it("with a BY part, RFC 5545 applies: 31st of the month skips short months (3.3.10, invalid dates skipped)", () => {
    const start = at("UTC", 2026, 1, 31);
    expect(
      days(occurrencesBetween("FREQ=MONTHLY;BYMONTHDAY=31", start, start, at("UTC", 2026, 5, 31), "UTC"), "UTC"),
    ).toEqual(["2026-01-31", "2026-03-31", "2026-05-31"]);
  });
});
