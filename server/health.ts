import "server-only";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { AppError, databaseUnavailableProblem } from "@/server/http/problem";

/** One round trip to PostgreSQL with its time; a failure is the "unavailable" problem (503). */
export async function checkDatabase(): Promise<{ ms: number }> {
  const started = performance.now();
  try {
    await getDb().execute(sql`select 1`);
  } catch (error) {
    throw databaseUnavailableProblem(error) ?? new AppError("unavailable", "The database did not answer the health check.");
  }
  return { ms: Math.round((performance.now() - started) * 10) / 10 };
}
