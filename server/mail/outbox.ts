import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { mailKind, mailOptOut, mailOutbox } from "@/db/schema";

export type MailKind = (typeof mailKind.enumValues)[number];

/** Messages a person needs to use their account: they cannot be opted out of. */
export const ACCOUNT_KINDS: readonly MailKind[] = ["invitation", "password-reset"];

export function isAccountKind(kind: MailKind): boolean {
  return ACCOUNT_KINDS.includes(kind);
}

export type OutgoingMail = {
  companyId: string;
  /** The recipient's account, when they have one: opt-outs and the unsubscribe link hang on it. */
  userId: string | null;
  to: string;
  kind: MailKind;
  /** recipient + kind + subject item, e.g. `escalation:<state change id>:<user id>`: queued once. */
  dedupeKey: string;
  subject: string;
  html: string;
  text: string;
};

/**
 * Queues a message (INSERT … ON CONFLICT (dedupe_key) DO NOTHING), unless the user opted out of its
 * kind. Usable inside a caller's transaction (pass tx), so the message is queued with the change
 * that caused it or not at all. Returns true when a row was inserted; then call
 * `requestMailSend(tx)` in the same transaction, so it leaves within seconds of the commit instead
 * of at the worker's next minute's sweep.
 */
export async function enqueueMail(db: Db | Tx, mail: OutgoingMail): Promise<boolean> {
  if (mail.userId && !isAccountKind(mail.kind)) {
    const [optedOut] = await db
      .select({ kind: mailOptOut.kind })
      .from(mailOptOut)
      .where(
        and(
          eq(mailOptOut.companyId, mail.companyId),
          eq(mailOptOut.userId, mail.userId),
          eq(mailOptOut.kind, mail.kind),
        ),
      )
      .limit(1);
    if (optedOut) return false;
  }
  const inserted = await db
    .insert(mailOutbox)
    .values({
      companyId: mail.companyId,
      userId: mail.userId,
      toAddress: mail.to,
      kind: mail.kind,
      dedupeKey: mail.dedupeKey,
      subject: mail.subject,
      html: mail.html,
      text: mail.text,
    })
    .onConflictDoNothing({ target: mailOutbox.dedupeKey })
    .returning({ id: mailOutbox.id });
  return inserted.length > 0;
}
