// Reminder and account e-mail (issue 5): every message is written to the outbox before it is
// sent, under a unique key per recipient, kind and subject item, so a crash or an SMTP failure
// retries without sending twice. Users choose which kinds they get.
import { index, integer, pgEnum, pgTable, text, unique, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { companyRef, instant, nowStamp } from "./refs";

export const mailKind = pgEnum("mail_kind", [
  "due-digest",
  "missing-readings",
  "escalation",
  "fleet-summary",
  "invitation",
  "password-reset",
]);

export const mailStatus = pgEnum("mail_status", ["pending", "sending", "sent", "failed", "cancelled"]);

export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    userId: text().references(() => user.id, { onDelete: "set null" }),
    toAddress: text().notNull(),
    kind: mailKind().notNull(),
    /** recipient + kind + subject item (e.g. `escalation:<state change id>:<user id>`): queued once. */
    dedupeKey: text().notNull(),
    subject: text().notNull(),
    html: text().notNull(),
    text: text().notNull(),
    status: mailStatus().notNull().default("pending"),
    attempts: integer().notNull().default(0),
    lastError: text(),
    /** When a pending message may be tried (again); a claimed one is retried after its lease. */
    nextAttemptAt: nowStamp(),
    claimedUntil: instant(),
    sentAt: instant(),
    messageId: text(),
    createdAt: nowStamp(),
  },
  (t) => [
    unique().on(t.dedupeKey),
    index().on(t.status, t.nextAttemptAt),
    index().on(t.companyId, t.createdAt),
  ],
);

/** A kind of message a user has switched off (preferences page or one-click unsubscribe). */
export const mailOptOut = pgTable(
  "mail_opt_out",
  {
    companyId: companyRef(),
    userId: text()
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    kind: mailKind().notNull(),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.companyId, t.userId, t.kind)],
);
