// The outbox: a message is queued once per dedupe key, inside the caller's transaction, and not
// at all for a person who opted out of its kind (account messages always).
import { and, eq, like } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOptOut, mailOutbox } from "@/db/schema";
import { enqueueMail } from "@/server/mail/outbox";
import { closeTestDb, createCompany, type Fixture, testDb } from "../support/fixtures";
import { freshAddress, testMail } from "./mail-fake";

let f: Fixture;
const db = testDb();

beforeAll(async () => {
  f = await createCompany("outbox");
});
afterAll(closeTestDb);

const rowsWithKey = (key: string) =>
  db
    .select()
    .from(mailOutbox)
    .where(eq(mailOutbox.dedupeKey, `test:${key}`));

describe("enqueueMail", () => {
  it("queues a message once however often it is enqueued", async () => {
    const key = `twice-${f.companyId}`;
    const to = freshAddress("twice");
    expect(await enqueueMail(db, testMail(f.companyId, to, key))).toBe(true);
    expect(await enqueueMail(db, testMail(f.companyId, to, key, { subject: "A second rendering" }))).toBe(false);
    const rows = await rowsWithKey(key);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ subject: `Test ${key}`, status: "pending", attempts: 0, toAddress: to });
  });

  it("queues nothing when the caller's transaction rolls back", async () => {
    const key = `rollback-${f.companyId}`;
    await expect(
      db.transaction(async (tx) => {
        expect(await enqueueMail(tx, testMail(f.companyId, freshAddress("rollback"), key))).toBe(true);
        throw new Error("the change that caused the message failed");
      }),
    ).rejects.toThrow("the change that caused the message failed");
    expect(await rowsWithKey(key)).toHaveLength(0);
  });

  it("queues nothing of a kind the user opted out of, but still their account messages", async () => {
    const engineer = f.users.engineer;
    await db.insert(mailOptOut).values({ companyId: f.companyId, userId: engineer.id, kind: "due-digest" });
    const base = { userId: engineer.id };
    const digest = `optout-digest-${f.companyId}`;
    const escalation = `optout-escalation-${f.companyId}`;
    const reset = `optout-reset-${f.companyId}`;
    expect(await enqueueMail(db, testMail(f.companyId, engineer.email, digest, { ...base, kind: "due-digest" }))).toBe(
      false,
    );
    expect(
      await enqueueMail(db, testMail(f.companyId, engineer.email, escalation, { ...base, kind: "escalation" })),
    ).toBe(true);
    // A user cannot opt out of account messages: even a row in mail_opt_out does not stop them.
    await db.insert(mailOptOut).values({ companyId: f.companyId, userId: engineer.id, kind: "password-reset" });
    expect(
      await enqueueMail(db, testMail(f.companyId, engineer.email, reset, { ...base, kind: "password-reset" })),
    ).toBe(true);

    expect(await rowsWithKey(digest)).toHaveLength(0);
    expect(await rowsWithKey(escalation)).toHaveLength(1);
    expect(await rowsWithKey(reset)).toHaveLength(1);
  });

  it("scopes an opt-out to its company: the same kind for another user still goes", async () => {
    const chief = f.users["chief-engineer"];
    const key = `optout-other-${f.companyId}`;
    expect(
      await enqueueMail(db, testMail(f.companyId, chief.email, key, { userId: chief.id, kind: "due-digest" })),
    ).toBe(true);
    const rows = await db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.companyId, f.companyId), like(mailOutbox.dedupeKey, "test:optout-%")));
    expect(rows.map((r) => r.kind).sort()).toEqual(["due-digest", "escalation", "password-reset"]);
  });
});
