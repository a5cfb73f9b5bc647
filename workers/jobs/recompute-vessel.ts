// Recompute one vessel: sent by the readings route handler (coalesced per vessel) and by the
// nightly fan-out, because calendar time passes without readings.
import { z } from "zod";
import type { Db } from "@/db/client";
import { recomputeVessel as recompute } from "@/server/scheduling/recompute";

export const recomputeVessel = {
  name: "vessel-recompute",
  payload: z.object({ companyId: z.uuid(), vesselId: z.uuid() }),
  async handle(db: Db, payload: { companyId: string; vesselId: string }) {
    return recompute(db, payload.companyId, payload.vesselId);
  },
} as const;
