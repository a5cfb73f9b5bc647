// The account e-mails: the invitation an administrator sends, and the password reset a person asks
// for. Both ride on better-auth's reset-password token (its `sendResetPassword` hook calls
// `sendAccountMail`); Keelson only words the message, queues it in the outbox and, for an
// invitation, gives the link a week instead of an hour.
import "server-only";
import { and, eq, isNotNull } from "drizzle-orm";
import { getDb } from "@/db/client";
import { company, membership, user, verification } from "@/db/schema";
import { requestMailSend } from "@/server/jobs/mail-send";
import { enqueueMail } from "@/server/mail/outbox";
import { appUrl } from "@/server/mail/links";
import { renderMail } from "@/server/mail/render";
import { ROLE_LABEL } from "@/server/auth/roles";

/** How long the links stay good: a reset is used at once; an invitation waits for the next port. */
export const RESET_LINK_HOURS = 1;
export const INVITATION_LINK_DAYS = 7;

/** Where better-auth sends the person after checking the token (it adds ?token=…). */
export const SET_PASSWORD_PATH = "/set-password";

type ResetHook = { user: { id: string; email: string; name: string }; url: string; token: string };

export async function sendAccountMail({ user: person, url, token }: ResetHook, now = new Date()): Promise<void> {
  const db = getDb();
  const [found] = await db
    .select({
      banned: user.banned,
      companyId: membership.companyId,
      companyName: company.name,
      role: membership.role,
      invitedAt: membership.invitedAt,
    })
    .from(user)
    .innerJoin(membership, eq(membership.userId, user.id))
    .innerJoin(company, eq(company.id, membership.companyId))
    .where(eq(user.id, person.id))
    .limit(1);
  // A disabled account gets no link: it could not sign in with the new password anyway.
  if (!found || found.banned) return;

  const invitation = found.invitedAt !== null;
  const link = linkThroughApp(url);
  if (invitation) {
    await db
      .update(verification)
      .set({ expiresAt: new Date(now.getTime() + INVITATION_LINK_DAYS * 86_400_000) })
      .where(eq(verification.identifier, `reset-password:${token}`));
  }
  const content = invitation
    ? renderMail({
        preheader: `Choose your password to start using Keelson at ${found.companyName}.`,
        title: `You are invited to Keelson`,
        intro: `${found.companyName} has given you a Keelson account as ${ROLE_LABEL[found.role].toLowerCase()}. Choose your password with the button below; the link works for ${INVITATION_LINK_DAYS} days and once only.`,
        sections: [
          {
            heading: "Your account",
            lines: [{ text: `Sign-in address: ${person.email}` }, { text: `Role: ${ROLE_LABEL[found.role]}` }],
          },
        ],
        action: { label: "Choose my password", href: link },
        footer: "If you did not expect this invitation, ignore this message: nothing happens until the link is used.",
      })
    : renderMail({
        preheader: "A link to choose a new Keelson password.",
        title: "Choose a new password",
        intro: `Someone (we hope you) asked for a new Keelson password for ${person.email}. The link works for ${RESET_LINK_HOURS} hour and once only; your current password keeps working until you choose a new one.`,
        sections: [],
        action: { label: "Choose a new password", href: link },
        footer: "If you did not ask for this, ignore this message; your password stays as it is.",
      });
  await db.transaction(async (tx) => {
    await enqueueMail(tx, {
      companyId: found.companyId,
      userId: person.id,
      to: person.email,
      kind: invitation ? "invitation" : "password-reset",
      // One message per token: asking again sends a new link, a retry never sends the same one twice.
      dedupeKey: `${invitation ? "invitation" : "password-reset"}:${person.id}:${token}`,
      subject: invitation ? `Your Keelson account at ${found.companyName}` : "Your Keelson password",
      ...content,
    });
    await requestMailSend(tx);
  });
}

/** better-auth's link points at its own base URL; the message uses the app's public address. */
function linkThroughApp(url: string): string {
  const parsed = new URL(url);
  return appUrl(`${parsed.pathname}${parsed.search}`);
}

/** After a password is set through a link: the invitation is accepted and the address proven. */
export async function markPasswordSet(userId: string): Promise<void> {
  const db = getDb();
  await db
    .update(membership)
    .set({ invitedAt: null })
    .where(and(eq(membership.userId, userId), isNotNull(membership.invitedAt)));
  await db.update(user).set({ emailVerified: true }).where(eq(user.id, userId));
}
