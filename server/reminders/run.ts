// One reminder run (the worker's job every 15 minutes): for every company and active vessel,
// queue in the outbox what is due now — the due digest, the missing-readings chain, escalations —
// and on Mondays the fleet summary. Rerunning it queues nothing new: every message has its dedupe
// key (schedule.ts), and an escalation marks its state change handled in the same transaction
// that queues the messages, so either both happen or neither does.
import "server-only";
import type { Db, Tx } from "@/db/client";
import { requestMailSend } from "@/server/jobs/mail-send";
import { appUrl, unsubscribeUrl } from "@/server/mail/links";
import { enqueueMail, type MailKind } from "@/server/mail/outbox";
import { renderMail } from "@/server/mail/render";
import {
  type Built,
  dueDigestMail,
  escalationMail,
  fleetSummaryMail,
  type MailLinks,
  missingReadingsMail,
} from "./content";
import {
  loadActiveVessels,
  loadCompanies,
  loadCounterReadings,
  loadDigestInputs,
  loadFleetFigures,
  loadMembers,
  loadStandingTotals,
  lockUnhandledEscalations,
  markEscalated,
  type ReminderCompany,
  type ReminderVessel,
} from "./queries";
import { lowCriticalSpares } from "@/server/parts/low-stock";
import { loadTrendWarnings } from "@/server/measurements/queries";
import { dueDigest, dueFleetSummary, hoursSince, missingReadingsSteps, reminderKeys } from "./schedule";
import {
  digestRecipients,
  escalationRecipients,
  fleetSummaryRecipients,
  isEmptyDigest,
  type Member,
  missingReadingsRecipients,
  selectDigest,
  splitEscalations,
  toDigestItem,
} from "./selection";
import { awaitingFirstReading } from "@/server/readings/first-reading";

export type ReminderCounts = {
  companies: number;
  vessels: number;
  /** Messages queued (a rerun's duplicates and opted-out people are not counted). */
  dueDigests: number;
  missingReadings: number;
  escalations: number;
  /** State changes marked handled without a message (too old, or no longer out of tolerance). */
  escalationsMarkedOnly: number;
  fleetSummaries: number;
};

export type RunOptions = {
  /** Only these companies (tests); every company by default. */
  companyIds?: string[];
};

function linksFor(companyId: string, userId: string): MailLinks {
  return { app: appUrl, unsubscribe: (kind: MailKind) => unsubscribeUrl(userId, companyId, kind) };
}

async function queue(
  tx: Tx,
  companyId: string,
  people: Member[],
  kind: MailKind,
  keyOf: (userId: string) => string,
  build: (links: MailLinks) => Built,
): Promise<number> {
  let queued = 0;
  for (const person of people) {
    const { subject, content } = build(linksFor(companyId, person.userId));
    const { html, text } = renderMail(content);
    const inserted = await enqueueMail(tx, {
      companyId,
      userId: person.userId,
      to: person.email,
      kind,
      dedupeKey: keyOf(person.userId),
      subject,
      html,
      text,
    });
    if (inserted) queued++;
  }
  // The worker sends them within seconds of the commit (and only if it commits).
  if (queued > 0) await requestMailSend(tx);
  return queued;
}

async function dueDigestsOf(tx: Tx, co: ReminderCompany, v: ReminderVessel, members: Member[], now: Date) {
  const occasion = dueDigest(now, v.timeZone, co.digestHour);
  const people = digestRecipients(members, v.id);
  if (!occasion || people.length === 0) return 0;
  const { changes, workOrders } = await loadDigestInputs(tx, co.id, v, occasion);
  const selection = selectDigest({ occasion, timeZone: v.timeZone, changes, workOrders });
  // Work that cannot be dated (a counter never read) and measurements heading for their limit are
  // news of their own: they never enter the selection, which needs a due date.
  const trendWarnings = await loadTrendWarnings(tx, co.id, v);
  const firstReadings = await awaitingFirstReading(tx, co.id, v.id);
  // Nothing changed, nothing falls due this week and nothing waits: no message rather than an empty one.
  if (isEmptyDigest(selection) && trendWarnings.length === 0 && firstReadings.length === 0) return 0;
  const totals = await loadStandingTotals(tx, co.id, v.id);
  const lowSpares = await lowCriticalSpares(tx, co.id, v.id);
  return queue(
    tx,
    co.id,
    people,
    "due-digest",
    (userId) => reminderKeys.dueDigest(v.id, occasion.shipDay, userId),
    (links) => dueDigestMail({ vessel: v, occasion, selection, totals, lowSpares, trendWarnings, firstReadings }, links),
  );
}

async function missingReadingsOf(tx: Tx, co: ReminderCompany, v: ReminderVessel, members: Member[], now: Date) {
  const counters = await loadCounterReadings(tx, co.id, v.id, now);
  const latest = counters.reduce<Date | null>((at, c) => (c.readAt && (!at || c.readAt > at) ? c.readAt : at), null);
  // A vessel that never entered a reading has no gap to count (a vessel not yet in service); the
  // Fleet board shows it without readings.
  if (!latest) return 0;
  let queued = 0;
  for (const step of missingReadingsSteps(latest, now, co.missingReadingsHours, co.missingReadingsStepHours)) {
    const hours = hoursSince(latest, now);
    queued += await queue(
      tx,
      co.id,
      missingReadingsRecipients(members, v.id, step),
      "missing-readings",
      (userId) => reminderKeys.missingReadings(v.id, latest, step, userId),
      (links) => missingReadingsMail({ vessel: v, step, latestReadingAt: latest, hours, counters }, links),
    );
  }
  return queued;
}

async function escalationsOf(tx: Tx, co: ReminderCompany, v: ReminderVessel, members: Member[], now: Date) {
  const rows = await lockUnhandledEscalations(tx, co.id, v.id, now);
  const { send, markOnly } = splitEscalations(rows, now);
  const people = escalationRecipients(members, v.id);
  let queued = 0;
  // One message per vessel and run, keyed by the run's first change (each change is in one run only).
  if (send.length) {
    const items = send.map((change) => {
      const row = rows.find((r) => r.id === change.id)!;
      return { workOrder: toDigestItem(row.workOrder, v.timeZone), changedAt: row.changedAt };
    });
    queued += await queue(
      tx,
      co.id,
      people,
      "escalation",
      (userId) => reminderKeys.escalation(send[0]!.id, userId),
      (links) => escalationMail({ vessel: v, items }, links),
    );
  }
  await markEscalated(
    tx,
    co.id,
    [...send, ...markOnly].map((c) => c.id),
    now,
  );
  return { queued, markedOnly: markOnly.length };
}

async function fleetSummaryOf(db: Db, co: ReminderCompany, members: Member[], now: Date) {
  const isoWeek = dueFleetSummary(now, co.digestHour);
  const people = fleetSummaryRecipients(members);
  if (!isoWeek || people.length === 0) return 0;
  return db.transaction(async (tx) => {
    const vessels = await loadFleetFigures(tx, co.id, now);
    if (vessels.length === 0) return 0;
    return queue(
      tx,
      co.id,
      people,
      "fleet-summary",
      (userId) => reminderKeys.fleetSummary(co.id, isoWeek, userId),
      (links) => fleetSummaryMail({ companyName: co.name, isoWeek, vessels, now }, links),
    );
  });
}

export async function runReminders(db: Db, now = new Date(), options: RunOptions = {}): Promise<ReminderCounts> {
  const counts: ReminderCounts = {
    companies: 0,
    vessels: 0,
    dueDigests: 0,
    missingReadings: 0,
    escalations: 0,
    escalationsMarkedOnly: 0,
    fleetSummaries: 0,
  };
  for (const co of await loadCompanies(db, options.companyIds)) {
    counts.companies++;
    const members = await loadMembers(db, co.id);
    for (const v of await loadActiveVessels(db, co.id)) {
      counts.vessels++;
      // One transaction per vessel: a failure on one vessel leaves the others' messages queued.
      await db.transaction(async (tx) => {
        counts.dueDigests += await dueDigestsOf(tx, co, v, members, now);
        counts.missingReadings += await missingReadingsOf(tx, co, v, members, now);
        const escalations = await escalationsOf(tx, co, v, members, now);
        counts.escalations += escalations.queued;
        counts.escalationsMarkedOnly += escalations.markedOnly;
      });
    }
    counts.fleetSummaries += await fleetSummaryOf(db, co, members, now);
  }
  return counts;
}
