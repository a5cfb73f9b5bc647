import { PlannedDateInput } from "@/server/calendar/contract";
import { setPlannedDate } from "@/server/calendar/planned-date";
import { withAccess } from "@/server/http/with-access";
import { WorkOrderParams } from "@/server/http/params";

/** The chief engineer plans a work order on a day inside its tolerance window, or clears the plan. */
export const PUT = withAccess(
  { permission: "work:plan", vessel: true, body: PlannedDateInput, params: WorkOrderParams },
  ({ access, vessel, params, body }) => setPlannedDate(access, vessel, params.workOrderId, body),
);
