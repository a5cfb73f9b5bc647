// Photos and documents on a completion, against the running app and the real S3 fake on loopback:
// what goes in is checked by its bytes, comes back byte for byte, and leaves nothing behind when
// refused or removed.
import { createHash } from "node:crypto";
import { GetObjectCommand, ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as s from "@/db/schema";
import type { AttachmentList, AttachmentView } from "@/server/attachments/contract";
import { shipClock, shipDay } from "@/server/format/hours";
import type { Problem } from "@/server/http/problem";
import { recomputeVessel } from "@/server/scheduling/recompute";
import { closeTestDb, createCompany, type Fixture, PASSWORD, testDb } from "../support/fixtures";
import { api, type Session, signIn } from "../support/http";

const BASE_URL = process.env.KEELSON_TEST_URL ?? "http://127.0.0.1:3000";
const BUCKET = process.env.KEELSON_S3_BUCKET ?? "keelson-attachments";

// The smallest valid PNG: one pixel (a widely reproduced test image; its first eight bytes are the
// PNG signature of RFC 2083 §3.1).
const PNG_1X1 = Buffer.from(
  "iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==",
  "base64",
);
const PDF = Buffer.from("%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");

let f: Fixture;
let other: Fixture;
let engineer: Session;
let chief: Session;
let viewer: Session;
const wo = { main: "", full: "", approved: "" };

const s3 = new S3Client({
  endpoint: process.env.KEELSON_S3_ENDPOINT,
  region: process.env.KEELSON_S3_REGION ?? "us-east-1",
  forcePathStyle: true,
  credentials: {
    accessKeyId: process.env.KEELSON_S3_ACCESS_KEY_ID ?? "S3RVER",
    secretAccessKey: process.env.KEELSON_S3_SECRET_ACCESS_KEY ?? "S3RVER",
  },
  requestChecksumCalculation: "WHEN_REQUIRED",
  responseChecksumValidation: "WHEN_REQUIRED",
});

const path = (workOrderId: string, tail = "", vesselId = f.vesselA.id) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}/attachments${tail}`;

async function upload(
  session: Session | null,
  workOrderId: string,
  bytes: Uint8Array<ArrayBuffer>,
  { name = "found.png", type = "image/png", caption, vesselId }: { name?: string; type?: string; caption?: string; vesselId?: string } = {},
) {
  const form = new FormData();
  form.append("file", new Blob([bytes], { type }), name);
  if (caption !== undefined) form.append("caption", caption);
  const response = await fetch(`${BASE_URL}${path(workOrderId, "", vesselId)}`, {
    method: "POST",
    headers: { origin: BASE_URL, ...(session ? { cookie: session.cookie } : {}) },
    body: form,
  });
  const text = await response.text();
  return { status: response.status, body: (text ? JSON.parse(text) : null) as AttachmentView & Problem };
}

async function download(session: Session | null, url: string) {
  const response = await fetch(`${BASE_URL}${url}`, {
    headers: { origin: BASE_URL, ...(session ? { cookie: session.cookie } : {}) },
  });
  return { response, bytes: Buffer.from(await response.arrayBuffer()) };
}

/** Keys in the bucket under a work order's prefix. */
async function objectKeys(workOrderId: string): Promise<string[]> {
  const listed = await s3.send(
    new ListObjectsV2Command({ Bucket: BUCKET, Prefix: `${f.companyId}/${f.vesselA.id}/${workOrderId}/` }),
  );
  return (listed.Contents ?? []).map((o) => o.Key!).sort();
}

async function rows(workOrderId: string) {
  return testDb()
    .select()
    .from(s.completionAttachment)
    .where(and(eq(s.completionAttachment.companyId, f.companyId), eq(s.completionAttachment.workOrderId, workOrderId)));
}

beforeAll(async () => {
  [f, other] = await Promise.all([createCompany("attachments"), createCompany("attachments-other")]);
  const db = testDb();
  const [me] = await db
    .insert(s.component)
    .values({ companyId: f.companyId, vesselId: f.vesselA.id, code: "ME.CYL.3", name: "Cylinder unit 3", counterId: f.counters.main.id })
    .returning();
  const baselineAt = new Date(Date.now() - 5 * 86_400_000);
  const routine = (title: string) => ({
    companyId: f.companyId,
    vesselId: f.vesselA.id,
    componentId: me!.id,
    title,
    intervalHours: 100,
    baselineHours: 925,
    baselineAt,
    checklist: ["Open up", "Box up"],
  });
  const made = await db
    .insert(s.routine)
    .values([routine("Liner gauging"), routine("Exhaust valve check"), routine("Piston crown check")])
    .returning();
  await recomputeVessel(db, f.companyId, f.vesselA.id);
  const orders = await db.select().from(s.workOrder).where(eq(s.workOrder.companyId, f.companyId));
  const of = (i: number) => orders.find((o) => o.routineId === made[i]!.id)!.id;
  wo.main = of(0);
  wo.full = of(1);
  wo.approved = of(2);
  [engineer, chief, viewer] = await Promise.all([
    signIn(f.users.engineer.email, PASSWORD),
    signIn(f.users["chief-engineer"].email, PASSWORD),
    signIn(f.users.viewer.email, PASSWORD),
  ]);
});
afterAll(closeTestDb);

describe("a photo kept with the completion", () => {
  let png: AttachmentView;

  it("an engineer adds a PNG; it comes back byte for byte through the app and from the bucket", async () => {
    const res = await upload(engineer, wo.main, PNG_1X1, { name: "liner as found.png", caption: "Liner 3 as found" });
    expect(res.status).toBe(201);
    png = res.body;
    expect(png).toMatchObject({ fileName: "liner as found.png", contentType: "image/png", byteSize: PNG_1X1.length, caption: "Liner 3 as found", mayRemove: true });

    const { response, bytes } = await download(viewer, png.url);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("image/png");
    expect(response.headers.get("content-disposition")).toMatch(/^inline; filename="liner as found.png"/);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(bytes.equals(PNG_1X1)).toBe(true);

    const [row] = await rows(wo.main);
    expect(row!.objectKey).toMatch(new RegExp(`^${f.companyId}/${f.vesselA.id}/${wo.main}/[0-9a-f-]{36}$`));
    expect(row!.sha256).toBe(createHash("sha256").update(PNG_1X1).digest("hex"));
    expect(row!.uploadedBy).toBe(f.users.engineer.id);
    const direct = await s3.send(new GetObjectCommand({ Bucket: BUCKET, Key: row!.objectKey }));
    expect(Buffer.from(await direct.Body!.transformToByteArray()).equals(PNG_1X1)).toBe(true);
    expect(direct.ContentType).toBe("image/png");
  });

  it("a PDF is offered as a download, its name kept for display only", async () => {
    const res = await upload(chief, wo.main, PDF, { name: "Wärtsilä service report.pdf", type: "application/pdf" });
    expect(res.status).toBe(201);
    const { response, bytes } = await download(engineer, res.body.url);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    const disposition = response.headers.get("content-disposition") ?? "";
    expect(disposition).toMatch(/^attachment; filename="W_rtsil_ service report.pdf"/);
    expect(disposition).toContain("filename*=UTF-8''W%C3%A4rtsil%C3%A4%20service%20report.pdf");
    expect(bytes.equals(PDF)).toBe(true);
    const keys = await objectKeys(wo.main);
    expect(keys.some((k) => k.includes("service"))).toBe(false);
  });

  it("lists them oldest first with who may remove each", async () => {
    const mine = await api<AttachmentList>(engineer, "GET", path(wo.main));
    expect(mine.status).toBe(200);
    expect(mine.body.attachments.map((a) => [a.fileName, a.mayRemove])).toEqual([
      ["liner as found.png", true],
      ["Wärtsilä service report.pdf", false],
    ]);
    expect(mine.body.may.add).toBe(true);
    const office = await api<AttachmentList>(await signIn(f.users.superintendent.email, PASSWORD), "GET", path(wo.main));
    expect(office.body.attachments).toHaveLength(2);
    expect(office.body.may.add).toBe(false);
    expect(office.body.attachments.every((a) => !a.mayRemove)).toBe(true);
  });
});

describe("refused files leave nothing behind", () => {
  it("text claiming to be image/png is 422 on `file`; nothing in the bucket or the table", async () => {
    const before = { keys: await objectKeys(wo.main), rows: (await rows(wo.main)).length };
    const res = await upload(engineer, wo.main, Buffer.from("this is not a picture"), { name: "photo.png", type: "image/png" });
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ field: "file", message: expect.stringMatching(/not a JPEG, PNG or WebP photo or a PDF/) }]);
    expect(await objectKeys(wo.main)).toEqual(before.keys);
    expect(await rows(wo.main)).toHaveLength(before.rows);
  });

  it("a file over 10 MB is 422 naming its size", async () => {
    const big = new Uint8Array(10 * 1024 * 1024 + 1);
    big.set(PNG_1X1.subarray(0, 8));
    const res = await upload(engineer, wo.main, big, { name: "huge.png" });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]).toMatchObject({ field: "file", message: expect.stringMatching(/“huge.png” is larger than 10 MB/) });
    expect(await rows(wo.main)).toHaveLength(2);
    expect(await objectKeys(wo.main)).toHaveLength(2);
  });

  it("a caption over 200 characters is 422 on `caption`, nothing stored", async () => {
    const res = await upload(engineer, wo.main, PNG_1X1, { caption: "x".repeat(201) });
    expect(res.status).toBe(422);
    expect(res.body.errors?.[0]?.field).toBe("caption");
    expect(await objectKeys(wo.main)).toHaveLength(2);
  });

  it("no file is 422 on `file`", async () => {
    const form = new FormData();
    form.append("caption", "nothing attached");
    const response = await fetch(`${BASE_URL}${path(wo.main)}`, {
      method: "POST",
      headers: { origin: BASE_URL, cookie: engineer.cookie },
      body: form,
    });
    expect(response.status).toBe(422);
    expect(((await response.json()) as Problem).errors?.[0]?.field).toBe("file");
  });

  it("the 13th file is 422; two racing for the 12th place leave exactly 12 rows and 12 objects", async () => {
    for (let i = 0; i < 11; i++) expect((await upload(engineer, wo.full, PNG_1X1, { name: `p${i}.png` })).status).toBe(201);
    const race = await Promise.all([
      upload(engineer, wo.full, PNG_1X1, { name: "racer-a.png" }),
      upload(chief, wo.full, PNG_1X1, { name: "racer-b.png" }),
    ]);
    expect(race.map((r) => r.status).sort()).toEqual([201, 422]);
    const thirteenth = await upload(engineer, wo.full, PNG_1X1, { name: "one-too-many.png" });
    expect(thirteenth.status).toBe(422);
    expect(thirteenth.body.errors?.[0]).toMatchObject({ field: "file", message: expect.stringMatching(/at most 12/) });
    expect(await rows(wo.full)).toHaveLength(12);
    expect(await objectKeys(wo.full)).toHaveLength(12);
    const list = await api<AttachmentList>(engineer, "GET", path(wo.full));
    expect(list.body.may.add).toBe(false);
  });
});

describe("who may see, add and remove", () => {
  it("anonymous calls are 401", async () => {
    const [row] = await rows(wo.main);
    expect((await api(null, "GET", path(wo.main))).status).toBe(401);
    expect((await upload(null, wo.main, PNG_1X1)).status).toBe(401);
    expect((await download(null, path(wo.main, `/${row!.id}`))).response.status).toBe(401);
    expect((await api(null, "DELETE", path(wo.main, `/${row!.id}`))).status).toBe(401);
  });

  it("a viewer reads and downloads but may not add or remove (403)", async () => {
    const [row] = await rows(wo.main);
    expect((await api(viewer, "GET", path(wo.main))).status).toBe(200);
    expect((await upload(viewer, wo.main, PNG_1X1)).status).toBe(403);
    expect((await api(viewer, "DELETE", path(wo.main, `/${row!.id}`))).status).toBe(403);
  });

  it("another company's users, another vessel's path and unknown ids are 404", async () => {
    const [row] = await rows(wo.main);
    const outsider = await signIn(other.users.engineer.email, PASSWORD);
    expect((await api(outsider, "GET", path(wo.main))).status).toBe(404);
    expect((await upload(outsider, wo.main, PNG_1X1)).status).toBe(404);
    expect((await download(outsider, path(wo.main, `/${row!.id}`))).response.status).toBe(404);
    expect((await api(outsider, "DELETE", path(wo.main, `/${row!.id}`))).status).toBe(404);
    // Vessel B is the same company's, open to the superintendent: the work order is not on it.
    const office = await signIn(f.users.superintendent.email, PASSWORD);
    expect((await api(office, "GET", path(wo.main, "", f.vesselB.id))).status).toBe(404);
    expect((await download(office, path(wo.main, `/${row!.id}`, f.vesselB.id))).response.status).toBe(404);
    // The attachment under another work order of the same vessel is not found either.
    expect((await download(engineer, path(wo.full, `/${row!.id}`))).response.status).toBe(404);
    expect((await download(engineer, path(wo.main, "/not-a-uuid"))).response.status).toBe(404);
    expect((await upload(engineer, "not-a-uuid", PNG_1X1)).status).toBe(404);
    expect(await objectKeys(wo.main)).toHaveLength(2);
  });

  it("an engineer may not remove the chief's file (403); the chief may remove the engineer's", async () => {
    const all = await rows(wo.main);
    const chiefs = all.find((r) => r.uploadedBy === f.users["chief-engineer"].id)!;
    const engineers = all.find((r) => r.uploadedBy === f.users.engineer.id)!;
    expect((await api(engineer, "DELETE", path(wo.main, `/${chiefs.id}`))).status).toBe(403);
    const removed = await api(chief, "DELETE", path(wo.main, `/${engineers.id}`));
    expect(removed.status).toBe(200);
    expect(await objectKeys(wo.main)).toEqual([chiefs.objectKey]);
    expect((await rows(wo.main)).map((r) => r.id)).toEqual([chiefs.id]);
    expect((await download(engineer, path(wo.main, `/${engineers.id}`))).response.status).toBe(404);
  });
});

describe("approved evidence stays", () => {
  it("after the chief approves, nothing is added or removed (409) and the object stays", async () => {
    const added = await upload(engineer, wo.approved, PNG_1X1, { name: "after the job.png" });
    expect(added.status).toBe(201);
    const now = new Date();
    const recorded = await api(engineer, "POST", `/api/vessels/${f.vesselA.id}/work-orders/${wo.approved}/completion`, {
      doneOn: shipDay(now, f.vesselA.timeZone),
      time: shipClock(now, f.vesselA.timeZone),
      counterHours: 1010,
      manHours: 3,
      checklist: [
        { step: "Open up", done: true },
        { step: "Box up", done: true },
      ],
      measurements: [],
      remarks: "",
    });
    expect(recorded.status).toBe(201);
    // Awaiting approval the engineer may still add.
    expect((await upload(engineer, wo.approved, PNG_1X1, { name: "display.png" })).status).toBe(201);
    const decided = await api(chief, "POST", `/api/vessels/${f.vesselA.id}/work-orders/${wo.approved}/completion/decision`, {
      decision: "approve",
    });
    expect(decided.status).toBe(200);

    const removal = await api<Problem>(engineer, "DELETE", path(wo.approved, `/${added.body.id}`));
    expect(removal.status).toBe(409);
    expect(removal.body.detail).toMatch(/approved/);
    expect((await api(chief, "DELETE", path(wo.approved, `/${added.body.id}`))).status).toBe(409);
    expect((await upload(engineer, wo.approved, PNG_1X1)).status).toBe(409);
    expect(await objectKeys(wo.approved)).toHaveLength(2);
    const list = await api<AttachmentList>(chief, "GET", path(wo.approved));
    expect(list.body.may.add).toBe(false);
    expect(list.body.lockedReason).toMatch(/approved/);
    expect(list.body.attachments.every((a) => !a.mayRemove)).toBe(true);
    const { bytes } = await download(viewer, added.body.url);
    expect(bytes.equals(PNG_1X1)).toBe(true);
  });
});
