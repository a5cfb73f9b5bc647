import { UserInput } from "@/server/admin/contract";
import { createPerson, listCompanyPeople } from "@/server/admin/people-queries";
import { withAccess } from "@/server/http/with-access";

/** Everyone of the company with role, rank, assigned vessels and whether they can sign in. */
export const GET = withAccess({ permission: "company:manage" }, async ({ access }) => ({
  people: await listCompanyPeople(access),
}));

/** A new account with an initial password that the administrator hands over. */
export const POST = withAccess({ permission: "company:manage", body: UserInput }, async ({ access, body }) =>
  Response.json(await createPerson(access, body), { status: 201 }),
);
