import { withAccess } from "@/server/http/with-access";
import { CounterInput } from "@/server/register/contract";
import { createCounter } from "@/server/register/counters";

/** Adds a counter (an hour meter) to the vessel. */
export const POST = withAccess(
  { permission: "register:edit", vessel: true, body: CounterInput },
  async ({ access, vessel, body }) => {
    const created = await createCounter(access, vessel, body);
    return Response.json(created, { status: 201 });
  },
);
