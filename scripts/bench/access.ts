// The access door under load: `GET /api/account/me`, a route that does nothing but resolve the
// signed-in user (session, membership, assignments), driven by autocannon over loopback, beside
// the same route without a cookie (answered 401 before any query: the HTTP and Next.js floor).
import { writeFileSync } from "node:fs";
import autocannon from "autocannon";
import { closeTestDb, createCompany, PASSWORD } from "@/tests/support/fixtures";
import { BASE_URL, signIn } from "@/tests/support/http";

const SECONDS = 10;
const CONNECTIONS = 10;

type Load = { requestsPerSecond: number; p50: number; p99: number; non2xx: number; errors: number };

async function load(headers: Record<string, string>, seconds: number): Promise<Load> {
  const result = await autocannon({
    url: `${BASE_URL}/api/account/me`,
    connections: CONNECTIONS,
    duration: seconds,
    headers,
  });
  return {
    requestsPerSecond: Math.round(result.requests.average),
    p50: result.latency.p50,
    p99: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors,
  };
}

const f = await createCompany("bench-access");
// The engineer is assigned to one vessel: every part of the access is read.
const session = await signIn(f.users.engineer.email, PASSWORD);
await closeTestDb();

await load({ cookie: session.cookie }, 2); // warm-up: compiled routes, pool connections
const floor = await load({}, SECONDS);
const signedIn = await load({ cookie: session.cookie }, SECONDS);
if (signedIn.non2xx > 0 || signedIn.errors > 0) throw new Error(`signed-in load failed: ${JSON.stringify(signedIn)}`);

const line = (what: string, l: Load) => `| ${what} | ${l.requestsPerSecond} | ${l.p50} / ${l.p99} |`;
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
