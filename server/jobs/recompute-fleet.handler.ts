import { isNull } from "drizzle-orm";
import { vessel } from "@/db/schema";
import type { JobHandler } from "./definition";
import { recomputeVesselJob } from "./recompute-vessel";
import { sendJob } from "./send";

const recomputeFleetHandler: JobHandler<object> = async (_payload, { db }) => {
  const vessels = await db
    .select({ id: vessel.id, companyId: vessel.companyId })
    .from(vessel)
    .where(isNull(vessel.retiredAt));
  for (const v of vessels) await sendJob(db, recomputeVesselJob, { companyId: v.companyId, vesselId: v.id });
  return `${vessels.length} vessels queued`;
};
export default recomputeFleetHandler;
