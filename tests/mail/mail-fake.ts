// Talking to the running mail fake (scripts/mail-fake.ts) and queueing test mail out of the
// running worker's reach.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import type { CaughtMessage } from "@/server/mail/contract";
import { enqueueMail, type OutgoingMail } from "@/server/mail/outbox";
import { requestMailSend } from "@/server/jobs/mail-send";
import { testDb } from "../support/fixtures";

const FAKE = process.env.KEELSON_MAIL_FAKE_URL;

/** As the fake answers: `company` is the sender's X-Keelson-Company header (null without one). */
export type Caught = CaughtMessage & { company: string | null; headers: Record<string, string> };

function fake(path: string): string {
  if (!FAKE) throw new Error("KEELSON_MAIL_FAKE_URL is not set: run the tests through scripts/test.sh");
  return `${FAKE}${path}`;
}

export async function caughtFor(address: string): Promise<Caught[]> {
  const response = await fetch(fake(`/messages?to=${encodeURIComponent(address)}`));
  return (await response.json()) as Caught[];
}

/** What the fake holds of one company (`?company=`, as the app asks). */
export async function caughtOfCompany(companyId: string): Promise<Caught[]> {
  const response = await fetch(fake(`/messages?company=${encodeURIComponent(companyId)}`));
  return (await response.json()) as Caught[];
}

/** The next `count` SMTP transactions to `address` get 451. */
export async function failNext(count: number, address: string): Promise<void> {
  await fetch(fake(`/fail?count=${count}&to=${encodeURIComponent(address)}`), { method: "POST" });
}

/** Each message to `address` waits `ms` before the fake's 250 (0 turns it off). */
export async function slowDown(ms: number, address: string): Promise<void> {
  await fetch(fake(`/slow?ms=${ms}&to=${encodeURIComponent(address)}`), { method: "POST" });
}

/** A recipient no other test uses. */
export function freshAddress(label: string): string {
  return `${label}-${randomUUID().slice(0, 8)}@mail-test.example`;
}

export function testMail(companyId: string, to: string, key: string, extra: Partial<OutgoingMail> = {}): OutgoingMail {
  return {
    companyId,
    userId: null,
    to,
    kind: "due-digest",
    dedupeKey: `test:${key}`,
    subject: `Test ${key}`,
    html: `<p>Test ${key}</p>`,
    text: `Test ${key}`,
    ...extra,
  };
}

/**
 * Queues the messages due at `at` (a time in the future) in one transaction, so the stack's own
 * worker, which sends what is due by the real clock, never sees them; the test then calls
 * `sendDueMail(db, { now: at })` itself.
 */
export async function queueDueAt(db: Db, at: Date, mails: OutgoingMail[]): Promise<string[]> {
  return db.transaction(async (tx) => {
    const ids: string[] = [];
    for (const mail of mails) {
      await enqueueMail(tx, mail);
      const [row] = await tx
        .update(mailOutbox)
        .set({ nextAttemptAt: at })
        .where(eq(mailOutbox.dedupeKey, mail.dedupeKey))
        .returning({ id: mailOutbox.id });
      ids.push(row!.id);
    }
    return ids;
  });
}

export async function waitFor<T>(
  what: string,
  probe: () => Promise<T | null | undefined | false>,
  timeoutMs = 30_000,
): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/**
 * A mail-send job for the stack's worker, as a write that queues mail sends one: the worker sends
 * what is due within seconds instead of at its next minute's sweep.
 */
export async function askTheWorkerToSend(): Promise<void> {
  await requestMailSend(testDb());
}
