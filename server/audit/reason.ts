import "server-only";
import { sql } from "drizzle-orm";
import type { Tx } from "@/db/client";

/**
 * The reason a person gave for this change (a reading corrected, a deferral asked or decided, a
 * completion returned): every audit entry the transaction writes after this carries it. Local to
 * the transaction, so it never reaches another change on the same connection.
 */
export async function giveReason(tx: Tx, reason: string | null | undefined): Promise<void> {
  if (!reason) return;
  await tx.execute(sql`select set_config('keelson.reason', ${reason}, true)`);
}
