import { readUpload } from "@/server/attachments/form";
import { addAttachment, listAttachments } from "@/server/attachments/queries";
import { withAccess } from "@/server/http/with-access";
import { WorkOrderParams } from "@/server/http/params";

/** The work order's photos and documents, oldest first, with what this user may do with them. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, params: WorkOrderParams },
  ({ access, vessel, params }) => listAttachments(access, vessel, params.workOrderId),
);

/**
 * Adds one photo or document (multipart/form-data: `file`, optional `caption`): whoever may record
 * the completion. The body is a form, not JSON, so the door parses no body and the handler reads it.
 */
export const POST = withAccess(
  { permission: "readings:write", vessel: true, params: WorkOrderParams },
  async ({ request, access, vessel, params }) => {
    const upload = await readUpload(request);
    const saved = await addAttachment(access, vessel, params.workOrderId, upload);
    return Response.json(saved, { status: 201 });
  },
);
