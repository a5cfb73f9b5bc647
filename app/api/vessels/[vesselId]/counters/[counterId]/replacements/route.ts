import { withAccess } from "@/server/http/with-access";
import { MeterReplacementInput } from "@/server/register/contract";
import { replaceMeter } from "@/server/register/counters";
import { CounterParams } from "@/server/http/params";

/** Records a new hour meter on the counter: a new segment whose offset keeps the total continuous. */
export const POST = withAccess(
  { permission: "register:edit", vessel: true, body: MeterReplacementInput, params: CounterParams },
  async ({ access, vessel, params, body }) => {
    const result = await replaceMeter(access, vessel, params.counterId, body);
    return Response.json(result, { status: 201 });
  },
);
