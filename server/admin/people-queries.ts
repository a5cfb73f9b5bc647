import "server-only";
import { randomUUID } from "node:crypto";
import { hashPassword } from "better-auth/crypto";
import { and, asc, eq, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { account, membership, session, user, vessel, vesselAssignment } from "@/db/schema";
import type { Access } from "@/server/auth/access";
import { AppError, invalidInput } from "@/server/http/problem";
import type { AdminPerson, UserChanges, UserValues } from "./contract";
import { foreignVesselErrors } from "./queries";
import { lastAdminError } from "./rules";
import { SET_PASSWORD_PATH } from "@/server/accounts/account-mail";
import { auth } from "@/server/auth/auth";

// The company administrator's people: accounts, roles, ranks and vessel assignments, every query
// scoped by the administrator's company. Accounts themselves (user, account, session) are
// better-auth's tables; Keelson writes them directly, the same way the demo seed does.

export async function listCompanyPeople(access: Access, onlyUserId?: string): Promise<AdminPerson[]> {
  const db = getDb();
  const companyId = access.company.id;
  const rows = await db
    .select({
      id: user.id,
      name: user.name,
      email: user.email,
      banned: user.banned,
      role: membership.role,
      rank: membership.rank,
      invitedAt: membership.invitedAt,
      lastSignInAt: sql<string | null>`(select max(s.created_at) from ${session} s where s.user_id = ${user}.id)`,
    })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.companyId, companyId), onlyUserId ? eq(membership.userId, onlyUserId) : undefined))
    .orderBy(asc(user.name));
  const assignments = await db
    .select({ userId: vesselAssignment.userId, id: vessel.id, name: vessel.name, code: vessel.code })
    .from(vesselAssignment)
    .innerJoin(vessel, and(eq(vessel.id, vesselAssignment.vesselId), eq(vessel.companyId, vesselAssignment.companyId)))
    .where(
      and(eq(vesselAssignment.companyId, companyId), onlyUserId ? eq(vesselAssignment.userId, onlyUserId) : undefined),
    )
    .orderBy(asc(vessel.name));
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    email: r.email,
    role: r.role,
    rank: r.rank,
    vessels: assignments.filter((a) => a.userId === r.id).map(({ id, name, code }) => ({ id, name, code })),
    disabled: r.banned === true,
    invitedAt: r.invitedAt?.toISOString() ?? null,
    lastSignInAt: r.lastSignInAt ? new Date(r.lastSignInAt).toISOString() : null,
    isYou: r.id === access.user.id,
  }));
}

/** A person of the administrator's company; anyone else, of another company or none, is not found. */
async function loadCompanyPerson(access: Access, userId: string): Promise<AdminPerson> {
  const [found] = await listCompanyPeople(access, userId);
  if (!found) throw new AppError("not-found", "No such person in your company.");
  return found;
}

async function assertOwnVessels(tx: Tx, companyId: string, vesselIds: string[]): Promise<void> {
  const errors = await foreignVesselErrors(tx, companyId, vesselIds);
  if (errors.length) throw invalidInput(errors);
}

async function assertEmailFree(tx: Db | Tx, email: string): Promise<void> {
  const [taken] = await tx.select({ id: user.id }).from(user).where(eq(user.email, email)).limit(1);
  // Accounts are global (one e-mail, one sign-in), so the address may belong to another company.
  if (taken)
    throw invalidInput([
      { field: "email", message: `${email} already has a Keelson account; use another e-mail address.` },
    ]);
}

async function replaceAssignments(tx: Tx, companyId: string, userId: string, vesselIds: string[]): Promise<void> {
  await tx
    .delete(vesselAssignment)
    .where(and(eq(vesselAssignment.companyId, companyId), eq(vesselAssignment.userId, userId)));
  const unique = [...new Set(vesselIds)];
  if (unique.length) {
    await tx.insert(vesselAssignment).values(unique.map((vesselId) => ({ companyId, userId, vesselId })));
  }
}

/** The account, its password, the membership and the assignments: all of it or none of it. */
export async function createPerson(access: Access, values: UserValues): Promise<AdminPerson> {
  const db = getDb();
  const companyId = access.company.id;
  const passwordHash = values.invite || !values.initialPassword ? null : await hashPassword(values.initialPassword);
  const userId = randomUUID();
  await db.transaction(async (tx) => {
    await assertEmailFree(tx, values.email);
    await assertOwnVessels(tx, companyId, values.vesselIds);
    // `role` is better-auth's admin-plugin column; Keelson's role lives on the membership.
    await tx
      .insert(user)
      .values({ id: userId, name: values.name, email: values.email, emailVerified: false, role: "user" });
    // An invited person has no password until they choose one (better-auth creates the
    // credential account then); until that, signing in simply fails.
    if (passwordHash)
      await tx
        .insert(account)
        .values({ id: randomUUID(), accountId: userId, providerId: "credential", userId, password: passwordHash });
    await tx.insert(membership).values({
      companyId,
      userId,
      role: values.role,
      rank: values.rank ?? null,
      invitedAt: passwordHash ? null : new Date(),
    });
    await replaceAssignments(tx, companyId, userId, values.vesselIds);
  });
  if (!passwordHash) await sendPasswordLink(values.email);
  return loadCompanyPerson(access, userId);
}

/** Asks better-auth for a one-time link; its hook words it as an invitation or a reset. */
async function sendPasswordLink(email: string): Promise<void> {
  await auth.api.requestPasswordReset({ body: { email, redirectTo: SET_PASSWORD_PATH } });
}

/**
 * Sends a person of the company a link to choose a password: the invitation again while it is
 * unanswered, otherwise a password reset. A disabled person gets none.
 */
export async function sendPersonPasswordLink(
  access: Access,
  userId: string,
): Promise<{ sent: "invitation" | "password-reset" }> {
  const person = await loadCompanyPerson(access, userId);
  if (person.disabled)
    throw new AppError("conflict", `${person.name} is disabled: enable the account before sending a password link.`);
  await sendPasswordLink(person.email);
  return { sent: person.invitedAt ? "invitation" : "password-reset" };
}

/** Role changes and disabling are checked against the company's other administrators, locked meanwhile. */
async function assertAdminRemains(tx: Tx, access: Access, userId: string, changes: UserChanges): Promise<void> {
  if (changes.role === undefined && changes.disabled === undefined) return;
  const admins = await tx
    .select({ userId: membership.userId, banned: user.banned })
    .from(membership)
    .innerJoin(user, eq(user.id, membership.userId))
    .where(and(eq(membership.companyId, access.company.id), eq(membership.role, "admin")))
    .for("update", { of: membership });
  const error = lastAdminError(
    admins.map((a) => ({ userId: a.userId, disabled: a.banned === true })),
    userId,
    { role: changes.role, disabled: changes.disabled },
    access.user.id,
  );
  if (error) throw invalidInput([error]);
}

export async function updatePerson(
  access: Access,
  userId: string,
  changes: UserChanges,
  now = new Date(),
): Promise<AdminPerson> {
  const companyId = access.company.id;
  await loadCompanyPerson(access, userId);
  const passwordHash = changes.newPassword ? await hashPassword(changes.newPassword) : null;

  await getDb().transaction(async (tx) => {
    await assertAdminRemains(tx, access, userId, changes);
    if (changes.vesselIds) await assertOwnVessels(tx, companyId, changes.vesselIds);

    if (changes.name !== undefined)
      await tx.update(user).set({ name: changes.name, updatedAt: now }).where(eq(user.id, userId));
    if (changes.role !== undefined || changes.rank !== undefined) {
      await tx
        .update(membership)
        .set({
          ...(changes.role ? { role: changes.role } : {}),
          ...(changes.rank !== undefined ? { rank: changes.rank } : {}),
        })
        .where(and(eq(membership.companyId, companyId), eq(membership.userId, userId)));
    }
    if (changes.vesselIds) await replaceAssignments(tx, companyId, userId, changes.vesselIds);

    if (changes.disabled === true) {
      await tx
        .update(user)
        .set({ banned: true, banReason: `Disabled by ${access.user.name}`, banExpires: null, updatedAt: now })
        .where(eq(user.id, userId));
      // Signed out at once: the access door finds no session, whatever the browser still holds.
      await tx.delete(session).where(eq(session.userId, userId));
    } else if (changes.disabled === false) {
      await tx
        .update(user)
        .set({ banned: false, banReason: null, banExpires: null, updatedAt: now })
        .where(eq(user.id, userId));
    }

    if (passwordHash) {
      await setPassword(tx, userId, passwordHash, now);
      // A reset usually follows a lost or shared password: end the person's other sessions too.
      if (userId !== access.user.id) await tx.delete(session).where(eq(session.userId, userId));
    }
  });
  return loadCompanyPerson(access, userId);
}

async function setPassword(tx: Tx, userId: string, passwordHash: string, now: Date): Promise<void> {
  const updated = await tx
    .update(account)
    .set({ password: passwordHash, updatedAt: now })
    .where(and(eq(account.userId, userId), eq(account.providerId, "credential")))
    .returning({ id: account.id });
  if (updated.length === 0) {
    await tx
      .insert(account)
      .values({ id: randomUUID(), accountId: userId, providerId: "credential", userId, password: passwordHash });
  }
}
