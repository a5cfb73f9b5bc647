import { withAccess } from "@/server/http/with-access";
import { fileSource, previewImport } from "@/server/import/service";
import { readImportUpload } from "@/server/import/upload";

/**
 * What importing the files would create, change and retire on the vessel, and every problem by file,
 * row and column. Writes nothing. multipart/form-data: `file` (one or more), optional `retire`.
 */
export const POST = withAccess({ permission: "register:edit", vessel: true }, async ({ request, access, vessel }) =>
  previewImport(access, vessel, fileSource(await readImportUpload(request))),
);
