import { PlannedDateInput } from "@/server/calendar/contract";
import { setPlannedDate } from "@/server/calendar/planned-date";
import { withAccess } from "@/server/http/with-access";

/** The chief engineer plans a work order on a day inside its tolerance window, or clears the plan. */
export const PUT = withAccess(
  { permission: "work:plan", vessel: true, body: PlannedDateInput },
  ({ access, vessel, params, body }) => setPlannedDate(access, vessel, params.workOrderId ?? "", body),
);
