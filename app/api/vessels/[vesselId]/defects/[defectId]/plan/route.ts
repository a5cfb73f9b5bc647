import { DefectPlanInput } from "@/server/defects/contract";
import { planDefect } from "@/server/defects/queries";
import { DefectParams } from "@/server/http/params";
import { withAccess } from "@/server/http/with-access";

/** The chief engineer plans the repair: target day, rank, man-hours and the parts it needs. */
export const POST = withAccess(
  { permission: "work:plan", vessel: true, params: DefectParams, body: DefectPlanInput },
  ({ access, vessel, params, body }) => planDefect(access, vessel, params.defectId, body),
);
