// The words of each reminder: subject and MailContent (server/mail/render.ts lays it out as HTML
// and plain text). Pure: links come from the caller, so the same words are tested without a
// running app. Calm and factual: what happened, where, and the one place to act.
import { formatHours, formatShipDate, formatShipTime } from "@/server/format/hours";
import { MAIL_KIND_LABEL } from "@/server/mail/kinds";
import type { MailKind } from "@/server/mail/outbox";
import type { MailContent, MailLine } from "@/server/mail/render";
import { type DigestOccasion, type MissingReadingsStep, shipDayLabel } from "./schedule";
import type { DigestItem, DigestSelection } from "./selection";
import { amountText } from "@/server/parts/contract";
import type { PartUnit } from "@/db/schema/parts";
import type { TrendWarning } from "@/server/measurements/contract";

/** A critical spare under the company's minimum on board. */
export type LowSpareLine = { number: string; description: string; unit: PartUnit; onBoard: number; minimum: number };

export type MailLinks = {
  /** An absolute link into the app. */
  app(path: string): string;
  /** The one-click unsubscribe link of this recipient for the kind. */
  unsubscribe(kind: MailKind): string;
};

export type Built = { subject: string; content: MailContent };

type VesselRef = { id: string; name: string; timeZone: string };

/** Sections longer than this end with a line to the Backlog: a mail is not the place for 300 rows. */
export const SECTION_LIMIT = 40;

const CAUTION =
  "Keelson plans and records; the maker’s instructions, the company’s safety management system and class and flag requirements prevail.";

const workOrderPath = (vesselId: string, workOrderId: string) => `/vessels/${vesselId}/work-orders/${workOrderId}`;
const backlogPath = (vesselId: string) => `/vessels/${vesselId}/backlog`;

function unsubscribe(kind: MailKind, links: MailLinks) {
  return { href: links.unsubscribe(kind), kindLabel: MAIL_KIND_LABEL[kind] };
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

function workOrderNote(w: DigestItem): string {
  const parts = [w.dueDay ? `due ${shipDayLabel(w.dueDay)}` : "due by running hours"];
  if (w.deferredDueDate || w.deferredDueHours !== null) parts.push("under a deferral");
  if (w.critical) parts.push("critical equipment");
  if (w.classRelated) parts.push("class-related");
  return parts.join(" · ").replace(/^./, (c) => c.toUpperCase());
}

function workOrderLines(vesselId: string, items: DigestItem[], links: MailLinks): MailLine[] {
  const lines: MailLine[] = items.slice(0, SECTION_LIMIT).map((w) => ({
    text: `${w.number} ${w.title}`,
    href: links.app(workOrderPath(vesselId, w.id)),
    note: workOrderNote(w),
  }));
  if (items.length > SECTION_LIMIT) {
    lines.push({
      text: `and ${items.length - SECTION_LIMIT} more in the Backlog`,
      href: links.app(backlogPath(vesselId)),
    });
  }
  return lines;
}

/** "3 late, 1 out of tolerance, 2 window open, 12 due in 7 days" (zeros left out). */
export function digestCounts(selection: DigestSelection): string {
  const parts = [
    selection.late.length ? `${selection.late.length} late` : "",
    selection.outOfTolerance.length ? `${selection.outOfTolerance.length} out of tolerance` : "",
    selection.windowOpen.length ? `${selection.windowOpen.length} window open` : "",
    selection.dueSoon.length ? `${selection.dueSoon.length} due in 7 days` : "",
  ].filter(Boolean);
  return parts.length ? parts.join(", ") : "nothing new";
}

export function dueDigestMail(
  input: {
    vessel: VesselRef;
    occasion: DigestOccasion;
    selection: DigestSelection;
    /** Every open work order of the vessel late / out of tolerance now, not only the new ones. */
    totals: { late: number; outOfTolerance: number };
    /** Critical spares under their minimum on board. */
    lowSpares?: LowSpareLine[];
    /** Measurements whose straight line reaches its limit before the job falls due (server/measurements). */
    trendWarnings?: TrendWarning[];
    /** Work by running hours whose counter was never read: no due date until it is. */
    firstReadings?: { workOrderId: string; number: string; title: string; counter: string }[];
  },
  links: MailLinks,
): Built {
  const { vessel, occasion, selection, totals, lowSpares = [], trendWarnings = [], firstReadings = [] } = input;
  const day = shipDayLabel(occasion.shipDay);
  const since = `${formatShipTime(occasion.previousCutOff, vessel.timeZone)} ship’s time`;
  const standing =
    totals.late + totals.outOfTolerance > 0
      ? ` In all, ${plural(totals.late, "work order is", "work orders are")} late and ${totals.outOfTolerance} out of tolerance on board.`
      : " No work is late or out of tolerance on board.";
  const sections = [
    { heading: "Went out of tolerance", items: selection.outOfTolerance },
    { heading: "Ran late", items: selection.late },
    { heading: "Window opened", items: selection.windowOpen },
    {
      heading: `Due in the next 7 days (${day} – ${shipDayLabel(occasion.dueUntil)})`,
      items: selection.dueSoon,
    },
  ]
    .filter((s) => s.items.length > 0)
    .map((s) => ({ heading: s.heading, lines: workOrderLines(vessel.id, s.items, links) }));
  if (lowSpares.length) {
    sections.push({
      heading: "Critical spares under their minimum",
      lines: lowSpares.slice(0, SECTION_LIMIT).map((p) => ({
        text: `${p.number} ${p.description}`,
        href: links.app(`/vessels/${vessel.id}/stores`),
        note: `${amountText(p.onBoard, p.unit)} on board, minimum ${amountText(p.minimum, p.unit)}`,
      })),
    });
  }
  if (trendWarnings.length) {
    sections.push({
      heading: "Measurements reaching their limit before the job falls due",
      lines: trendWarnings.slice(0, SECTION_LIMIT).map((t) => ({
        text: `${t.number} ${t.title}`,
        href: links.app(workOrderPath(vessel.id, t.workOrderId)),
        note: t.sentence,
      })),
    });
  }
  if (firstReadings.length) {
    sections.push({
      heading: "Waiting for a first reading of their counter",
      lines: firstReadings.slice(0, SECTION_LIMIT).map((w) => ({
        text: `${w.number} ${w.title}`,
        href: links.app(`/vessels/${vessel.id}/hour-log`),
        note: `${w.counter} has no reading yet: until it is read, Keelson cannot say when this falls due.`,
      })),
    });
  }
  const counts = digestCounts(selection);
  return {
    subject: `${vessel.name} — due digest for ${day}: ${counts}`,
    content: {
      preheader: counts,
      title: `${vessel.name}: due digest for ${day}`,
      intro: `What changed since the digest of ${since}, and what falls due this week.${standing}`,
      sections,
      action: { label: "Open the Backlog", href: links.app(backlogPath(vessel.id)) },
      footer: `Dates are ship’s days (${vessel.timeZone}). ${CAUTION}`,
      unsubscribe: unsubscribe("due-digest", links),
    },
  };
}

export type CounterReading = { name: string; readAt: Date | null; totalHours: number | null };

const STEP_AUDIENCE: Record<MissingReadingsStep, string> = {
  1: "This reminder goes to the vessel’s engineers.",
  2: "The vessel’s engineers were reminded earlier; this reminder goes to the chief engineer.",
  3: "The vessel’s engineers and chief engineer were reminded earlier; this reminder goes to the technical superintendents. The vessel may have trouble reaching Keelson.",
};

export function missingReadingsMail(
  input: {
    vessel: VesselRef;
    step: MissingReadingsStep;
    latestReadingAt: Date;
    hours: number;
    counters: CounterReading[];
  },
  links: MailLinks,
): Built {
  const { vessel, step, latestReadingAt, hours, counters } = input;
  const when = `${formatShipTime(latestReadingAt, vessel.timeZone)} ship’s time`;
  const lines: MailLine[] = counters.map((c) => ({
    text:
      c.readAt && c.totalHours !== null
        ? `${c.name}: ${formatHours(c.totalHours)} on ${formatShipTime(c.readAt, vessel.timeZone)}`
        : `${c.name}: no reading yet`,
  }));
  return {
    subject:
      step === 1
        ? `${vessel.name} — no hour-meter reading for ${hours} h`
        : `${vessel.name} — still no hour-meter reading after ${hours} h`,
    content: {
      preheader: `Latest reading ${when}`,
      title: `${vessel.name}: no hour-meter reading for ${hours} hours`,
      intro:
        `The latest reading on ${vessel.name} is of ${when}, ${hours} hours ago. ` +
        `Running-hour work falls due by these readings, so its due dates drift until they are entered. ${STEP_AUDIENCE[step]}`,
      sections: lines.length ? [{ heading: "Latest reading of each counter", lines }] : [],
      action: { label: "Open the Hour log", href: links.app(`/vessels/${vessel.id}/hour-log`) },
      footer: "Enter the readings in the Hour log; this reminder then stops until readings stop again.",
      unsubscribe: unsubscribe("missing-readings", links),
    },
  };
}

/**
 * One message per vessel and run: every work order that went out of tolerance in it (each change
 * still escalated once). One work order is named in the subject; more are counted there and listed.
 */
export function escalationMail(
  input: { vessel: VesselRef; items: { workOrder: DigestItem; changedAt: Date }[] },
  links: MailLinks,
): Built {
  const { vessel, items } = input;
  const flagsOf = (w: DigestItem) => [w.critical ? "critical equipment" : "", w.classRelated ? "class-related" : ""].filter(Boolean);
  const decide =
    "The chief engineer decides how to catch up: do the work at the first safe opportunity, or request a deferral with its reason for the office to decide.";
  const footer = `You get one message per vessel and run of the reminders, listing every work order that went out of tolerance in it. ${CAUTION}`;
  if (items.length === 1) {
    const { workOrder: w, changedAt } = items[0]!;
    const flags = flagsOf(w);
    return {
      subject: `${vessel.name} — ${w.number} is out of tolerance: ${w.title}`,
      content: {
        preheader: `${w.number} is past the end of its grace`,
        title: `${w.number} is out of tolerance`,
        intro:
          `${w.number} on ${vessel.name} went past the end of its tolerance grace (noted ${formatShipTime(changedAt, vessel.timeZone)} ship’s time). ${decide}` +
          (flags.length ? ` This work is ${flags.join(" and ")}.` : ""),
        sections: [{ heading: "Work order", lines: workOrderLines(vessel.id, [w], links) }],
        action: { label: "Open the work order", href: links.app(workOrderPath(vessel.id, w.id)) },
        footer,
        unsubscribe: unsubscribe("escalation", links),
      },
    };
  }
  const flagged = items.filter((i) => flagsOf(i.workOrder).length > 0).length;
  const first = items.reduce((a, b) => (b.changedAt < a.changedAt ? b : a)).changedAt;
  return {
    subject: `${vessel.name} — ${items.length} work orders went out of tolerance`,
    content: {
      preheader: `${items.length} work orders past the end of their grace`,
      title: `${items.length} work orders went out of tolerance on ${vessel.name}`,
      intro:
        `Since ${formatShipTime(first, vessel.timeZone)} ship’s time these work orders went past the end of their tolerance grace. ${decide}` +
        (flagged ? ` ${plural(flagged, "of them is", "of them are")} on critical equipment or class-related.` : ""),
      sections: [{ heading: "Work orders", lines: workOrderLines(vessel.id, items.map((i) => i.workOrder), links) }],
      action: { label: "Open the Backlog", href: links.app(`${backlogPath(vessel.id)}?state=out-of-tolerance`) },
      footer,
      unsubscribe: unsubscribe("escalation", links),
    },
  };
}

export type FleetVesselFigures = {
  id: string;
  name: string;
  outOfTolerance: number;
  /** Out of tolerance on critical equipment or class-related: the ones a survey or audit asks about. */
  criticalOrClassOutOfTolerance: number;
  late: number;
  dueSoon: number;
  lastReadingAt: Date | null;
  pendingDeferrals: number;
};

function readingAge(at: Date | null, now: Date): string {
  if (!at) return "no readings yet";
  const days = Math.floor((now.getTime() - at.getTime()) / 86_400_000);
  if (days <= 0) return "last reading today";
  return `last reading ${plural(days, "day")} ago`;
}

export function fleetSummaryMail(
  input: { companyName: string; isoWeek: string; vessels: FleetVesselFigures[]; now: Date },
  links: MailLinks,
): Built {
  const { companyName, isoWeek, vessels, now } = input;
  const week = Number(isoWeek.slice(-2));
  const outOfTolerance = vessels.reduce((n, v) => n + v.outOfTolerance, 0);
  const late = vessels.reduce((n, v) => n + v.late, 0);
  const ordered = [...vessels].sort(
    (a, b) =>
      b.criticalOrClassOutOfTolerance - a.criticalOrClassOutOfTolerance ||
      b.outOfTolerance - a.outOfTolerance ||
      b.late - a.late ||
      a.name.localeCompare(b.name),
  );
  const lines: MailLine[] = ordered.map((v) => ({
    text: `${v.name}: ${v.outOfTolerance} out of tolerance, ${v.late} late, ${v.dueSoon} due in 7 days`,
    href: links.app(backlogPath(v.id)),
    note: [
      v.criticalOrClassOutOfTolerance ? `${v.criticalOrClassOutOfTolerance} of them critical or class-related` : "",
      readingAge(v.lastReadingAt, now),
      v.pendingDeferrals ? `${plural(v.pendingDeferrals, "deferral request")} waiting` : "",
    ]
      .filter(Boolean)
      .join(" · ")
      .replace(/^./, (c) => c.toUpperCase()),
  }));
  return {
    subject: `${companyName} — fleet summary for week ${week}: ${outOfTolerance} out of tolerance, ${late} late on ${plural(vessels.length, "vessel")}`,
    content: {
      preheader: `${outOfTolerance} out of tolerance, ${late} late`,
      title: `Fleet summary, week ${week}`,
      intro: `The state of ${companyName}’s fleet on ${formatShipDate(now, "UTC")} (UTC): work out of tolerance and late on each vessel, what falls due in the next 7 days, and how recently each vessel entered its hour-meter readings.`,
      sections: lines.length ? [{ heading: "Vessels", lines }] : [],
      action: { label: "Open the Fleet board", href: links.app("/fleet") },
      unsubscribe: unsubscribe("fleet-summary", links),
    },
  };
}
