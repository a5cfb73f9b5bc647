// What the admin's "Caught mail" page receives (GET /api/admin/mail) and its actions answer.
// Types and one header name only: safe in the client.
import type { MailKind } from "./outbox";

/**
 * The header the sender puts on every message, naming its company's id (an id, never a name), so
 * the local mail catcher can show and clear each company's messages apart from the others'.
 */
export const COMPANY_HEADER = "X-Keelson-Company";

/** A message the local SMTP fake caught, as its HTTP API answers (scripts/mail-fake.ts). */
export type CaughtMessage = {
  id: string;
  messageId: string | null;
  from: string;
  to: string[];
  subject: string;
  date: string;
  text: string;
  html: string | null;
  headers?: Record<string, string>;
};

export type OutboxRow = {
  id: string;
  to: string;
  kind: MailKind;
  subject: string;
  status: "pending" | "sending" | "sent" | "failed" | "cancelled";
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  sentAt: string | null;
  createdAt: string;
};

/** The answer to an administrator's retry or cancel: the message as it now stands. */
export type MailActionResult = { message: OutboxRow };

/** The answer to clearing the company's messages from the local mail catcher (development only). */
export type ClearCaughtResult = { cleared: number };

export type AdminMail = {
  /** Where messages go: the local fake (its messages listed) or the configured relay. */
  delivery: { kind: "fake"; url: string } | { kind: "relay"; host: string; port: number };
  /** The company's messages the fake caught, newest first; null with a relay. */
  caught: CaughtMessage[] | null;
  /** Set when the fake did not answer. */
  caughtProblem: string | null;
  outbox: OutboxRow[];
};
