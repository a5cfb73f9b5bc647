// Caught mail stays within its company: the sender names the company in an X-Keelson-Company
// header on every message (account mail too), the fake keeps it, and Company → Mail shows and
// clears only the administrator's own company's messages; another company's stay in the fake.
// Real stack: the worker sends over SMTP to the fake on loopback.
import { inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { mailOutbox } from "@/db/schema";
import type { AdminMail, ClearCaughtResult } from "@/server/mail/contract";
import { enqueueMail } from "@/server/mail/outbox";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, signIn } from "../support/http";
import { askTheWorkerToSend, caughtFor, caughtOfCompany, freshAddress, testMail, waitFor } from "./mail-fake";

const db = testDb();
const tag = Date.now().toString(36);
const A_DIGEST = `Aster Gale digest ${tag}`;
const A_SUMMARY = `Aster fleet summary ${tag}`;
const B_INVITATION = `Join Brightwater in Keelson ${tag}`;
let a: Fixture;
let b: Fixture;
let bInvitee: string;

beforeAll(async () => {
  [a, b] = await Promise.all([createCompany("caught-a"), createCompany("caught-b")]);
  bInvitee = freshAddress("caught-b-invitee");
  const keys = [`a-digest-${tag}`, `a-summary-${tag}`, `b-invitation-${tag}`];
  await enqueueMail(db, testMail(a.companyId, a.users.admin.email, keys[0]!, { subject: A_DIGEST }));
  await enqueueMail(
    db,
    testMail(a.companyId, a.users.superintendent.email, keys[1]!, { kind: "fleet-summary", subject: A_SUMMARY }),
  );
  // Account mail carries its company too: every outbox row has one.
  await enqueueMail(db, testMail(b.companyId, bInvitee, keys[2]!, { kind: "invitation", subject: B_INVITATION }));
  await askTheWorkerToSend();
  await waitFor(
    "the worker to send all three",
    async () => {
      const rows = await db
        .select({ status: mailOutbox.status })
        .from(mailOutbox)
        .where(
          inArray(
            mailOutbox.dedupeKey,
            keys.map((k) => `test:${k}`),
          ),
        );
      return rows.length === 3 && rows.every((r) => r.status === "sent");
    },
    80_000,
  );
}, 90_000);

afterAll(async () => {
  await closeTestDb();
});

describe("the company header", () => {
  it("is on every message the sender sends, and the fake filters by it", async () => {
    const ofA = await caughtOfCompany(a.companyId);
    expect(ofA.map((m) => m.subject).sort()).toEqual([A_DIGEST, A_SUMMARY].sort());
    for (const m of ofA) {
      // mailparser gives header keys in lower case.
      expect(m.headers["x-keelson-company"]).toBe(a.companyId);
      expect(m.company).toBe(a.companyId);
    }
    const [invitation] = await caughtFor(bInvitee);
    expect(invitation?.headers["x-keelson-company"]).toBe(b.companyId);
    expect((await caughtOfCompany(b.companyId)).map((m) => m.subject)).toEqual([B_INVITATION]);
  });
});

describe("Company → Mail", () => {
  it("shows each administrator their own company's caught messages only", async () => {
    const adminA = await signIn(a.users.admin.email, PASSWORD);
    const mineA = await api<AdminMail>(adminA, "GET", "/api/admin/mail");
    expect(mineA.status).toBe(200);
    expect(mineA.body.caught?.map((m) => m.subject).sort()).toEqual([A_DIGEST, A_SUMMARY].sort());

    const adminB = await signIn(b.users.admin.email, PASSWORD);
    const mineB = await api<AdminMail>(adminB, "GET", "/api/admin/mail");
    expect(mineB.body.caught?.map((m) => m.subject)).toEqual([B_INVITATION]);
  });

  it("clears only the administrator's company's messages and says how many", async () => {
    const adminA = await signIn(a.users.admin.email, PASSWORD);
    const cleared = await api<ClearCaughtResult>(adminA, "DELETE", "/api/admin/mail/caught");
    expect(cleared.status).toBe(200);
    expect(cleared.body).toEqual({ cleared: 2 });

    expect(await caughtOfCompany(a.companyId)).toEqual([]);
    expect((await api<AdminMail>(adminA, "GET", "/api/admin/mail")).body.caught).toEqual([]);
    // Company B's message is still in the fake and on its administrator's page.
    expect((await caughtOfCompany(b.companyId)).map((m) => m.subject)).toEqual([B_INVITATION]);
    expect((await caughtFor(bInvitee)).map((m) => m.subject)).toEqual([B_INVITATION]);
    const adminB = await signIn(b.users.admin.email, PASSWORD);
    expect((await api<AdminMail>(adminB, "GET", "/api/admin/mail")).body.caught?.map((m) => m.subject)).toEqual([
      B_INVITATION,
    ]);

    // Clearing again finds nothing of A's left.
    expect((await api<ClearCaughtResult>(adminA, "DELETE", "/api/admin/mail/caught")).body).toEqual({ cleared: 0 });
  });
});
