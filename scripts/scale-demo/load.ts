// The scale demo's load: signed-in people reading the Fleet board, the overdue list, a Backlog and
// the health check through nginx, and an engineer posting the Hour log, each request with a time
// limit. A GET whose answer is cut off or is a 502/503/504 is tried once more, as the app's query
// client does (retry: 1 in app/_components/query-provider.tsx); a POST never is (it may have been
// written). A request is a failure when it ends with neither a success nor nginx's clean 502/503/504
// (a POST that was in flight on the web process that died), or with no answer within the limit.
import { performance } from "node:perf_hooks";
import { instantOfShipTime, shipClock, shipDay } from "@/server/format/hours";

export type Session = { cookie: string };
type Attempt = { status: number | "timeout" | "no answer"; detail?: string; json?: unknown };
export type Outcome = Attempt & { route: string; ms: number; retriedAfter?: string };

/** Longer than any page of the demo takes; a request still waiting after it counts as a hang. */
export const REQUEST_LIMIT_MS = 15_000;
const RETRYABLE = new Set([502, 503, 504]);
const succeeded = (a: Attempt) => typeof a.status === "number" && a.status >= 200 && a.status < 300;
const retryable = (a: Attempt) => typeof a.status === "number" && RETRYABLE.has(a.status);
const describe = (a: Attempt) => `${a.status}${a.detail ? ` (${a.detail})` : ""}`;

export class LoadClient {
  readonly outcomes: Outcome[] = [];
  constructor(readonly baseUrl: string) {}

  async signIn(email: string, password: string): Promise<Session> {
    const res = await fetch(`${this.baseUrl}/api/auth/sign-in/email`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: this.baseUrl },
      body: JSON.stringify({ email, password }),
    });
    if (!res.ok) throw new Error(`sign-in of ${email} through nginx: ${res.status} ${await res.text()}`);
    return { cookie: res.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ") };
  }

  private async attempt(session: Session | null, method: string, path: string, body?: unknown): Promise<Attempt> {
    try {
      const res = await fetch(`${this.baseUrl}${path}`, {
        method,
        headers: {
          origin: this.baseUrl,
          ...(session ? { cookie: session.cookie } : {}),
          ...(body === undefined ? {} : { "content-type": "application/json" }),
        },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(REQUEST_LIMIT_MS),
      });
      // The whole body is read: a response cut off half-way (its web process killed) is no answer.
      const text = await res.text();
      return { status: res.status, json: res.ok && text ? JSON.parse(text) : undefined };
    } catch (error) {
      const detail =
        error instanceof Error ? `${error.message}${error.cause instanceof Error ? `: ${error.cause.message}` : ""}` : String(error);
      return { status: error instanceof Error && error.name === "TimeoutError" ? "timeout" : "no answer", detail };
    }
  }

  /** One request, tallied under `route`; the body when it succeeded. */
  async call(route: string, session: Session | null, method: string, path: string, body?: unknown): Promise<unknown> {
    const started = performance.now();
    const first = await this.attempt(session, method, path, body);
    let outcome: Outcome = { ...first, route, ms: 0 };
    if (method === "GET" && !succeeded(first) && (first.status === "no answer" || retryable(first)))
      outcome = { ...(await this.attempt(session, method, path)), route, ms: 0, retriedAfter: describe(first) };
    outcome.ms = performance.now() - started;
    this.outcomes.push(outcome);
    return outcome.json;
  }
}

/** What the failures and the retries were, e.g. "overdue list: retried after no answer (terminated: other side closed) ×1". */
export function failures(outcomes: Outcome[]): string[] {
  const counted = new Map<string, number>();
  const count = (key: string) => counted.set(key, (counted.get(key) ?? 0) + 1);
  for (const o of outcomes) {
    if (o.retriedAfter) count(`${o.route}: retried after ${o.retriedAfter}, then ${describe(o)}`);
    else if (!succeeded(o) && !retryable(o)) count(`${o.route}: failed, ${describe(o)}`);
  }
  return [...counted].map(([key, n]) => `${key} ×${n}`);
}

export type RouteTally = {
  route: string;
  requests: number;
  ok: number;
  retried: number;
  retryable: number;
  failed: number;
  p50: number;
  p95: number;
  max: number;
};

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? 0;

export function tally(outcomes: Outcome[]): RouteTally[] {
  const routes = [...new Set(outcomes.map((o) => o.route))];
  return routes.map((route) => {
    const mine = outcomes.filter((o) => o.route === route);
    const ms = mine.map((o) => o.ms).sort((a, b) => a - b);
    const ok = mine.filter(succeeded).length;
    const clean = mine.filter(retryable).length;
    return {
      route,
      requests: mine.length,
      ok,
      retried: mine.filter((o) => o.retriedAfter).length,
      retryable: clean,
      failed: mine.length - ok - clean,
      p50: Math.round(percentile(ms, 0.5)),
      p95: Math.round(percentile(ms, 0.95)),
      max: Math.round(ms.at(-1) ?? 0),
    };
  });
}

/** Readers until `until`: each loop goes round the read routes, as several office screens would. */
export async function readLoop(
  client: LoadClient,
  until: () => boolean,
  reads: { route: string; session: Session | null; path: string }[],
  offset: number,
): Promise<void> {
  for (let i = offset; !until(); i++) {
    const r = reads[i % reads.length]!;
    await client.call(r.route, r.session, "GET", r.path);
  }
}

type HourLog = { vessel: { timeZone: string }; counters: { id: string; last: { readAt: string; meterValue: number } | null }[] };

/**
 * The engineer's Hour log: one batch of every counter's reading a second, each a minute after the
 * previous one and showing the same hours (the engine stopped), so every batch is valid on its own
 * and the readings route's write, job send and recompute all run.
 */
export async function readingLoop(
  client: LoadClient,
  until: () => boolean,
  engineer: Session,
  vesselId: string,
): Promise<{ posted: number; acknowledged: Date[]; unacknowledged: Date[] }> {
  const log = (await client.call("hour log", engineer, "GET", `/api/vessels/${vesselId}/hour-log`)) as HourLog | undefined;
  if (!log) throw new Error("the Hour log did not answer before the load began");
  const counters = log.counters.filter((c) => c.last);
  let at = Math.max(...counters.map((c) => Date.parse(c.last!.readAt)));
  let posted = 0;
  const acknowledged: Date[] = [];
  const unacknowledged: Date[] = [];
  while (!until()) {
    at += 60_000;
    const when = new Date(at);
    const day = shipDay(when, log.vessel.timeZone);
    const clock = shipClock(when, log.vessel.timeZone);
    // A minute the ship's clock skips (a zone's spring change) would not name this instant: skip it.
    if (instantOfShipTime(day, clock, log.vessel.timeZone).getTime() !== at) continue;
    const saved = await client.call("readings POST", engineer, "POST", `/api/vessels/${vesselId}/readings`, {
      shipDay: day,
      time: clock,
      entries: counters.map((c) => ({ counterId: c.id, value: c.last!.meterValue })),
    });
    posted++;
    (saved === undefined ? unacknowledged : acknowledged).push(when);
    await new Promise((resolve) => setTimeout(resolve, 1_000));
  }
  return { posted, acknowledged, unacknowledged };
}
