import { withAccess } from "@/server/http/with-access";
import { PartInput } from "@/server/parts/contract";
import { createPart, loadCatalogue } from "@/server/parts/queries";

/** The company's parts catalogue: everyone in the company reads it. */
export const GET = withAccess({ permission: "vessel:read" }, async ({ access }) => loadCatalogue(access));

/** Adds a part to the catalogue (administrator, superintendent, chief engineer). */
export const POST = withAccess({ permission: "parts:edit", body: PartInput }, async ({ access, body }) =>
  Response.json(await createPart(access, body), { status: 201 }),
);
