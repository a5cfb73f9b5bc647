import { withAccess } from "@/server/http/with-access";
import { loadStores } from "@/server/parts/queries";

/** What is on board: every part with stock, each critical spare and each part with a minimum, per location. */
export const GET = withAccess({ permission: "vessel:read", vessel: true }, async ({ access, vessel }) => loadStores(access, vessel));
