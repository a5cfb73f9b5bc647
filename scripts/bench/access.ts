// The access door under load: `GET /api/account/me`, a route that does nothing but resolve the
// signed-in user (session, membership, assignments), driven by autocannon over loopback, beside
// the same route without a cookie (answered 401 before any query: the HTTP and Next.js floor).
import { writeFileSync } from "node:fs";
import { closeTestDb, createCompany, PASSWORD } from "@/tests/support/fixtures";
import { signIn } from "@/tests/support/http";
import { drive, type LoadFigures } from "./drive";

const SECONDS = 10;
const CONNECTIONS = 10;

const load = (headers: Record<string, string>, seconds: number, expect: number) =>
  drive({ path: "/api/account/me", headers, connections: CONNECTIONS, seconds, expect });

const f = await createCompany("bench-access");
// The engineer is assigned to one vessel: every part of the access is read.
const session = await signIn(f.users.engineer.email, PASSWORD);
await closeTestDb();

await load({ cookie: session.cookie }, 2, 200); // warm-up: compiled routes, pool connections
const floor = await load({}, SECONDS, 401);
const signedIn = await load({ cookie: session.cookie }, SECONDS, 200);
if (signedIn.unexpected > 0 || signedIn.errors > 0) throw new Error(`signed-in load failed: ${JSON.stringify(signedIn)}`);

const line = (what: string, l: LoadFigures) => `| ${what} | ${l.requestsPerSecond} | ${l.p50} / ${l.p99} |`;
const md = [
  `| what (${CONNECTIONS} connections, ${SECONDS} s each) | requests/s | latency p50 / p99 (ms) |`,
  "| --- | --- | --- |",
  line("GET /api/account/me without a cookie (401: the floor)", floor),
  line("GET /api/account/me signed in (access resolved)", signedIn),
  "",
  `Signed-in throughput is ${(signedIn.requestsPerSecond / floor.requestsPerSecond).toFixed(2)}× the floor's.`,
].join("\n");
writeFileSync("bench-output/access.md", md + "\n");
writeFileSync("bench-output/access.json", JSON.stringify({ floor, signedIn }, null, 2));
console.log(md);
