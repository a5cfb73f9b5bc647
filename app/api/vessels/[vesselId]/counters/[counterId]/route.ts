import { withAccess } from "@/server/http/with-access";
import { CounterPatch } from "@/server/register/contract";
import { retireCounter, updateCounter } from "@/server/register/counters";
import { CounterParams } from "@/server/http/params";

/** Renames a counter or changes its planned hours per day (the rate used while history is short). */
export const PATCH = withAccess(
  { permission: "register:edit", vessel: true, body: CounterPatch, params: CounterParams },
  async ({ access, vessel, params, body }) => {
    const updated = await updateCounter(access, vessel, params.counterId, body);
    return updated;
  },
);

/** Retires the counter: it leaves the Hour log, its readings stay on record. */
export const DELETE = withAccess(
  { permission: "register:edit", vessel: true, params: CounterParams },
  ({ access, vessel, params }) => retireCounter(access, vessel, params.counterId),
);
