import { withAccess } from "@/server/http/with-access";
import { loadRankNamesView, saveRankNames } from "@/server/admin/rank-names";
import { RankNamesInput } from "@/server/routines/rank-names";

/** The company's own names for Keelson's ranks. */
export const GET = withAccess({ permission: "company:manage" }, ({ access }) => loadRankNamesView(access));

export const PUT = withAccess({ permission: "company:manage", body: RankNamesInput }, ({ access, body }) =>
  saveRankNames(access, body),
);
