import { checkDatabase } from "@/server/health";
import { withoutSession } from "@/server/http/with-access";

export const dynamic = "force-dynamic";

/** Up and able to reach its database: 200, else a 503 problem a load balancer can act on. */
export const GET = withoutSession(async () => ({ status: "ok", database: await checkDatabase() }));
