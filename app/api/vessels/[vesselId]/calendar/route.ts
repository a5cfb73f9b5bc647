import { CalendarQuery } from "@/server/calendar/contract";
import { loadCalendar } from "@/server/calendar/queries";
import { withAccess } from "@/server/http/with-access";

/** Work orders and port stays of a range of the ship's days, from the worker's rows. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: CalendarQuery },
  ({ access, vessel, query }) => loadCalendar(access, vessel, query),
);
