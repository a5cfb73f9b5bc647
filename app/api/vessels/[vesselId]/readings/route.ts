import { withAccess } from "@/server/http/with-access";
import { ReadingBatchInput, ReadingHistoryQuery } from "@/server/readings/contract";
import { readingHistory, saveReadingBatch } from "@/server/readings/queries";

/** A counter's readings and daily running hours over the last `days` days. */
export const GET = withAccess(
  { permission: "vessel:read", vessel: true, query: ReadingHistoryQuery },
  ({ access, vessel, query }) => readingHistory(access, vessel, query.counterId, query.days),
);

/** A day's readings for several counters, stored all at once or not at all. */
export const POST = withAccess(
  { permission: "readings:write", vessel: true, body: ReadingBatchInput },
  async ({ access, vessel, body }) => {
    const result = await saveReadingBatch(access, vessel, body);
    return Response.json(result, { status: 201 });
  },
);
