import { DefectInput, DefectListQuery } from "@/server/defects/contract";
import { listDefects, reportDefect } from "@/server/defects/queries";
import { withAccess } from "@/server/http/with-access";

/** The vessel's defect reports: open ones (or `?state=all`), those on critical equipment first. */
export const GET = withAccess({ permission: "vessel:read", vessel: true, query: DefectListQuery }, ({ access, vessel, query }) =>
  listDefects(access, vessel, query.state),
);

/** A defect found on board, reported by anyone with write access: it becomes a corrective work order. */
export const POST = withAccess({ permission: "readings:write", vessel: true, body: DefectInput }, async ({ access, vessel, body }) =>
  Response.json(await reportDefect(access, vessel, body), { status: 201 }),
);
