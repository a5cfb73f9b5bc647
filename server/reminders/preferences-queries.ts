// Reading and saving the signed-in user's e-mail choices: a mail_opt_out row per kind switched
// off, in the user's own company (the same rows a one-click unsubscribe writes).
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { getDb } from "@/db/client";
import { mailOptOut } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { ROLE_LABEL } from "@/server/auth/roles";
import { invalidInput } from "@/server/http/problem";
import { MAIL_KIND_EFFECT, MAIL_KIND_LABEL } from "@/server/mail/kinds";
import { ACCOUNT_KINDS } from "@/server/mail/outbox";
import {
  type MailPreferences,
  type MailPreferencesInput,
  REMINDER_KINDS,
  type ReminderKind,
  reminderKindsFor,
} from "./preferences";

export async function loadMailPreferences(access: Access): Promise<MailPreferences> {
  const off = await getDb()
    .select({ kind: mailOptOut.kind })
    .from(mailOptOut)
    .where(and(eq(mailOptOut.companyId, access.company.id), eq(mailOptOut.userId, access.user.id)));
  const offKinds = new Set<string>(off.map((r) => r.kind));
  return {
    email: access.user.email,
    kinds: reminderKindsFor(access.role).map((kind) => ({
      kind,
      label: MAIL_KIND_LABEL[kind],
      effect: MAIL_KIND_EFFECT[kind],
      receive: !offKinds.has(kind),
    })),
    accountKinds: ACCOUNT_KINDS.map((kind) => ({ label: MAIL_KIND_LABEL[kind], effect: MAIL_KIND_EFFECT[kind] })),
  };
}

export async function saveMailPreferences(access: Access, input: MailPreferencesInput): Promise<MailPreferences> {
  const mine = reminderKindsFor(access.role);
  const named = REMINDER_KINDS.filter((k) => input.receive[k] !== undefined);
  const foreign = named.filter((k) => !mine.includes(k));
  if (foreign.length) {
    throw invalidInput(
      foreign.map((k) => ({
        field: `receive.${k}`,
        message: `Your role (${ROLE_LABEL[access.role]}) does not get the ${MAIL_KIND_LABEL[k]}, so there is nothing to switch.`,
      })),
    );
  }
  const off: ReminderKind[] = named.filter((k) => input.receive[k] === false);
  const on: ReminderKind[] = named.filter((k) => input.receive[k] === true);
  await getDb().transaction(async (tx) => {
    if (on.length) {
      await tx
        .delete(mailOptOut)
        .where(
          and(
            eq(mailOptOut.companyId, access.company.id),
            eq(mailOptOut.userId, access.user.id),
            inArray(mailOptOut.kind, on),
          ),
        );
    }
    if (off.length) {
      await tx
        .insert(mailOptOut)
        .values(off.map((kind) => ({ companyId: access.company.id, userId: access.user.id, kind })))
        .onConflictDoNothing();
    }
  });
  return loadMailPreferences(access);
}
