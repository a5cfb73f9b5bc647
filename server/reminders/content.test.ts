import { describe, expect, it } from "vitest";
import { renderMail } from "@/server/mail/render";
import {
  digestCounts,
  dueDigestMail,
  escalationMail,
  fleetSummaryMail,
  missingReadingsMail,
  SECTION_LIMIT,
} from "./content";
import { dueDigest } from "./schedule";
import type { DigestItem, DigestSelection } from "./selection";

const links = {
  app: (path: string) => `https://keelson.example${path}`,
  unsubscribe: (kind: string) => `https://keelson.example/unsubscribe?k=${kind}`,
};
const vessel = { id: "v1", name: "Aster Gale", timeZone: "Asia/Singapore" };
const item = (id: string, dueDay: string | null, extra: Partial<DigestItem> = {}): DigestItem => ({
  id,
  number: `WO-AST-0000${id}`,
  title: `Job ${id}`,
  state: "late",
  dueDate: null,
  deferredDueDate: null,
  deferredDueHours: null,
  critical: false,
  classRelated: false,
  dueDay,
  ...extra,
});

describe("dueDigestMail", () => {
  const occasion = dueDigest(new Date("2026-12-01T22:05:00Z"), vessel.timeZone, 6)!;
  const selection: DigestSelection = {
    late: [item("1", "2026-11-28"), item("2", "2026-11-29"), item("3", "2026-11-30")],
    outOfTolerance: [item("4", "2026-10-31", { critical: true, classRelated: true })],
    windowOpen: [],
    dueSoon: [item("5", "2026-12-04")],
  };
  const mail = dueDigestMail({ vessel, occasion, selection, totals: { late: 5, outOfTolerance: 2 } }, links);

  it("says the counts in the subject", () => {
    expect(mail.subject).toBe("Aster Gale — due digest for Wed 2 Dec: 3 late, 1 out of tolerance, 1 due in 7 days");
  });

  it("links every line to its work order and the action to the Backlog, in HTML and text", () => {
    const { html, text } = renderMail(mail.content);
    for (const id of ["1", "2", "3", "4", "5"]) {
      expect(text).toContain(`https://keelson.example/vessels/v1/work-orders/${id}`);
      expect(html).toContain(`href="https://keelson.example/vessels/v1/work-orders/${id}"`);
    }
    expect(text).toContain("Open the Backlog: https://keelson.example/vessels/v1/backlog");
    expect(text).toContain("Unsubscribe: https://keelson.example/unsubscribe?k=due-digest");
    expect(text).toContain("Due Sat 31 Oct · critical equipment · class-related");
    // The window starts at the previous digest: 1 Dec 06:00 ship's time (30 Nov 22:00 UTC).
    expect(text).toContain("since the digest of 1 Dec 2026 06:00 ship’s time");
    expect(text).toContain("In all, 5 work orders are late and 2 out of tolerance on board.");
    expect(mail.content.sections.map((s) => s.heading)).toEqual([
      "Went out of tolerance",
      "Ran late",
      "Due in the next 7 days (Wed 2 Dec – Tue 8 Dec)",
    ]);
  });

  it("says which critical spares are under their minimum, linked to the stores", () => {
    const withSpares = dueDigestMail(
      {
        vessel,
        occasion,
        selection,
        totals: { late: 5, outOfTolerance: 2 },
        lowSpares: [{ number: "KP-10432", description: "Piston ring set", unit: "set", onBoard: 1, minimum: 2 }],
      },
      links,
    );
    const section = withSpares.content.sections.at(-1)!;
    expect(section.heading).toBe("Critical spares under their minimum");
    expect(section.lines).toEqual([
      { text: "KP-10432 Piston ring set", href: "https://keelson.example/vessels/v1/stores", note: "1 set on board, minimum 2 sets" },
    ]);
    expect(mail.content.sections.map((s) => s.heading)).not.toContain("Critical spares under their minimum");
  });

  it("tells the chief engineer which work waits for a first reading of its counter, linked to the Hour log", () => {
    const waiting = dueDigestMail(
      {
        vessel,
        occasion,
        selection,
        totals: { late: 5, outOfTolerance: 2 },
        firstReadings: [{ workOrderId: "w9", number: "WO-X-00009", title: "Emergency generator 500 h service", counter: "Emergency generator" }],
      },
      links,
    );
    const section = waiting.content.sections.at(-1)!;
    expect(section.heading).toBe("Waiting for a first reading of their counter");
    expect(section.lines).toEqual([
      {
        text: "WO-X-00009 Emergency generator 500 h service",
        href: "https://keelson.example/vessels/v1/hour-log",
        note: "Emergency generator has no reading yet: until it is read, Keelson cannot say when this falls due.",
      },
    ]);
    expect(mail.content.sections.map((s) => s.heading)).not.toContain("Waiting for a first reading of their counter");
  });

  it("cuts a long section with a line to the Backlog", () => {
    const many = Array.from({ length: SECTION_LIMIT + 5 }, (_, i) => item(String(i), "2026-12-03"));
    const long = dueDigestMail(
      {
        vessel,
        occasion,
        selection: { late: [], outOfTolerance: [], windowOpen: [], dueSoon: many },
        totals: { late: 0, outOfTolerance: 0 },
      },
      links,
    );
    const lines = long.content.sections[0]!.lines;
    expect(lines).toHaveLength(SECTION_LIMIT + 1);
    expect(lines.at(-1)).toEqual({
      text: "and 5 more in the Backlog",
      href: "https://keelson.example/vessels/v1/backlog",
    });
    expect(digestCounts({ late: [], outOfTolerance: [], windowOpen: [], dueSoon: many })).toBe("45 due in 7 days");
  });
});

describe("the other messages", () => {
  it("missing readings: hours, the latest reading and the Hour log", () => {
    const latest = new Date("2026-11-30T01:00:00Z"); // 09:00 SGT
    const mail = missingReadingsMail(
      {
        vessel,
        step: 2,
        latestReadingAt: latest,
        hours: 61,
        counters: [
          { name: "Main engine", readAt: latest, totalHours: 12431.5 },
          { name: "Generator 4", readAt: null, totalHours: null },
        ],
      },
      links,
    );
    expect(mail.subject).toBe("Aster Gale — still no hour-meter reading after 61 h");
    const { text } = renderMail(mail.content);
    expect(text).toContain("The latest reading on Aster Gale is of 30 Nov 2026 09:00 ship’s time, 61 hours ago.");
    expect(text).toContain("- Main engine: 12,431.5 h on 30 Nov 2026 09:00");
    expect(text).toContain("- Generator 4: no reading yet");
    expect(text).toContain("this reminder goes to the chief engineer");
    expect(text).toContain("Open the Hour log: https://keelson.example/vessels/v1/hour-log");
  });

  it("escalation: the work order and its link", () => {
    const mail = escalationMail(
      {
        vessel,
        items: [{ workOrder: item("9", "2026-11-01", { title: "Purifier bowl overhaul", critical: true }), changedAt: new Date("2026-12-01T02:00:00Z") }],
      },
      links,
    );
    expect(mail.subject).toBe("Aster Gale — WO-AST-00009 is out of tolerance: Purifier bowl overhaul");
    const { text } = renderMail(mail.content);
    expect(text).toContain("(noted 1 Dec 2026 10:00 ship’s time)");
    expect(text).toContain("This work is critical equipment.");
    expect(text).toContain("Open the work order: https://keelson.example/vessels/v1/work-orders/9");
    expect(text).toContain("Unsubscribe: https://keelson.example/unsubscribe?k=escalation");
  });

  it("escalation: one message for every work order of the vessel that went out of tolerance in the run", () => {
    const mail = escalationMail(
      {
        vessel,
        items: [
          { workOrder: item("9", "2026-11-01", { title: "Purifier bowl overhaul", critical: true }), changedAt: new Date("2026-12-01T02:00:00Z") },
          { workOrder: item("10", "2026-11-02", { title: "Boiler burner cleaning" }), changedAt: new Date("2026-12-01T02:00:05Z") },
          { workOrder: item("11", "2026-11-03", { title: "Fire pump run", classRelated: true }), changedAt: new Date("2026-12-01T02:00:09Z") },
        ],
      },
      links,
    );
    expect(mail.subject).toBe("Aster Gale — 3 work orders went out of tolerance");
    const { text } = renderMail(mail.content);
    for (const id of ["9", "10", "11"]) expect(text).toContain(`https://keelson.example/vessels/v1/work-orders/${id}`);
    expect(text).toContain("Since 1 Dec 2026 10:00 ship’s time these work orders went past the end of their tolerance grace.");
    expect(text).toContain("2 of them are on critical equipment or class-related.");
    expect(text).toContain("Open the Backlog: https://keelson.example/vessels/v1/backlog?state=out-of-tolerance");
  });

  it("fleet summary: the vessels in order of what is out of tolerance", () => {
    const now = new Date("2026-11-30T06:00:00Z");
    const base = { late: 0, dueSoon: 0, pendingDeferrals: 0, criticalOrClassOutOfTolerance: 0, outOfTolerance: 0 };
    const mail = fleetSummaryMail(
      {
        companyName: "Brightwater",
        isoWeek: "2026-W49",
        now,
        vessels: [
          { ...base, id: "a", name: "Aster Gale", late: 3, lastReadingAt: new Date("2026-11-29T01:00:00Z") },
          {
            ...base,
            id: "c",
            name: "Corran Ness",
            outOfTolerance: 2,
            criticalOrClassOutOfTolerance: 1,
            pendingDeferrals: 1,
            lastReadingAt: null,
          },
        ],
      },
      links,
    );
    expect(mail.subject).toBe("Brightwater — fleet summary for week 49: 2 out of tolerance, 3 late on 2 vessels");
    const { text } = renderMail(mail.content);
    expect(text.indexOf("Corran Ness")).toBeLessThan(text.indexOf("Aster Gale"));
    expect(text).toContain("1 of them critical or class-related · no readings yet · 1 deferral request waiting");
    expect(text).toContain("Last reading 1 day ago"); // 29 Nov 01:00 → 30 Nov 06:00 UTC: 29 h, 1 whole day
    expect(text).toContain("Open the Fleet board: https://keelson.example/fleet");
  });
});
