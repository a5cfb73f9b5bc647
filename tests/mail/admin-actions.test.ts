// Company → Mail actions: an administrator tries a failed message again (it leaves once) or
// cancels a waiting one (it never leaves); a sent message or one a worker holds is refused with
// the reason; other roles, anonymous visitors and other companies get nothing.
//
// Rows are queued 50 years ahead (queueDueAt) and put in the state each test needs, so neither the
// stack's worker (real clock) nor sending.test.ts (its `now` some 400–600 days ahead) takes them
// before the test says so.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox, user } from "@/db/schema";
import type { Problem } from "@/server/http/problem";
import type { MailActionResult } from "@/server/mail/contract";
import { enqueueMail } from "@/server/mail/outbox";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";
import { askTheWorkerToSend, caughtFor, freshAddress, queueDueAt, testMail, waitFor } from "./mail-fake";

const db = testDb();
const YEAR = 365 * 24 * 3_600_000;
const farAhead = () => new Date(Date.now() + 50 * YEAR);
let f: Fixture;
let other: Fixture;
let admin: Session;
let adminName: string;

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("mail-actions"), createCompany("mail-actions-other")]);
  admin = await signIn(f.users.admin.email, PASSWORD);
  adminName = (await db.select({ name: user.name }).from(user).where(eq(user.id, f.users.admin.id)))[0]!.name;
});
afterAll(async () => {
  await closeTestDb();
});

const rowOf = async (id: string) => (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0]!;

/** One message of company `f` to a fresh address, out of every sender's reach, then set as given. */
async function messageIn(state: Partial<typeof mailOutbox.$inferInsert>, label = "action") {
  const to = freshAddress(label);
  const [id] = await queueDueAt(db, farAhead(), [testMail(f.companyId, to, `${label}-${to}`)]);
  if (Object.keys(state).length) await db.update(mailOutbox).set(state).where(eq(mailOutbox.id, id!));
  return { id: id!, to };
}

const retry = (session: Session | null, id: string) =>
  api<MailActionResult>(session, "POST", `/api/admin/mail/${id}/retry`);
const cancel = (session: Session | null, id: string) =>
  api<MailActionResult>(session, "POST", `/api/admin/mail/${id}/cancel`);

describe("POST /api/admin/mail/[messageId]/retry", () => {
  it("puts a failed message back in the queue and the worker sends it exactly once", async () => {
    const { id, to } = await messageIn({ status: "failed", attempts: 8, lastError: "451 4.3.0 relay busy (test)" });

    const { status, body } = await retry(admin, id);
    expect(status).toBe(200);
    // Attempts and the last error stay until the next attempt; it is due now.
    expect(body.message).toMatchObject({
      id,
      status: "pending",
      attempts: 8,
      lastError: "451 4.3.0 relay busy (test)",
    });
    expect(new Date(body.message.nextAttemptAt).getTime()).toBeLessThanOrEqual(Date.now());

    const sent = await waitFor(
      "the worker to send the retried message",
      async () => {
        const row = await rowOf(id);
        return row.status === "sent" ? row : null;
      },
      60_000,
    );
    expect(sent.attempts).toBe(9);
    expect(sent.messageId).toContain(id);
    const caught = await waitFor("the fake to hold it", async () => {
      const list = await caughtFor(to);
      return list.length ? list : null;
    });
    expect(caught.map((m) => m.messageId)).toEqual([sent.messageId]);
  }, 90_000);

  it("refuses a message already sent, naming its status, and changes nothing", async () => {
    const { id } = await messageIn({
      status: "sent",
      attempts: 1,
      sentAt: new Date(),
      messageId: "<sent@test.example>",
    });
    const before = await rowOf(id);

    const { status, body } = await api<Problem>(admin, "POST", `/api/admin/mail/${id}/retry`);
    expect(status).toBe(422);
    expect(body.detail).toMatch(/already sent .*\(status sent\)/);
    expect(body.errors?.[0]?.field).toBe("status");
    expect(await rowOf(id)).toEqual(before);

    expect((await api<Problem>(admin, "POST", `/api/admin/mail/${id}/cancel`)).status).toBe(422);
    expect(await rowOf(id)).toEqual(before);
  });

  it("refuses a message a worker is sending now (its lease not ended), for retry and cancel", async () => {
    const { id } = await messageIn({ status: "sending", attempts: 1, claimedUntil: new Date(Date.now() + 100 * YEAR) });
    const before = await rowOf(id);
    for (const action of ["retry", "cancel"]) {
      const { status, body } = await api<Problem>(admin, "POST", `/api/admin/mail/${id}/${action}`);
      expect(status, action).toBe(422);
      expect(body.detail).toContain("being sent now");
      expect(body.detail).toContain("try again in a minute");
    }
    expect(await rowOf(id)).toEqual(before);
  });
});

describe("POST /api/admin/mail/[messageId]/cancel", () => {
  it("stops a waiting message: it is never sent, and says who cancelled it", async () => {
    const { id, to } = await messageIn({ attempts: 2, lastError: "550 5.1.1 no such mailbox (test)" });

    const { status, body } = await cancel(admin, id);
    expect(status).toBe(200);
    expect(body.message).toMatchObject({ id, status: "cancelled", attempts: 2 });
    expect(body.message.lastError).toBe(`Cancelled by ${adminName}. Last error: 550 5.1.1 no such mailbox (test)`);

    // Make it due by the real clock, then let the worker send a second message queued after it:
    // a claim that takes the later one would have taken this one too, had it still been waiting.
    await db
      .update(mailOutbox)
      .set({ nextAttemptAt: new Date(Date.now() - 60_000) })
      .where(eq(mailOutbox.id, id));
    const sentinelTo = freshAddress("sentinel");
    await enqueueMail(db, testMail(f.companyId, sentinelTo, `sentinel-${sentinelTo}`));
    await askTheWorkerToSend();
    await waitFor("the worker to send the later message", async () => (await caughtFor(sentinelTo)).length > 0, 60_000);

    expect(await rowOf(id)).toMatchObject({ status: "cancelled", attempts: 2, sentAt: null, messageId: null });
    // Cancelling it again says so, naming the status.
    const twice = await api<Problem>(admin, "POST", `/api/admin/mail/${id}/cancel`);
    expect(twice.status).toBe(422);
    expect(twice.body.errors?.[0]).toMatchObject({ field: "status", message: expect.stringContaining("cancelled already") });
    expect(await caughtFor(to)).toEqual([]);
  }, 90_000);

  it("is undone by a retry", async () => {
    const { id } = await messageIn({});
    expect((await cancel(admin, id)).body.message.lastError).toBe(`Cancelled by ${adminName}`);
    const again = await retry(admin, id);
    expect(again.status).toBe(200);
    expect(again.body.message.status).toBe("pending");
  });
});

describe("access", () => {
  it("is for administrators of the message's own company", async () => {
    const { id } = await messageIn({ status: "failed", attempts: 8, lastError: "451 (test)" });
    const before = await rowOf(id);
    const engineer = await signIn(f.users.engineer.email, PASSWORD);
    const superintendent = await signIn(f.users.superintendent.email, PASSWORD);
    const otherAdmin = await signIn(other.users.admin.email, PASSWORD);

    for (const action of ["retry", "cancel"]) {
      const path = `/api/admin/mail/${id}/${action}`;
      expect((await api(null, "POST", path)).status, `${action} anonymous`).toBe(401);
      expect((await api(engineer, "POST", path)).status, `${action} engineer`).toBe(403);
      expect((await api(superintendent, "POST", path)).status, `${action} superintendent`).toBe(403);
      // Another company's message looks like no message at all.
      const theirs = await api<Problem>(otherAdmin, "POST", path);
      expect(theirs.status, `${action} other company`).toBe(404);
      expect(theirs.body.detail).toContain("No such message");
      expect((await api(admin, "POST", `/api/admin/mail/not-a-uuid/${action}`)).status).toBe(404);
      expect((await api(admin, "POST", `/api/admin/mail/${crypto.randomUUID()}/${action}`)).status).toBe(404);
    }
    expect(await rowOf(id)).toEqual(before);

    // Clearing the catcher: only the door is checked here; caught-per-company.test.ts clears a
    // company's own messages and checks another company's stay.
    expect((await api(null, "DELETE", "/api/admin/mail/caught")).status).toBe(401);
    expect((await api(engineer, "DELETE", "/api/admin/mail/caught")).status).toBe(403);
  });
});
