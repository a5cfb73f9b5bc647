// The local object store that stands in for a hosted S3 bucket in `npm start`, the tests and the
// bench: s3rver on loopback, keeping objects as files, with the one bucket the app uses created at
// start. The app talks to it through the same S3 SDK and settings as to a real bucket
// (server/storage/s3.ts); only the endpoint differs.
//
// KEELSON_S3_FAKE_PORT (default 4569), KEELSON_S3_BUCKET (default keelson-attachments);
// KEELSON_S3_FAKE_DIR (default .data/s3-fake) keeps the objects across restarts.
import { mkdirSync } from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { envOf } from "../server/env";

type S3rverOptions = {
  port: number;
  address: string;
  silent: boolean;
  directory: string;
  configureBuckets: { name: string }[];
};
type S3rverServer = { run(): Promise<unknown>; close(): Promise<void> };

// s3rver ships no types; it is CommonJS, so load it through require with the little we use typed.
const require = createRequire(import.meta.url);
const S3rver = require("s3rver") as new (options: S3rverOptions) => S3rverServer;

const config = envOf("KEELSON_S3_FAKE_PORT", "KEELSON_S3_BUCKET", "KEELSON_S3_FAKE_DIR");
const port = config.KEELSON_S3_FAKE_PORT;
const bucket = config.KEELSON_S3_BUCKET;
const directory = path.resolve(config.KEELSON_S3_FAKE_DIR);

mkdirSync(directory, { recursive: true });
const server = new S3rver({
  port,
  address: "127.0.0.1",
  silent: true,
  directory,
  // Created when the server starts (kept as it is when it exists already).
  configureBuckets: [{ name: bucket }],
});

await server.run();
console.log(`[s3-fake] S3 on http://127.0.0.1:${port}, bucket ${bucket}, objects kept in ${directory}`);

let stopping = false;
function stop() {
  if (stopping) return;
  stopping = true;
  server.close().then(
    () => process.exit(0),
    () => process.exit(0),
  );
  setTimeout(() => process.exit(0), 1000).unref();
}
process.once("SIGTERM", stop);
process.once("SIGINT", stop);
