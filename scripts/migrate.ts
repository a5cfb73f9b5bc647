// Applies the committed drizzle-kit migrations in ./drizzle to DATABASE_URL, then pg-boss's own
// schema and the queue of every registered job, so the web can send a job before a worker ran.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import PgBoss from "pg-boss";
import { closeDb, databaseUrl, getDb } from "../db/client";
import { createJobQueues } from "../server/jobs/queues";

await migrate(getDb(), { migrationsFolder: "./drizzle" });
await closeDb();

const boss = new PgBoss({ connectionString: databaseUrl(), supervise: false, schedule: false });
await boss.start();
await createJobQueues(boss);
await boss.stop({ graceful: false, wait: true });
console.log("[keelson] migrations applied; job queues ready");
