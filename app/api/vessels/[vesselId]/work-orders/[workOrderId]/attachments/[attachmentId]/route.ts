import { attachmentResponse } from "@/server/attachments/download";
import { findAttachment, removeAttachment } from "@/server/attachments/queries";
import { withAccess } from "@/server/http/with-access";
import { AttachmentParams } from "@/server/http/params";

/** The file itself, streamed through the app with its checked type. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: AttachmentParams },
  async ({ access, vessel, params }) => {
    const stored = await findAttachment(access, vessel, params.workOrderId, params.attachmentId);
    return attachmentResponse(stored);
  },
);

/** Removes it: the uploader or a chief engineer, while the completion is not yet approved. */
export const DELETE = withAccess(
  { permission: "readings:write", vessel: true, params: AttachmentParams },
  ({ access, vessel, params }) => removeAttachment(access, vessel, params.workOrderId, params.attachmentId),
);
