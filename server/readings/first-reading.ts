import "server-only";
import { sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";

export type AwaitingFirstReading = { workOrderId: string; number: string; title: string; counter: string };

/**
 * Open work by running hours whose counter has never been read: Keelson cannot say when it falls
 * due until someone reads the meter (the Backlog says "needs a first reading"; the digest tells the
 * chief engineer). At most `limit`, by work order number.
 */
export async function awaitingFirstReading(
  db: Db | Tx,
  companyId: string,
  vesselId: string,
  limit = 50,
): Promise<AwaitingFirstReading[]> {
  const { rows } = await db.execute<{ id: string; number: string; title: string; counter: string }>(sql`
    select w.id, w.number, w.title, c.name as counter
      from work_order w
      join counter c on c.id = w.counter_id and c.company_id = ${companyId} and c.retired_at is null
     where w.company_id = ${companyId} and w.vessel_id = ${vesselId} and w.state <> 'done'
       and w.kind = 'planned' and w.due_date is null
       and not exists (select 1 from reading r where r.company_id = ${companyId} and r.counter_id = c.id)
     order by w.number
     limit ${limit}`);
  return rows.map((r) => ({ workOrderId: r.id, number: r.number, title: r.title, counter: r.counter }));
}
