import { applyDueClockChanges } from "@/server/vessels/clock";
import type { JobHandler } from "./definition";

const shipClocksHandler: JobHandler<object> = async (_payload, { db }) => {
  const moved = await applyDueClockChanges(db);
  return moved ? `${moved} ${moved === 1 ? "vessel" : "vessels"} moved to a new zone` : "";
};
export default shipClocksHandler;
