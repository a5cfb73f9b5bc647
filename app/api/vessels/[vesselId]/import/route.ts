import { withAccess } from "@/server/http/with-access";
import { listImports } from "@/server/import/history";
import { applyImport, fileSource } from "@/server/import/service";
import { readImportUpload } from "@/server/import/upload";

/** The vessel's past imports, newest first: who, when, which files, what they did. */
export const GET = withAccess({ permission: "register:edit", vessel: true }, ({ access, vessel }) => listImports(access, vessel));

/** Applies the files, all or nothing, after the preview's checks again (a refusal writes nothing). */
export const POST = withAccess({ permission: "register:edit", vessel: true }, async ({ request, access, vessel }) => {
  const result = await applyImport(access, vessel, fileSource(await readImportUpload(request)));
  return Response.json(result, { status: 201 });
});
