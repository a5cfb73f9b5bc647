// Accounts by e-mail (issue 5): an administrator invites a person, who chooses a password through
// the link; a forgotten password is reset through a link; all through better-auth's reset token,
// the outbox and the local SMTP fake.
import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { AdminPerson } from "@/server/admin/contract";
import type { Problem } from "@/server/http/problem";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const BASE_URL = process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000";
const FAKE = process.env.KEELSON_MAIL_FAKE_URL;

type Caught = { id: string; to: string[]; subject: string; text: string; html: string | null };

async function messagesTo(address: string): Promise<Caught[]> {
  const res = await fetch(`${FAKE}/messages`);
  const all = (await res.json()) as Caught[];
  return all.filter((m) => m.to.some((t) => t.toLowerCase().includes(address.toLowerCase())));
}

/** Waits for the worker to deliver `count` messages to the address (through the outbox). */
async function waitForMail(address: string, count = 1, timeoutMs = 20_000): Promise<Caught[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await messagesTo(address);
    if (found.length >= count) return found;
    if (Date.now() > until) throw new Error(`no mail to ${address} within ${timeoutMs} ms (${found.length} seen)`);
    await new Promise((r) => setTimeout(r, 300));
  }
}

/** The one-time link in the plain-text body, followed to where better-auth sends the person. */
async function tokenFrom(message: Caught): Promise<string> {
  const link = message.text.match(/https?:\/\/\S+\/api\/auth\/reset-password\/\S+/)?.[0];
  expect(link, message.text).toBeTruthy();
  const res = await fetch(link!.replace(/[).,]+$/, ""), { redirect: "manual" });
  expect(res.status).toBeGreaterThanOrEqual(300);
  const location = new URL(res.headers.get("location")!, BASE_URL);
  expect(location.pathname).toBe("/set-password");
  return location.searchParams.get("token")!;
}

async function setPassword(token: string, newPassword: string) {
  return fetch(`${BASE_URL}/api/auth/reset-password`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: BASE_URL },
    body: JSON.stringify({ token, newPassword }),
  });
}

let f: Fixture;
let admin: Session;
beforeAll(async () => {
  f = await createCompany("accounts");
  admin = await signIn(f.users.admin.email, PASSWORD);
});
afterAll(closeTestDb);

describe.skipIf(!FAKE)("inviting a person by e-mail", () => {
  it("sends one invitation; the link sets the password, after which they sign in and the invitation is answered", async () => {
    const email = `invitee-${randomUUID().slice(0, 8)}@accounts.example`;
    const res = await api<AdminPerson>(admin, "POST", "/api/admin/users", {
      name: "Ada Invitee",
      email,
      role: "engineer",
      rank: "Third engineer",
      vesselIds: [f.vesselA.id],
      invite: true,
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.invitedAt).not.toBeNull();
    // No password yet: signing in fails until they choose one.
    await expect(signIn(email, "anything-at-all-1")).rejects.toThrow(/401/);

    const [message] = await waitForMail(email);
    expect(message!.subject).toContain("Your Keelson account");
    expect(message!.text).toContain("Engineer");
    expect(message!.html).toContain("Choose my password");
    const token = await tokenFrom(message!);
    expect((await setPassword(token, "brand-new-password-9")).status).toBe(200);

    const session = await signIn(email, "brand-new-password-9");
    const hourLog = await api(session, "GET", `/api/vessels/${f.vesselA.id}/hour-log`);
    expect(hourLog.status).toBe(200);
    const [member] = await testDb().select().from(s.membership).where(eq(s.membership.userId, res.body.id));
    expect(member!.invitedAt).toBeNull();
    // The link was used once: a second use is refused.
    expect((await setPassword(token, "another-password-99")).status).toBe(400);
    // Exactly one message for that invitation.
    expect(await messagesTo(email)).toHaveLength(1);
  });

  it("refuses bad input with the field named and writes nothing; only an administrator invites", async () => {
    const before = await testDb().select().from(s.user);
    const bad = await api<Problem>(admin, "POST", "/api/admin/users", {
      name: "No Way",
      email: "not-an-address",
      role: "engineer",
      invite: true,
    });
    expect(bad.status).toBe(422);
    expect(bad.body.errors?.map((e) => e.field)).toContain("email");
    const neither = await api<Problem>(admin, "POST", "/api/admin/users", {
      name: "No Password",
      email: `nopw-${randomUUID().slice(0, 8)}@accounts.example`,
      role: "engineer",
    });
    expect(neither.status).toBe(422);
    expect(neither.body.errors?.find((e) => e.field === "initialPassword")?.message).toMatch(/invitation/);

    const chief = await signIn(f.users["chief-engineer"].email, PASSWORD);
    const forbidden = await api(chief, "POST", "/api/admin/users", {
      name: "Sneaky",
      email: `sneaky-${randomUUID().slice(0, 8)}@accounts.example`,
      role: "admin",
      invite: true,
    });
    expect(forbidden.status).toBe(403);
    expect(await testDb().select().from(s.user)).toHaveLength(before.length);
  });

  it("sends the invitation again on request, and refuses a password link for a disabled person", async () => {
    const email = `again-${randomUUID().slice(0, 8)}@accounts.example`;
    const created = await api<AdminPerson>(admin, "POST", "/api/admin/users", {
      name: "Bo Again",
      email,
      role: "viewer",
      invite: true,
    });
    await waitForMail(email, 1);
    const again = await api<{ sent: string }>(admin, "POST", `/api/admin/users/${created.body.id}/password-link`);
    expect(again.status).toBe(200);
    expect(again.body.sent).toBe("invitation");
    const both = await waitForMail(email, 2);
    expect(both.every((m) => m.subject.includes("Your Keelson account"))).toBe(true);

    await api(admin, "PATCH", `/api/admin/users/${created.body.id}`, { disabled: true });
    const refused = await api<Problem>(admin, "POST", `/api/admin/users/${created.body.id}/password-link`);
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/disabled/);
    // Another company's administrator cannot reach this person.
    const other = await createCompany("accounts-other");
    const stranger = await signIn(other.users.admin.email, PASSWORD);
    expect((await api(stranger, "POST", `/api/admin/users/${created.body.id}/password-link`)).status).toBe(404);
  });
});

describe.skipIf(!FAKE)("a forgotten password", () => {
  it("e-mails a reset link; the new password works, the old one does not, and open sessions end", async () => {
    const email = f.users.viewer.email;
    const open = await signIn(email, PASSWORD);
    const res = await fetch(`${BASE_URL}/api/auth/request-password-reset`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE_URL },
      body: JSON.stringify({ email, redirectTo: "/set-password" }),
    });
    expect(res.status).toBe(200);
    const [message] = await waitForMail(email);
    expect(message!.subject).toBe("Your Keelson password");
    const token = await tokenFrom(message!);
    expect((await setPassword(token, "after-the-reset-42")).status).toBe(200);
    await expect(signIn(email, PASSWORD)).rejects.toThrow(/401/);
    await signIn(email, "after-the-reset-42");
    expect((await api(open, "GET", `/api/vessels/${f.vesselA.id}/hour-log`)).status).toBe(401);
  });

  it("answers the same for an unknown address and sends nothing", async () => {
    const email = `nobody-${randomUUID().slice(0, 8)}@accounts.example`;
    const res = await fetch(`${BASE_URL}/api/auth/request-password-reset`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: BASE_URL },
      body: JSON.stringify({ email, redirectTo: "/set-password" }),
    });
    expect(res.status).toBe(200);
    await new Promise((r) => setTimeout(r, 2_500));
    expect(await messagesTo(email)).toHaveLength(0);
    const queued = await testDb().select().from(s.mailOutbox).where(eq(s.mailOutbox.toAddress, email));
    expect(queued).toHaveLength(0);
  });
});
