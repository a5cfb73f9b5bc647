// The one shape of a background job: its name, payload, queue policy, optional cron and a handler
// loaded only when the worker runs it. The web app imports definitions to *send* jobs (names and
// payloads); the handler's module, and what it imports (the SMTP sender, the recompute writer),
// is loaded by the worker alone.
import type PgBoss from "pg-boss";
import type { z } from "zod";
import type { Db } from "@/db/client";

export type JobContext = { db: Db };

/** Runs one job; returns the line the worker logs ("" when there is nothing to say). */
export type JobHandler<P> = (payload: P, ctx: JobContext) => Promise<string>;

/** A handler module: the handler as default export, and what to stop when the worker stops. */
export type JobHandlerModule<P> = { default: JobHandler<P>; stop?: () => void };

export type JobDefinition<S extends z.ZodType> = {
  /** The pg-boss queue name. */
  name: string;
  payload: S;
  /** pg-boss queue options: policy ("stately": one queued and one running per key), retries, expiry. */
  queue: Omit<PgBoss.Queue, "name">;
  /** How the worker polls and batches this queue. */
  work?: PgBoss.WorkOptions;
  /** A cron in UTC; the worker schedules it (with an empty payload). */
  cron?: string;
  /** The key that coalesces jobs under the "stately" or "singleton" policy (e.g. the vessel). */
  singletonKey?: (payload: z.output<S>) => string;
  handler: () => Promise<JobHandlerModule<z.output<S>>>;
};

/** What the worker needs of any job, whatever its payload: the registry's element type. */
export type WorkableJob = Pick<JobDefinition<z.ZodType>, "name" | "queue" | "work" | "cron"> & {
  /** Parses the payload and runs the handler (loading its module on first use). */
  run(data: unknown, ctx: JobContext): Promise<string>;
  /** Stops what the handler keeps running between jobs (timers), if its module was loaded. */
  stop(): Promise<void>;
};

export function defineJob<S extends z.ZodType>(definition: JobDefinition<S>): JobDefinition<S> & WorkableJob {
  let loaded: Promise<JobHandlerModule<z.output<S>>> | null = null;
  const load = () => (loaded ??= definition.handler());
  return {
    ...definition,
    async run(data, ctx) {
      const payload = definition.payload.parse(data);
      const { default: handle } = await load();
      return handle(payload, ctx);
    },
    async stop() {
      if (loaded) (await loaded).stop?.();
    },
  };
}
