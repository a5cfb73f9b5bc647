import { withAccess } from "@/server/http/with-access";
import { loadHourLog } from "@/server/readings/queries";

/** Every counter of the vessel with its last reading: what the Hour log page shows. */
export const GET = withAccess({ permission: "vessel:read", vessel: true }, ({ access, vessel }) =>
  loadHourLog(access, vessel),
);
