// Who is acting, for the audit trail. A route handler runs its work `actingAs` the signed-in person
// (server/http/with-access.ts), the worker each job as `system:worker <job>`, the demo set-up as
// `system:demo set-up`. db/client.ts stamps the actor on a connection when it is taken from the pool
// (`keelson.actor`, `keelson.company`), and the trigger `keelson_audit` reads it — so no write can
// forget to say who made it. Kept in db/ because the pool needs it and db/ imports no domain code.
import { AsyncLocalStorage } from "node:async_hooks";

export type Actor = { actor: string; companyId: string | null };

// One store per process, kept on globalThis like the pool (db/client.ts): Next bundles each route
// apart, and the pool made by one route's copy of this module must read the actor another route's
// copy set.
const globalForActor = globalThis as unknown as { keelsonActorStore?: AsyncLocalStorage<Actor> };
const store = (globalForActor.keelsonActorStore ??= new AsyncLocalStorage<Actor>());

export function personActor(userId: string, companyId: string): Actor {
  return { actor: `user:${userId}`, companyId };
}

export function systemActor(what: string, companyId: string | null = null): Actor {
  return { actor: `system:${what}`, companyId };
}

/** Runs `work` with every connection it takes from the pool stamped with `actor`. */
export function actingAs<T>(actor: Actor, work: () => T): T {
  return store.run(actor, work);
}

export function currentActor(): Actor | undefined {
  return store.getStore();
}

/** The value a connection's settings are compared with, so a connection is stamped only on a change. */
export function actorStamp(actor: Actor | undefined): string {
  return `${actor?.actor ?? ""}|${actor?.companyId ?? ""}`;
}
