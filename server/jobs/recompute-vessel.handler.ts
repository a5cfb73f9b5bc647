import type { JobHandler } from "./definition";
import { recomputeVessel } from "@/server/scheduling/recompute";

const recomputeVesselHandler: JobHandler<{ companyId: string; vesselId: string }> = async (payload, { db }) => {
  const r = await recomputeVessel(db, payload.companyId, payload.vesselId);
  return (
    `${payload.vesselId}: ${r.counters} counters, ${r.created} work orders created, ${r.updated} updated, ${r.stateChanges} state changes` +
    (r.skipped.length ? `, ${r.skipped.length} routines cannot be planned` : "")
  );
};
export default recomputeVesselHandler;
