import "server-only";
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db/client";
import { company, mailOptOut, membership, user } from "@/db/schema";
import { AppError } from "@/server/http/problem";
import { MAIL_KIND_LABEL } from "./kinds";
import type { UnsubscribeTarget } from "./links";

// Opting out of one kind of message, from a verified unsubscribe link (server/mail/links.ts):
// everything here is scoped by the company and user the signed token names.

export type OptOutView = {
  email: string;
  companyName: string;
  kind: UnsubscribeTarget["kind"];
  kindLabel: string;
  alreadyOptedOut: boolean;
};

/** Who the link is for and whether that kind is already off; null when the membership is gone. */
export async function describeOptOut(db: Db, target: UnsubscribeTarget): Promise<OptOutView | null> {
  const [row] = await db
    .select({ email: user.email, companyName: company.name, optedOut: mailOptOut.kind })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .innerJoin(company, eq(company.id, membership.companyId))
    .leftJoin(
      mailOptOut,
      and(
        eq(mailOptOut.companyId, membership.companyId),
        eq(mailOptOut.userId, membership.userId),
        eq(mailOptOut.kind, target.kind),
      ),
    )
    .where(and(eq(membership.companyId, target.companyId), eq(membership.userId, target.userId)))
    .limit(1);
  if (!row) return null;
  return {
    email: row.email,
    companyName: row.companyName,
    kind: target.kind,
    kindLabel: MAIL_KIND_LABEL[target.kind],
    alreadyOptedOut: row.optedOut !== null,
  };
}

/** Switches the kind off for the user (a second click changes nothing). */
export async function optOut(db: Db, target: UnsubscribeTarget): Promise<OptOutView> {
  const view = await describeOptOut(db, target);
  if (!view) throw new AppError("not-found", "This account is no longer part of the company, so it gets no messages.");
  await db
    .insert(mailOptOut)
    .values({ companyId: target.companyId, userId: target.userId, kind: target.kind })
    .onConflictDoNothing();
  return view;
}
