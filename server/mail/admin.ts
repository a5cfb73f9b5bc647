import "server-only";
import { and, desc, eq, isNotNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { mailOutbox } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import type { AdminMail, CaughtMessage, OutboxRow } from "./contract";
import { smtpConfig } from "./transport";

const OUTBOX_ROWS = 100;
const CAUGHT_ROWS = 50;

/**
 * The admin's view of the company's mail: the outbox, and in development the messages the local
 * fake caught. The fake holds every company's mail; only messages whose Message-ID belongs to one
 * of this company's outbox rows are shown.
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
  const outbox: OutboxRow[] = rows.map((r) => ({
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
  }));

  const fakeUrl = process.env.KEELSON_MAIL_FAKE_URL;
  if (!fakeUrl) {
    const { host, port } = smtpConfig();
    return { delivery: { kind: "relay", host, port }, caught: null, caughtProblem: null, outbox };
  }

  const sent = await db
    .select({ messageId: mailOutbox.messageId })
    .from(mailOutbox)
    .where(and(eq(mailOutbox.companyId, companyId), isNotNull(mailOutbox.messageId)))
    .orderBy(desc(mailOutbox.sentAt))
    .limit(1000);
  const ours = new Set(sent.map((r) => r.messageId));
  try {
    const response = await fetch(new URL("/messages", fakeUrl), {
      cache: "no-store",
      signal: AbortSignal.timeout(5000),
    });
    if (!response.ok) throw new Error(`it answered ${response.status}`);
    const all = (await response.json()) as CaughtMessage[];
    const caught = all
      .filter((m) => m.messageId !== null && ours.has(m.messageId))
      .slice(0, CAUGHT_ROWS)
      .map(({ id, messageId, from, to, subject, date, text, html }) => ({
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
