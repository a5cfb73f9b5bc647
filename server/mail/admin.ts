import "server-only";
import { and, desc, eq, inArray, lt, or, sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { env } from "@/server/env";
import { AppError, invalidInput } from "@/server/http/problem";
import { requestMailSend } from "@/server/jobs/mail-send";
import type { AdminMail, CaughtMessage, ClearCaughtResult, MailActionResult, OutboxRow } from "./contract";
import { smtpConfig } from "./transport";

const OUTBOX_ROWS = 100;
const CAUGHT_ROWS = 50;

type OutboxRecord = typeof mailOutbox.$inferSelect;

function toOutboxRow(r: OutboxRecord): OutboxRow {
  return {
    id: r.id,
    to: r.toAddress,
    kind: r.kind,
    subject: r.subject,
    status: r.status,
    attempts: r.attempts,
    lastError: r.lastError,
    nextAttemptAt: r.nextAttemptAt.toISOString(),
    sentAt: r.sentAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  };
}

/**
 * The local fake's messages of one company (the sender's X-Keelson-Company header): the fake holds
 * every company's mail, and the app never asks it for another company's, nor for all.
 */
function companyMessagesUrl(fakeUrl: string, companyId: string): URL {
  const url = new URL("/messages", fakeUrl);
  url.searchParams.set("company", companyId);
  return url;
}

/**
 * The admin's view of the company's mail: the outbox, and in development the company's messages
 * the local fake caught.
 */
export async function loadAdminMail(access: Access): Promise<AdminMail> {
  const db = getDb();
  const companyId = access.company.id;
  const rows = await db
    .select()
    .from(mailOutbox)
    .where(eq(mailOutbox.companyId, companyId))
    .orderBy(desc(mailOutbox.createdAt), desc(mailOutbox.id))
    .limit(OUTBOX_ROWS);
  const outbox = rows.map(toOutboxRow);

  const fakeUrl = env().KEELSON_MAIL_FAKE_URL;
  if (!fakeUrl) {
    const { host, port } = smtpConfig();
    return { delivery: { kind: "relay", host, port }, caught: null, caughtProblem: null, outbox };
  }

  try {
    const response = await fetch(companyMessagesUrl(fakeUrl, companyId), {
      cache: "no-store",
      signal: AbortSignal.timeout(5000),
    });
    if (!response.ok) throw new Error(`it answered ${response.status}`);
    const ours = (await response.json()) as CaughtMessage[];
    const caught = ours.slice(0, CAUGHT_ROWS).map(({ id, messageId, from, to, subject, date, text, html }) => ({
      id,
      messageId,
      from,
      to,
      subject,
      date,
      text,
      html,
    }));
    return { delivery: { kind: "fake", url: fakeUrl }, caught, caughtProblem: null, outbox };
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return {
      delivery: { kind: "fake", url: fakeUrl },
      caught: [],
      caughtProblem: `The mail fake at ${fakeUrl} did not answer (${reason}).`,
      outbox,
    };
  }
}

// Retry and cancel. The sender claims rows with FOR UPDATE SKIP LOCKED and sets them 'sending';
// each change here is one UPDATE whose WHERE names the statuses it may change, so it cannot race a
// claim: if the claim locked the row first, this UPDATE waits, sees 'sending' and changes nothing;
// if this UPDATE locked it first, the claim skips it and afterwards finds it no longer due.
// When nothing changed, the row is read again to say why.

const notFound = () => new AppError("not-found", "No such message in your company’s outbox.");

type OutboxStatus = (typeof mailOutbox.$inferSelect)["status"];

/**
 * A message may be changed when in one of `statuses`, or 'sending' by a worker whose lease ended.
 * Retry takes waiting, given-up and cancelled messages; cancel takes waiting and given-up ones.
 */
function changeable(companyId: string, messageId: string, statuses: OutboxStatus[]) {
  return and(
    eq(mailOutbox.companyId, companyId),
    eq(mailOutbox.id, messageId),
    or(
      inArray(mailOutbox.status, statuses),
      and(eq(mailOutbox.status, "sending"), lt(mailOutbox.claimedUntil, sql`now()`)),
    ),
  );
}

const utc = (at: Date) => `${at.toISOString().slice(0, 16).replace("T", " ")} UTC`;

/** Why a retry or cancel changed nothing: the message is gone, sent, or in a worker's hands. */
async function whyUnchanged(companyId: string, messageId: string, action: "retried" | "cancelled") {
  const [row] = await getDb()
    .select()
    .from(mailOutbox)
    .where(and(eq(mailOutbox.companyId, companyId), eq(mailOutbox.id, messageId)))
    .limit(1);
  if (!row) return notFound();
  if (row.status === "sent") {
    const when = row.sentAt ? ` on ${utc(row.sentAt)}` : "";
    return invalidInput([
      { field: "status", message: `The message was already sent${when} (status sent); it cannot be ${action}.` },
    ]);
  }
  if (row.status === "cancelled" && action === "cancelled") {
    return invalidInput([{ field: "status", message: "The message is cancelled already (status cancelled)." }]);
  }
  if (row.status === "sending") {
    return invalidInput([
      { field: "status", message: "The message is being sent now (status sending); try again in a minute." },
    ]);
  }
  // Changed between the UPDATE and this read (a claim that has since ended): the list is stale.
  return new AppError("conflict", `The message changed meanwhile (now ${row.status}); refresh and try again.`);
}

/**
 * Puts a failed (or waiting) message back in the queue, due now, and asks the worker to send.
 * Its attempts and last error stay: a message that used its 8 attempts gets one more, and the
 * error is replaced by the next attempt's outcome.
 */
export async function retryMail(access: Access, messageId: string): Promise<MailActionResult> {
  const row = await getDb().transaction(async (tx) => {
    const [updated] = await tx
      .update(mailOutbox)
      .set({ status: "pending", nextAttemptAt: sql`now()`, claimedUntil: null })
      .where(changeable(access.company.id, messageId, ["pending", "failed", "cancelled"]))
      .returning();
    if (updated) await requestMailSend(tx);
    return updated;
  });
  if (!row) throw await whyUnchanged(access.company.id, messageId, "retried");
  return { message: toOutboxRow(row) };
}

/**
 * Stops a message from being sent: status 'cancelled', with "Cancelled by <name>" as its note (the
 * error it had before kept after it); "Try again" brings it back.
 */
export async function cancelMail(access: Access, messageId: string): Promise<MailActionResult> {
  const note = `Cancelled by ${access.user.name}`;
  const [row] = await getDb()
    .update(mailOutbox)
    .set({
      status: "cancelled",
      claimedUntil: null,
      lastError: sql`case when ${mailOutbox.lastError} is null or ${mailOutbox.lastError} like 'Cancelled by %'
                          then ${note}::text else ${note}::text || '. Last error: ' || ${mailOutbox.lastError} end`,
    })
    .where(changeable(access.company.id, messageId, ["pending", "failed"]))
    .returning();
  if (!row) throw await whyUnchanged(access.company.id, messageId, "cancelled");
  return { message: toOutboxRow(row) };
}

/**
 * Clears the company's messages from the local mail catcher (development); other companies'
 * messages stay in it, and the outbox stays as it is.
 */
export async function clearCaughtMail(access: Access): Promise<ClearCaughtResult> {
  const fakeUrl = env().KEELSON_MAIL_FAKE_URL;
  if (!fakeUrl) {
    throw new AppError("not-found", "There is no mail catcher here: mail goes to the configured relay.");
  }
  try {
    const response = await fetch(companyMessagesUrl(fakeUrl, access.company.id), {
      method: "DELETE",
      cache: "no-store",
      signal: AbortSignal.timeout(5000),
    });
    if (!response.ok) throw new Error(`it answered ${response.status}`);
    const { deleted } = (await response.json()) as { deleted: number };
    return { cleared: deleted };
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new AppError("internal", `The mail catcher at ${fakeUrl} did not answer (${reason}); nothing was cleared.`);
  }
}
