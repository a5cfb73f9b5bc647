// The ids a route's path carries, parsed by the door before any query: a malformed id is the same
// "not found" as an id that exists nowhere (ids never tell what exists), and never reaches SQL.
import { z } from "zod";
import { isUuid } from "./ids";

/** A uuid in a path segment; `what` names it in the 404 ("There is no such work order."). */
export const pathId = (what: string) => z.string().refine(isUuid, { message: `There is no such ${what}.` });

/** better-auth's user ids: letters, digits, `-` and `_` (its own ids, or a uuid from an import). */
export const userPathId = z
  .string()
  .regex(/^[A-Za-z0-9_-]{1,64}$/, { message: "There is no such person in the company." });

export const WorkOrderParams = z.object({ workOrderId: pathId("work order") });
export const AttachmentParams = WorkOrderParams.extend({ attachmentId: pathId("attachment") });
export const RoutineParams = z.object({ routineId: pathId("routine") });
export const CounterParams = z.object({ counterId: pathId("counter") });
export const ComponentParams = z.object({ componentId: pathId("component") });
export const ReadingParams = z.object({ readingId: pathId("reading") });
export const DeferralParams = z.object({ deferralId: pathId("deferral request") });
export const PortStayParams = z.object({ stayId: pathId("port stay") });
export const ToleranceRuleParams = z.object({ ruleId: pathId("tolerance rule") });
export const MessageParams = z.object({ messageId: pathId("message") });
export const UserParams = z.object({ userId: userPathId });
export const PartParams = z.object({ partId: pathId("part") });
export const RequisitionParams = z.object({ requisitionId: pathId("requisition") });
export const DefectParams = z.object({ defectId: pathId("defect report") });
