// The adapter that runs pg-boss's SQL on the caller's connection: every `$n` becomes one bound
// parameter in its place, whatever the value (pg-boss passes arrays and objects as values).
import { PgDialect } from "drizzle-orm/pg-core";
import type { SQL } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import type { JobConnection } from "./send";
import { bossConnection } from "./send";

function capture() {
  const seen: { sql: string; params: unknown[] }[] = [];
  const connection = {
    execute: async (query: SQL) => {
      seen.push(new PgDialect().sqlToQuery(query));
      return { rows: [{ id: "job-1" }] };
    },
  } as unknown as JobConnection;
  return { seen, db: bossConnection(connection) };
}

describe("bossConnection", () => {
  it("keeps each placeholder's value in its place, $10 not read as $1 then 0", async () => {
    const { seen, db } = capture();
    const values = ["a", "b", "c", "d", "e", "f", "g", "h", "i", "j"];
    const result = await db.executeSql("select $10, $1, $2::int", values);
    expect(result.rows).toEqual([{ id: "job-1" }]);
    expect(seen[0]!.sql).toBe("select $1, $2, $3::int");
    expect(seen[0]!.params).toEqual(["j", "a", "b"]);
  });

  it("binds an array and an object as one parameter each, and a missing value as null", async () => {
    const { seen, db } = capture();
    await db.executeSql("insert into t values ($1, $2::jsonb, $3)", [["x", "y"], { vesselId: "v" }]);
    expect(seen[0]!.sql).toBe("insert into t values ($1, $2::jsonb, $3)");
    expect(seen[0]!.params).toEqual([["x", "y"], { vesselId: "v" }, null]);
  });

  it("leaves a dollar sign that is not a placeholder alone", async () => {
    const { seen, db } = capture();
    await db.executeSql("select 'US$' || $1", ["5"]);
    expect(seen[0]!.sql).toBe("select 'US$' || $1");
  });
});
