import "server-only";
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";
import { env } from "@/server/env";
import { COMPANY_HEADER } from "./contract";
import { oneClickUnsubscribeUrl } from "./links";
import { isAccountKind, type MailKind } from "./outbox";
import { mailTransport, smtpConfig } from "./transport";

// Sending from the outbox. A message is claimed (status 'sending', a lease, attempts + 1) in one
// short statement with FOR UPDATE SKIP LOCKED, so two workers never hold the same row; it is
// marked 'sent' right after the relay's 250. A worker that dies mid-batch leaves its rows
// 'sending' until the lease ends, then any worker claims them again.
//
// The one window where a message can still go out twice: the relay accepted it (250) and the
// process died before the UPDATE that marks it sent committed — a millisecond on a local
// database, against the seconds of a send. SMTP gives no way to close it (the relay cannot be
// asked whether it holds a message), so delivery is at-least-once with that window made tiny;
// the Message-ID is derived from the row, so a receiving system that de-duplicates by Message-ID
// sees the same message.

export type SendResult = { sent: number; retried: number; failed: number; claimed: number };

type Claimed = {
  id: string;
  company_id: string;
  user_id: string | null;
  to_address: string;
  kind: MailKind;
  subject: string;
  html: string;
  text: string;
  attempts: number;
};

const BATCH = 10;

/** 1 min, 2, 4 … after the 1st, 2nd, 3rd failed attempt, at most 6 h. */
export function retryDelayMs(attempts: number): number {
  return Math.min(60_000 * 2 ** Math.max(0, attempts - 1), 6 * 3_600_000);
}

/** `<row id@domain of the From address>`: the same id on every attempt of one row. */
export function messageIdFor(rowId: string, from = smtpConfig().from): string {
  const domain = /@([^>\s]+)/.exec(from)?.[1] ?? "keelson.invalid";
  return `<${rowId}@${domain}>`;
}

async function claim(db: Db, now: Date, limit: number, leaseSeconds: number): Promise<Claimed[]> {
  const result = await db.execute<Claimed>(sql`
    update mail_outbox m
       set status = 'sending',
           claimed_until = ${now.toISOString()}::timestamptz + make_interval(secs => ${leaseSeconds}),
           attempts = m.attempts + 1
      from (select id from mail_outbox
             where (status = 'pending' and next_attempt_at <= ${now.toISOString()}::timestamptz)
                or (status = 'sending' and claimed_until < ${now.toISOString()}::timestamptz)
             order by next_attempt_at, id
             limit ${limit}
             for update skip locked) due
     where m.id = due.id
 returning m.id, m.company_id, m.user_id, m.to_address, m.kind, m.subject, m.html, m.text, m.attempts`);
  return result.rows;
}

function unsubscribeHeaders(row: Claimed): Record<string, string> {
  if (!row.user_id || isAccountKind(row.kind)) return {};
  // RFC 2369 + RFC 8058: mail clients offer their own unsubscribe button and POST to this URL.
  return {
    "List-Unsubscribe": `<${oneClickUnsubscribeUrl(row.user_id, row.company_id, row.kind)}>`,
    "List-Unsubscribe-Post": "List-Unsubscribe=One-Click",
  };
}

function describe(error: unknown): string {
  const e = error as { message?: string; responseCode?: number; code?: string };
  const text = [e.code, e.responseCode, e.message ?? String(error)].filter(Boolean).join(" ");
  return text.slice(0, 1000);
}

async function sendOne(
  db: Db,
  row: Claimed,
  now: Date,
  maxAttempts: number,
): Promise<keyof Omit<SendResult, "claimed">> {
  const { from } = smtpConfig();
  const messageId = messageIdFor(row.id, from);
  try {
    await mailTransport().sendMail({
      from,
      to: row.to_address,
      subject: row.subject,
      html: row.html,
      text: row.text,
      messageId,
      // Every row has its company, account mail too: the local catcher keeps companies apart by it.
      headers: { [COMPANY_HEADER]: row.company_id, ...unsubscribeHeaders(row) },
    });
  } catch (error) {
    const failed = row.attempts >= maxAttempts;
    const retryAt = new Date(now.getTime() + retryDelayMs(row.attempts));
    await db.execute(sql`
      update mail_outbox
         set status = ${failed ? "failed" : "pending"}, claimed_until = null, last_error = ${describe(error)},
             next_attempt_at = ${failed ? now.toISOString() : retryAt.toISOString()}::timestamptz
       where id = ${row.id} and status = 'sending' and attempts = ${row.attempts}`);
    return failed ? "failed" : "retried";
  }
  await db.execute(sql`
    update mail_outbox
       set status = 'sent', sent_at = now(), message_id = ${messageId}, claimed_until = null
     where id = ${row.id} and status = 'sending' and attempts = ${row.attempts}`);
  return "sent";
}

/** Gives back claimed rows not tried before the lease ran short, as if never claimed. */
async function release(db: Db, rows: Claimed[]): Promise<void> {
  for (const row of rows) {
    await db.execute(sql`
      update mail_outbox set status = 'pending', claimed_until = null, attempts = attempts - 1
       where id = ${row.id} and status = 'sending' and attempts = ${row.attempts}`);
  }
}

/**
 * Claims due messages (pending and due, or 'sending' with an ended lease) in batches of 10 and
 * sends each; a failure goes back to pending with exponential back-off and its error, or to
 * 'failed' after KEELSON_MAIL_MAX_ATTEMPTS (8). `limit` caps the messages of this call (100);
 * `maxAttempts` stands in for the configured number (a test's own).
 */
export async function sendDueMail(
  db: Db,
  options: { now?: Date; limit?: number; maxAttempts?: number } = {},
): Promise<SendResult> {
  const { KEELSON_MAIL_LEASE_SECONDS: leaseSeconds, KEELSON_MAIL_MAX_ATTEMPTS } = env();
  const maxAttempts = options.maxAttempts ?? KEELSON_MAIL_MAX_ATTEMPTS;
  const limit = options.limit ?? 100;
  const result: SendResult = { sent: 0, retried: 0, failed: 0, claimed: 0 };
  while (result.claimed < limit) {
    const now = options.now ?? new Date();
    const rows = await claim(db, now, Math.min(BATCH, limit - result.claimed), leaseSeconds);
    result.claimed += rows.length;
    // Stop sending well before the lease ends, so no other worker can claim a row still in hand.
    const stopAt = Date.now() + leaseSeconds * 800;
    for (const [i, row] of rows.entries()) {
      if (Date.now() > stopAt) {
        await release(db, rows.slice(i));
        result.claimed -= rows.length - i;
        return result;
      }
      result[await sendOne(db, row, now, maxAttempts)] += 1;
    }
    if (rows.length < BATCH) break;
  }
  return result;
}

/** When the next message falls due (a retry or an ended lease), or null when nothing waits. */
export async function nextMailDueAt(db: Db): Promise<Date | null> {
  const result = await db.execute<{ at: string | null }>(sql`
    select min(case when status = 'pending' then next_attempt_at else claimed_until end) as at
      from mail_outbox where status in ('pending', 'sending')`);
  const at = result.rows[0]?.at;
  return at ? new Date(at) : null;
}
