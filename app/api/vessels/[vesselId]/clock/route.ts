import { withAccess } from "@/server/http/with-access";
import { addClockChange, loadShipClock } from "@/server/vessels/clock";
import { ClockChangeInput } from "@/server/vessels/clock-contract";

/** The ship's clock: the zone kept now and the changes on passage. */
export const GET = withAccess({ permission: "vessel:read", vessel: true }, async ({ access, vessel }) =>
  loadShipClock(access, vessel),
);

/** Enters a change of the ship's clock (the chief engineer): from a ship's time, to a zone. */
export const POST = withAccess(
  { permission: "clock:set", vessel: true, body: ClockChangeInput },
  async ({ access, vessel, body }) => Response.json(await addClockChange(access, vessel, body), { status: 201 }),
);
