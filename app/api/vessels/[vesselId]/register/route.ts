import { withAccess } from "@/server/http/with-access";
import { loadRegister } from "@/server/register/queries";

/** The vessel's machinery register: every component with its effective counter, every counter. */
export const GET = withAccess({ permission: "vessel:read", vessel: true }, ({ access, vessel }) =>
  loadRegister(access, vessel),
);
