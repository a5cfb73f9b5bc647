import { loadFleetBoard } from "@/server/fleet/board";
import { withAccess } from "@/server/http/with-access";

/** The Fleet board: every vessel's figures, their 90-day trends and the pending deferral requests. */
export const GET = withAccess({ permission: "fleet:read" }, async ({ access }) => loadFleetBoard(access));
