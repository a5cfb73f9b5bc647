// npm run backup / npm run restore, round trip: the backup is taken inside an open transaction's
// snapshot (pg_dump --snapshot), so the test knows exactly what it holds while the app and the
// worker keep writing; restored into a scratch database, every table has the same rows.
import { execFile } from "node:child_process";
import { randomUUID } from "node:crypto";
import { promisify } from "node:util";
import { Client } from "pg";
import { afterAll, describe, expect, it } from "vitest";

const run = promisify(execFile);
const SOURCE = process.env.DATABASE_URL!;
const scratchName = `keelson_restore_${randomUUID().slice(0, 8)}`;
const scratchUrl = SOURCE.replace(/\/[^/]+$/, `/${scratchName}`);

type Sums = Record<string, { rows: number; md5: string }>;

/** Row count and an order-independent checksum of every table of the app's schemas. */
async function tableSums(client: Client): Promise<Sums> {
  const tables = await client.query<{ name: string }>(
    `select format('%I.%I', schemaname, tablename) as name from pg_tables
      where schemaname in ('public', 'drizzle') order by 1`,
  );
  const sums: Sums = {};
  for (const { name } of tables.rows) {
    const r = await client.query<{ rows: number; md5: string | null }>(
      `select count(*)::int as rows, md5(string_agg(t::text, '|' order by t::text)) as md5 from ${name} t`,
    );
    sums[name] = { rows: r.rows[0]!.rows, md5: r.rows[0]!.md5 ?? "" };
  }
  return sums;
}

afterAll(async () => {
  const admin = new Client({ connectionString: SOURCE });
  await admin.connect();
  await admin.query(`drop database if exists ${scratchName}`);
  await admin.end();
});

describe("npm run backup, then npm run restore", () => {
  it("gives back every table with the same rows", { timeout: 120_000 }, async () => {
    const source = new Client({ connectionString: SOURCE });
    await source.connect();
    await source.query("begin isolation level repeatable read");
    const { rows } = await source.query<{ id: string }>("select pg_export_snapshot() as id");
    const before = await tableSums(source);
    const backup = await run("bash", ["scripts/backup.sh", `--snapshot=${rows[0]!.id}`], {
      env: { ...process.env, KEELSON_BACKUP_DIR: `${process.env.TEST_OUTPUT ?? "/tmp"}/backups` },
    });
    await source.query("commit");
    await source.end();
    const file = backup.stdout.trim().split("\n").at(-1)!;
    expect(file).toMatch(/keelson-\d{8}T\d{6}Z\.dump$/);

    const admin = new Client({ connectionString: SOURCE });
    await admin.connect();
    await admin.query(`create database ${scratchName}`);
    await admin.end();
    await run("bash", ["scripts/restore.sh", file], { env: { ...process.env, DATABASE_URL: scratchUrl } });

    const restored = new Client({ connectionString: scratchUrl });
    await restored.connect();
    const after = await tableSums(restored);
    await restored.end();
    expect(Object.keys(before).length).toBeGreaterThan(20);
    expect(before["public.reading"]!.rows).toBeGreaterThan(0);
    expect(after).toEqual(before);
  });

  it("refuses to restore without a file, and says how", async () => {
    const refused = await run("bash", ["scripts/restore.sh"]).catch((e: { code: number; stdout: string }) => e);
    expect("code" in refused && refused.code).toBe(2);
    expect(refused.stdout).toMatch(/usage: npm run restore <file>/);
  });
});
