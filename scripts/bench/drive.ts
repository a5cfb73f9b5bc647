// One route driven by autocannon from this process (a second process beside `next start`, over
// loopback): every answer's latency is kept, so the percentiles are exact (autocannon's own
// summary has no p95), and every answer with another status than the expected one is counted.
import autocannon from "autocannon";
import { BASE_URL } from "@/tests/support/http";

export type Drive = {
  path: string;
  method?: "GET" | "POST";
  headers?: Record<string, string>;
  /** A new body for each request, for writes the domain must accept every time. */
  body?: () => string;
  connections: number;
  /** Run for this long; requests still in flight at the end are dropped by the client only. */
  seconds?: number;
  /** Or send exactly this many requests and wait for every answer (no work left on the server). */
  amount?: number;
  expect: number;
};

export type LoadFigures = {
  requests: number;
  requestsPerSecond: number;
  p50: number;
  p95: number;
  p99: number;
  /** Answers with another status than expected. */
  unexpected: number;
  /** Connection errors and timeouts. */
  errors: number;
  /** The status and body of the first unexpected answer, to say what went wrong. */
  firstUnexpected?: string;
};

export function drive(d: Drive): Promise<LoadFigures> {
  const latencies: number[] = [];
  let unexpected = 0;
  let firstUnexpected: string | undefined;
  const nextBody = d.body;
  return new Promise((resolve, reject) => {
    const instance = autocannon(
      {
        url: `${BASE_URL}${d.path}`,
        method: d.method ?? "GET",
        connections: d.connections,
        ...(d.amount ? { amount: d.amount } : { duration: d.seconds ?? 10 }),
        // The overdue list takes seconds at this load; autocannon's 10 s default would cut it off.
        timeout: 60,
        headers: d.headers,
        // Only writes keep the bodies (to say why one was refused): reading a megabyte of JSON
        // per answer would load the client on the cores the server needs.
        requests: nextBody
          ? [
              {
                setupRequest: (request) => ({ ...request, body: nextBody() }),
                onResponse: (status, body) => {
                  if (status !== d.expect) firstUnexpected ??= `${status} ${body.slice(0, 500)}`;
                },
              },
            ]
          : undefined,
      },
      (error, result) => {
        if (error) return reject(error);
        latencies.sort((a, b) => a - b);
        const at = (q: number) =>
          round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? NaN);
        resolve({
          requests: latencies.length,
          requestsPerSecond: round(latencies.length / result.duration),
          p50: at(0.5),
          p95: at(0.95),
          p99: at(0.99),
          unexpected,
          firstUnexpected,
          errors: result.errors,
        });
      },
    );
    instance.on("response", (_client, status, _bytes, ms) => {
      latencies.push(ms);
      if (status !== d.expect) unexpected++;
    });
  });
}

const round = (x: number) => Math.round(x * 10) / 10;
