import { withAccess } from "@/server/http/with-access";
import { copySource, CopyRequest } from "@/server/import/copy";
import { applyImport, previewImport } from "@/server/import/service";

/**
 * Copies another vessel's plan (register, counters with new meters, routines) to this one: with
 * `apply: false` the preview, with `apply: true` the copy, all or nothing, through the import's checks.
 */
export const POST = withAccess({ permission: "register:edit", vessel: true, body: CopyRequest }, async ({ access, vessel, body }) => {
  const source = await copySource(access, vessel, body);
  if (!body.apply) return previewImport(access, vessel, source);
  return Response.json(await applyImport(access, vessel, source), { status: 201 });
});
