// Photos and documents of a work order's completion: list, add, remove, and the row a download
// needs. Bytes live in object storage (server/storage/s3.ts); this table says whose they are.
// Every query is scoped by the access context's company and the door's vessel.
import "server-only";
import { createHash, randomUUID } from "node:crypto";
import { and, asc, count, eq, sql } from "drizzle-orm";
import { type Db, getDb, type Tx } from "@/db/client";
import { completion, completionAttachment, user, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { can } from "@/server/auth/roles";
import { AppError, invalidInput } from "@/server/http/problem";
import { deleteObject, putObject } from "@/server/storage/s3";
import { noSuchWorkOrder } from "@/server/work-orders/lock";
import {
  type AttachmentList,
  type AttachmentType,
  type AttachmentView,
  formatBytes,
  MAX_ATTACHMENT_BYTES,
  MAX_ATTACHMENTS_PER_WORK_ORDER,
} from "./contract";
import { displayName, sniffType } from "./sniff";

type WorkOrderState = { id: string; number: string; state: string; completionStatus: string | null };

/** The work order of this company and vessel with its completion's status; anything else is 404. */
async function findWorkOrder(db: Db | Tx, access: Access, vessel: VesselRef, id: string) {
  const [row] = await db
    .select({ id: workOrder.id, number: workOrder.number, state: workOrder.state, completionStatus: completion.status })
    .from(workOrder)
    .leftJoin(completion, and(eq(completion.companyId, workOrder.companyId), eq(completion.workOrderId, workOrder.id)))
    .where(and(eq(workOrder.companyId, access.company.id), eq(workOrder.vesselId, vessel.id), eq(workOrder.id, id)));
  if (!row) throw noSuchWorkOrder();
  return row satisfies WorkOrderState;
}

/** Approved evidence stays as it was approved: nothing added, nothing removed. */
function lockedReason(w: WorkOrderState): string | null {
  if (w.completionStatus === "approved" || w.state === "done") {
    return `${w.number} is approved: its photos and documents are kept as they were approved.`;
  }
  return null;
}

function mayRemove(access: Access, uploadedBy: string | null, locked: boolean): boolean {
  if (locked || !can(access.role, "readings:write")) return false;
  return uploadedBy === access.user.id || access.role === "chief-engineer";
}

const attachmentsPath = (vesselId: string, workOrderId: string) =>
  `/api/vessels/${vesselId}/work-orders/${workOrderId}/attachments`;

export async function listAttachments(access: Access, vessel: VesselRef, workOrderId: string): Promise<AttachmentList> {
  const db = getDb();
  const w = await findWorkOrder(db, access, vessel, workOrderId);
  // A retired vessel's records are read, not changed (the door refuses the writes with 409).
  const locked =
    lockedReason(w) ?? (vessel.retiredAt ? `${vessel.name} is retired: its records can be read, not changed.` : null);
  const rows = await db
    .select({ a: completionAttachment, uploadedBy: user.name })
    .from(completionAttachment)
    .leftJoin(user, eq(user.id, completionAttachment.uploadedBy))
    .where(and(eq(completionAttachment.companyId, access.company.id), eq(completionAttachment.workOrderId, w.id)))
    .orderBy(asc(completionAttachment.uploadedAt), asc(completionAttachment.id));
  const attachments: AttachmentView[] = rows.map(({ a, uploadedBy }) => ({
    id: a.id,
    fileName: a.fileName,
    contentType: a.contentType,
    byteSize: a.byteSize,
    caption: a.caption,
    uploadedBy,
    uploadedAt: a.uploadedAt.toISOString(),
    url: `${attachmentsPath(vessel.id, w.id)}/${a.id}`,
    mayRemove: mayRemove(access, a.uploadedBy, locked !== null),
  }));
  return {
    attachments,
    may: {
      add: can(access.role, "readings:write") && !locked && attachments.length < MAX_ATTACHMENTS_PER_WORK_ORDER,
    },
    lockedReason: locked,
    limits: { maxFiles: MAX_ATTACHMENTS_PER_WORK_ORDER, maxBytes: MAX_ATTACHMENT_BYTES },
  };
}

/** One writer of a work order's attachments at a time, so two uploads cannot both be the 12th. */
async function lockAttachments(tx: Tx, workOrderId: string) {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtextextended(${`attachments:${workOrderId}`}, 0))`);
}

async function countAttachments(db: Db | Tx, companyId: string, workOrderId: string) {
  const [row] = await db
    .select({ n: count() })
    .from(completionAttachment)
    .where(and(eq(completionAttachment.companyId, companyId), eq(completionAttachment.workOrderId, workOrderId)));
  return row?.n ?? 0;
}

const tooMany = () =>
  invalidInput([
    {
      field: "file",
      message: `A work order keeps at most ${MAX_ATTACHMENTS_PER_WORK_ORDER} photos and documents: remove one before adding another.`,
    },
  ]);

export type Upload = { name: string; bytes: Uint8Array; caption: string | undefined };

/**
 * Checks the file (its real type by its first bytes, its size, the work order's count), stores it
 * under a key of its own and records it. Nothing is kept of a refused file; a row that cannot be
 * written takes its object away with it.
 */
export async function addAttachment(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  upload: Upload,
): Promise<AttachmentView> {
  const companyId = access.company.id;
  const db = getDb();
  const w = await findWorkOrder(db, access, vessel, workOrderId);
  const locked = lockedReason(w);
  if (locked) throw new AppError("conflict", locked);

  const { bytes } = upload;
  if (bytes.byteLength === 0) throw invalidInput([{ field: "file", message: `“${upload.name}” is empty.` }]);
  if (bytes.byteLength > MAX_ATTACHMENT_BYTES) {
    throw invalidInput([
      {
        field: "file",
        message: `“${upload.name}” is larger than ${formatBytes(MAX_ATTACHMENT_BYTES)}, the most one file may be.`,
      },
    ]);
  }
  const type: AttachmentType | null = sniffType(bytes);
  if (!type) {
    throw invalidInput([
      {
        field: "file",
        message: `“${upload.name}” is not a JPEG, PNG or WebP photo or a PDF (judged by its content, not its name).`,
      },
    ]);
  }
  // Checked before the upload too, so a full work order costs no transfer to the bucket.
  if ((await countAttachments(db, companyId, w.id)) >= MAX_ATTACHMENTS_PER_WORK_ORDER) throw tooMany();

  const key = `${companyId}/${vessel.id}/${w.id}/${randomUUID()}`;
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  const fileName = displayName(upload.name, type);
  await putObject(key, bytes, type);

  try {
    const saved = await db.transaction(async (tx) => {
      await lockAttachments(tx, w.id);
      // Again under the lock: the completion may have been approved, or a 12th file added, meanwhile.
      const now = await findWorkOrder(tx, access, vessel, w.id);
      const lockedNow = lockedReason(now);
      if (lockedNow) throw new AppError("conflict", lockedNow);
      if ((await countAttachments(tx, companyId, w.id)) >= MAX_ATTACHMENTS_PER_WORK_ORDER) throw tooMany();
      const [row] = await tx
        .insert(completionAttachment)
        .values({
          companyId,
          vesselId: vessel.id,
          workOrderId: w.id,
          objectKey: key,
          fileName,
          contentType: type,
          byteSize: bytes.byteLength,
          sha256,
          caption: upload.caption || null,
          uploadedBy: access.user.id,
        })
        .returning();
      return row!;
    });
    return {
      id: saved.id,
      fileName: saved.fileName,
      contentType: saved.contentType,
      byteSize: saved.byteSize,
      caption: saved.caption,
      uploadedBy: access.user.name,
      uploadedAt: saved.uploadedAt.toISOString(),
      url: `${attachmentsPath(vessel.id, w.id)}/${saved.id}`,
      mayRemove: true,
    };
  } catch (error) {
    // The row was not written: the object must not stay behind, unowned.
    await deleteObject(key).catch((cleanup: unknown) =>
      console.error(`[attachments] could not remove the unrecorded object ${key}`, cleanup),
    );
    throw error;
  }
}

/** The row a download needs: of this company, vessel and work order, else 404. */
export async function findAttachment(access: Access, vessel: VesselRef, workOrderId: string, attachmentId: string) {
  const [row] = await getDb()
    .select()
    .from(completionAttachment)
    .where(
      and(
        eq(completionAttachment.companyId, access.company.id),
        eq(completionAttachment.vesselId, vessel.id),
        eq(completionAttachment.workOrderId, workOrderId),
        eq(completionAttachment.id, attachmentId),
      ),
    );
  if (!row) throw noSuchAttachment();
  return row;
}

function noSuchAttachment() {
  return new AppError("not-found", "There is no such photo or document on this work order.");
}

/**
 * Removes a photo or document: its uploader or a chief engineer, while the completion is not yet
 * approved. The row goes first (in a transaction under the work order's attachment lock), then the
 * object: a failure there leaves an unlisted object, never a listed file without its bytes.
 */
export async function removeAttachment(
  access: Access,
  vessel: VesselRef,
  workOrderId: string,
  attachmentId: string,
): Promise<{ removed: string }> {
  const found = await findAttachment(access, vessel, workOrderId, attachmentId);
  const key = await getDb().transaction(async (tx) => {
    await lockAttachments(tx, found.workOrderId);
    const w = await findWorkOrder(tx, access, vessel, found.workOrderId);
    const locked = lockedReason(w);
    if (locked) throw new AppError("conflict", locked);
    if (!mayRemove(access, found.uploadedBy, false)) {
      throw new AppError("forbidden", "Only the engineer who added it or the chief engineer may remove it.");
    }
    const [gone] = await tx
      .delete(completionAttachment)
      .where(and(eq(completionAttachment.companyId, access.company.id), eq(completionAttachment.id, found.id)))
      .returning({ key: completionAttachment.objectKey });
    if (!gone) throw noSuchAttachment();
    return gone.key;
  });
  await deleteObject(key).catch((error: unknown) =>
    console.error(`[attachments] removed ${found.id} but could not remove its object ${key}`, error),
  );
  return { removed: found.fileName };
}
