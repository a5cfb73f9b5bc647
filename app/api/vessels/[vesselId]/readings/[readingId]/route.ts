import { withAccess } from "@/server/http/with-access";
import { ReadingCorrectionInput, ReadingRemovalInput } from "@/server/readings/contract";
import { correctReading, removeReading } from "@/server/readings/corrections";
import { ReadingParams } from "@/server/http/params";

/** Corrects a mistyped reading's value (and remark), with a reason kept in its audit trail. */
export const PATCH = withAccess(
  { permission: "readings:write", vessel: true, body: ReadingCorrectionInput, params: ReadingParams },
  async ({ access, vessel, params, body }) => {
    const result = await correctReading({ access, vessel }, params.readingId, body);
    return result;
  },
);

/** Removes a reading entered by mistake; the audit trail keeps its value and the reason. */
export const DELETE = withAccess(
  { permission: "readings:write", vessel: true, body: ReadingRemovalInput, params: ReadingParams },
  async ({ access, vessel, params, body }) => {
    const result = await removeReading({ access, vessel }, params.readingId, body.reason);
    return result;
  },
);
