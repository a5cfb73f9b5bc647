// The critical spares a vessel holds fewer of than the company's minimum: the daily digest's line.
import "server-only";
import { and, eq, gt, sql } from "drizzle-orm";
import type { Db, Tx } from "@/db/client";
import { part, stockMovement } from "@/db/schema";
import type { PartUnit } from "@/db/schema/parts";
import { q3 } from "./stock";

export type LowSpare = { number: string; description: string; unit: PartUnit; onBoard: number; minimum: number };

export async function lowCriticalSpares(db: Db | Tx, companyId: string, vesselId: string): Promise<LowSpare[]> {
  // Written out: drizzle leaves the table's name off a one-table select, and "id" would be m.id.
  const held = sql<string>`coalesce((select sum(m.quantity) from ${stockMovement} m
    where m.company_id = "part"."company_id" and m.vessel_id = ${vesselId} and m.part_id = "part"."id"), 0)`;
  const rows = await db
    .select({ number: part.number, description: part.description, unit: part.unit, minimum: part.minimumOnBoard, onBoard: held })
    .from(part)
    .where(and(eq(part.companyId, companyId), eq(part.critical, true), gt(part.minimumOnBoard, 0), sql`${held} < ${part.minimumOnBoard}`))
    .orderBy(part.number);
  return rows.map((r) => ({ number: r.number, description: r.description, unit: r.unit, minimum: r.minimum, onBoard: q3(Number(r.onBoard)) }));
}
