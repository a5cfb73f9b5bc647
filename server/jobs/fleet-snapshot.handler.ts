import { asc, isNull } from "drizzle-orm";
import { vessel } from "@/db/schema";
import { takeVesselSnapshot } from "@/server/fleet/snapshot";
import type { JobHandler } from "./definition";

const fleetSnapshotHandler: JobHandler<object> = async (_payload, { db }) => {
  const vessels = await db
    .select({ id: vessel.id, companyId: vessel.companyId })
    .from(vessel)
    .where(isNull(vessel.retiredAt))
    .orderBy(asc(vessel.id));
  const now = new Date();
  for (const v of vessels) await takeVesselSnapshot(db, v.companyId, v.id, now);
  return `${vessels.length} vessels`;
};
export default fleetSnapshotHandler;
