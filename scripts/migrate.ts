// Applies the committed drizzle-kit migrations in ./drizzle to DATABASE_URL.
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { closeDb, getDb } from "../db/client";

await migrate(getDb(), { migrationsFolder: "./drizzle" });
await closeDb();
console.log("[keelson] migrations applied");
