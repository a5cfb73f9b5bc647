// What a list marks on a work order beside its state, as SQL over the `work_order` row of the
// query: shared by the Backlog and the fleet's overdue list so both say the same.
import { sql } from "drizzle-orm";
import { completion, deferral, workOrder } from "@/db/schema";

/** A completion the chief has still to decide on. */
export const AWAITING_APPROVAL = sql<boolean>`exists (select 1 from ${completion} where ${completion.companyId} = ${workOrder.companyId} and ${completion.workOrderId} = ${workOrder.id} and ${completion.status} = 'awaiting-approval')`;

/** A deferral request nobody has decided yet (at most one per work order: a partial unique index). */
export const PENDING_DEFERRAL = sql<boolean>`exists (select 1 from ${deferral} where ${deferral.companyId} = ${workOrder.companyId} and ${deferral.workOrderId} = ${workOrder.id} and ${deferral.status} = 'pending')`;
