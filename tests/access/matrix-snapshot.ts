// Every table of the public schema as a row count and a checksum, to show that refused requests
// changed nothing. Tenant tables are read for the matrix's own companies only, so other test
// files writing their own companies at the same time do not disturb the comparison.
import { sql } from "drizzle-orm";
import type { Db } from "@/db/client";

/**
 * Tables that change without any request of the matrix: better-auth's sessions (extended on use)
 * and verification tokens, the outbox the worker sends from, and failed sign-ins, which any test
 * file's wrong password adds to and which name no company or user to scope them by.
 */
const CHANGING_ON_THEIR_OWN = new Set(["session", "verification", "mail_outbox", "sign_in_failure"]);

export type TableSnapshot = Map<string, string>;

export async function snapshotTables(db: Db, companyIds: string[]): Promise<TableSnapshot> {
  const columns = await db.execute<{ table_name: string; column_name: string }>(sql`
    select c.table_name, c.column_name
    from information_schema.columns c
    join information_schema.tables t using (table_schema, table_name)
    where c.table_schema = 'public' and t.table_type = 'BASE TABLE'`);
  const tables = new Map<string, Set<string>>();
  for (const { table_name, column_name } of columns.rows) {
    if (CHANGING_ON_THEIR_OWN.has(table_name)) continue;
    tables.set(table_name, (tables.get(table_name) ?? new Set()).add(column_name));
  }
  const ids = sql.join(
    companyIds.map((id) => sql`${id}`),
    sql`, `,
  );
  const members = sql`(select user_id from membership where company_id in (${ids}))`;
  const snapshot: TableSnapshot = new Map();
  for (const [name, cols] of [...tables].sort(([a], [b]) => a.localeCompare(b))) {
    const scope = cols.has("company_id")
      ? sql`where company_id in (${ids})`
      : name === "company"
        ? sql`where id in (${ids})`
        : name === "user"
          ? sql`where id in ${members}`
          : cols.has("user_id")
            ? sql`where user_id in ${members}`
            : sql``;
    const result = await db.execute<{ rows: number; sum: string }>(sql`
      select count(*)::int as rows, md5(coalesce(string_agg(t::text, ',' order by t::text), '')) as sum
      from ${sql.identifier(name)} t ${scope}`);
    const row = result.rows[0]!;
    snapshot.set(name, `${row.rows} rows, md5 ${row.sum}`);
  }
  return snapshot;
}

/** The tables whose rows differ, each with both states, e.g. "reading: 2 rows, md5 … → 3 rows, md5 …". */
export function changedTables(before: TableSnapshot, after: TableSnapshot): string[] {
  const names = new Set([...before.keys(), ...after.keys()]);
  return [...names]
    .filter((n) => before.get(n) !== after.get(n))
    .map((n) => `${n}: ${before.get(n)} → ${after.get(n)}`);
}
