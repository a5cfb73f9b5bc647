// Sending from the outbox against the running mail fake: an SMTP outage is retried with
// back-off and the message arrives once; concurrent senders never share a row; a claim left by a
// crashed sender is taken again after its lease. Each test queues its rows due at a future time
// and passes that time as `now`, so the stack's own worker (real clock) leaves them alone.
import { eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox } from "@/db/schema";
import { MAIL_KIND_LABEL } from "@/server/mail/kinds";
import { unsubscribeUrl } from "@/server/mail/links";
import { renderMail } from "@/server/mail/render";
import { messageIdFor, retryDelayMs, sendDueMail } from "@/server/mail/sender";
import { closeMailTransport } from "@/server/mail/transport";
import { closeTestDb, createCompany, type Fixture, testDb } from "../support/fixtures";
import { caughtFor, failNext, freshAddress, queueDueAt, slowDown, testMail } from "./mail-fake";

let f: Fixture;
const db = testDb();
const MINUTE = 60_000;
const DAY = 24 * 60 * MINUTE;
// One far-off day per test, further each time: a test never meets another's rows.
let day = 0;
const nextFuture = () => new Date(Date.now() + (400 + 10 * ++day) * DAY);

beforeAll(async () => {
  f = await createCompany("sending");
});
afterAll(async () => {
  closeMailTransport();
  await closeTestDb();
});

const rowOf = async (id: string) => (await db.select().from(mailOutbox).where(eq(mailOutbox.id, id)))[0]!;

describe("sendDueMail", () => {
  it("retries through a simulated SMTP outage and delivers exactly once", async () => {
    const at = nextFuture();
    const engineer = f.users.engineer;
    const to = freshAddress("outage");
    const { html, text } = renderMail({
      title: "Oil & <filter> change",
      intro: "A test of the whole path.",
      sections: [{ heading: "Late", lines: [{ text: "GE-2 <lube oil>", note: "7 days late" }] }],
      action: { label: "Open Keelson", href: "https://keelson.example/" },
      unsubscribe: {
        href: unsubscribeUrl(engineer.id, f.companyId, "due-digest"),
        kindLabel: MAIL_KIND_LABEL["due-digest"],
      },
    });
    const [id] = await queueDueAt(db, at, [
      testMail(f.companyId, to, `outage-${to}`, { userId: engineer.id, subject: "Oil & <filter> change", html, text }),
    ]);
    await failNext(2, to);

    // Attempt 1 at `at`: 451, back to pending for 1 minute (retryDelayMs(1)).
    const first = await sendDueMail(db, { now: at });
    expect(first.retried).toBeGreaterThanOrEqual(1);
    let row = await rowOf(id!);
    expect(row).toMatchObject({ status: "pending", attempts: 1, sentAt: null, messageId: null });
    expect(row.lastError).toContain("451");
    expect(row.nextAttemptAt.getTime()).toBe(at.getTime() + retryDelayMs(1));

    // Attempt 2 one minute later: 451 again, now 2 minutes of back-off.
    const second = new Date(at.getTime() + MINUTE);
    await sendDueMail(db, { now: second });
    row = await rowOf(id!);
    expect(row).toMatchObject({ status: "pending", attempts: 2 });
    expect(row.nextAttemptAt.getTime()).toBe(second.getTime() + retryDelayMs(2));

    // Not yet due one minute later: untouched.
    await sendDueMail(db, { now: new Date(second.getTime() + MINUTE) });
    expect((await rowOf(id!)).attempts).toBe(2);

    // Attempt 3 when due: the fake accepts.
    await sendDueMail(db, { now: new Date(second.getTime() + 2 * MINUTE) });
    row = await rowOf(id!);
    expect(row).toMatchObject({ status: "sent", attempts: 3, messageId: messageIdFor(id!) });
    expect(row.sentAt).not.toBeNull();

    // Later sweeps send nothing again.
    await sendDueMail(db, { now: new Date(at.getTime() + DAY) });
    const caught = await caughtFor(to);
    expect(caught).toHaveLength(1);
    expect(caught[0]!.messageId).toBe(row.messageId);
    expect(caught[0]!.subject).toBe("Oil & <filter> change");
    expect(caught[0]!.html).toContain("Oil &amp; &lt;filter&gt; change");
    expect(caught[0]!.html).not.toContain("<filter>");
    expect(caught[0]!.text).toContain("- GE-2 <lube oil>\n  7 days late");
    // RFC 8058: the header points at the route a mail client POSTs to, for this user and kind.
    const header = caught[0]!.headers["list-unsubscribe"]!;
    expect(header).toMatch(/^<http.*\/api\/unsubscribe\?u=.*&k=due-digest&t=.*>$/);
    expect(new URL(header.slice(1, -1)).searchParams.get("u")).toBe(engineer.id);
    expect(caught[0]!.headers["list-unsubscribe-post"]).toBe("List-Unsubscribe=One-Click");
  });

  it("gives up after the configured number of attempts", async () => {
    const at = nextFuture();
    const to = freshAddress("give-up");
    const [id] = await queueDueAt(db, at, [testMail(f.companyId, to, `give-up-${to}`)]);
    await failNext(5, to);
    await sendDueMail(db, { now: at, maxAttempts: 2 });
    const result = await sendDueMail(db, { now: new Date(at.getTime() + MINUTE), maxAttempts: 2 });
    expect(result.failed).toBeGreaterThanOrEqual(1);
    const row = await rowOf(id!);
    expect(row).toMatchObject({ status: "failed", attempts: 2 });
    expect(row.lastError).toContain("451");
    await sendDueMail(db, { now: new Date(at.getTime() + DAY) });
    expect((await rowOf(id!)).status).toBe("failed");
    expect(await caughtFor(to)).toHaveLength(0);
  });

  it("lets two concurrent senders deliver each message once", async () => {
    const at = nextFuture();
    const to = freshAddress("concurrent");
    const ids = await queueDueAt(
      db,
      at,
      Array.from({ length: 30 }, (_, i) => testMail(f.companyId, to, `concurrent-${i}-${to}`)),
    );
    // 20 ms a message keeps both senders busy at the same time.
    await slowDown(20, to);
    const [a, b] = await Promise.all([sendDueMail(db, { now: at }), sendDueMail(db, { now: at })]);
    await slowDown(0, to);
    expect(a.sent + b.sent).toBeGreaterThanOrEqual(30);
    expect(a.sent).toBeGreaterThan(0);
    expect(b.sent).toBeGreaterThan(0);

    const rows = await db.select().from(mailOutbox).where(inArray(mailOutbox.id, ids));
    expect(rows.every((r) => r.status === "sent" && r.attempts === 1)).toBe(true);
    const caught = await caughtFor(to);
    expect(caught).toHaveLength(30);
    expect(new Set(caught.map((m) => m.messageId))).toEqual(new Set(rows.map((r) => r.messageId)));
  });

  it("takes again a claim whose sender crashed, once its lease ended, and leaves a live claim alone", async () => {
    const at = nextFuture();
    const to = freshAddress("crashed");
    const [crashed, live] = await queueDueAt(db, at, [
      testMail(f.companyId, to, `crashed-${to}`),
      testMail(f.companyId, to, `live-${to}`),
    ]);
    // As a sender leaves rows when it dies after its claim: 'sending', one attempt counted.
    await db
      .update(mailOutbox)
      .set({ status: "sending", attempts: 1, claimedUntil: new Date(at.getTime() - 1000) })
      .where(eq(mailOutbox.id, crashed!));
    await db
      .update(mailOutbox)
      .set({ status: "sending", attempts: 1, claimedUntil: new Date(at.getTime() + 5 * MINUTE) })
      .where(eq(mailOutbox.id, live!));

    await sendDueMail(db, { now: at });
    expect(await rowOf(crashed!)).toMatchObject({ status: "sent", attempts: 2, messageId: messageIdFor(crashed!) });
    expect(await rowOf(live!)).toMatchObject({ status: "sending", attempts: 1, sentAt: null });
    const caught = await caughtFor(to);
    expect(caught.map((m) => m.messageId)).toEqual([messageIdFor(crashed!)]);

    // The live claim's lease ends too (its sender died after all): then it goes, once.
    await sendDueMail(db, { now: new Date(at.getTime() + 6 * MINUTE) });
    expect(await rowOf(live!)).toMatchObject({ status: "sent", attempts: 2 });
    expect((await caughtFor(to)).map((m) => m.messageId).sort()).toEqual(
      [messageIdFor(crashed!), messageIdFor(live!)].sort(),
    );
  });
});
