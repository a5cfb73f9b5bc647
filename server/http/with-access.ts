import "server-only";
import type { z } from "zod";
import { actingAs, personActor } from "@/db/actor";
import type { Access, VesselRef } from "@/server/auth/access";
import { TRUSTED_ORIGINS } from "@/server/auth/auth";
import { resolveAccess } from "@/server/auth/resolve-access";
import { can, type Permission } from "@/server/auth/roles";
import { formatShipDate } from "@/server/format/hours";
import { readBoundedBody } from "./bounded-body";
import { isUuid } from "./ids";
import { AppError, fieldErrorsFromZod, invalidInput, problemResponse } from "./problem";

type Schema = z.ZodType;
type Parsed<S> = S extends z.ZodType ? z.output<S> : undefined;

type Options<V extends boolean, P, B, Q> = {
  /** What the signed-in user's role must allow. */
  permission: Permission;
  /** Whether the route has a `[vesselId]` segment the user must be allowed to open. */
  vessel?: V;
  /** The route's other path ids (`server/http/params.ts`); a malformed one is 404. */
  params?: P;
  body?: B;
  query?: Q;
};

export type HandlerContext<V extends boolean, P, B, Q> = {
  request: Request;
  access: Access;
  params: P extends z.ZodType ? z.output<P> : Record<string, never>;
  body: Parsed<B>;
  query: Parsed<Q>;
} & (V extends true ? { vessel: VesselRef } : unknown);

type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

/**
 * The one access door for route handlers: resolves the signed-in user, their company and role and
 * the vessel of the route in one query (another company's or an unassigned vessel is 404), parses
 * the path's ids (a malformed one is 404), checks the role's permission, and parses query and
 * body with the zod contract before the handler runs.
 */
export function withAccess<
  V extends boolean = false,
  P extends Schema | undefined = undefined,
  B extends Schema | undefined = undefined,
  Q extends Schema | undefined = undefined,
>(options: Options<V, P, B, Q>, handler: (ctx: HandlerContext<V, P, B, Q>) => Promise<unknown>) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      refuseForeignOrigin(request);
      const path = await pathParams(context);
      const vesselId = options.vessel && isUuid(path.vesselId ?? "") ? path.vesselId! : null;
      const resolved = await resolveAccess(request.headers, vesselId);
      if (!resolved) throw new AppError("unauthenticated", "Sign in to continue.");
      const { access, vessel } = resolved;
      if (options.vessel && !vessel) throw new AppError("not-found", "No such vessel.");
      if (!can(access.role, options.permission)) {
        throw new AppError("forbidden", "Your role does not allow this action.");
      }
      const params = options.params ? parsePath(options.params, path) : {};
      if (vessel?.retiredAt && changesVessel(request, options.permission)) {
        throw new AppError(
          "conflict",
          `${vessel.name} was retired on ${formatShipDate(vessel.retiredAt, vessel.timeZone)}: its records can be read, not changed. An administrator can return it to service.`,
        );
      }

      const query = options.query
        ? parseWith(options.query, Object.fromEntries(new URL(request.url).searchParams), "query")
        : undefined;
      const body = options.body ? parseWith(options.body, await readJson(request), "") : undefined;

      const ctx = { request, access, vessel, params, body, query } as HandlerContext<V, P, B, Q>;
      // Every connection the handler takes carries the person for the audit trail (db/actor.ts).
      const result = await actingAs(personActor(access.user.id, access.company.id), () => handler(ctx));
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return problemResponse(error);
    }
  };
}

async function pathParams(context: RouteContext): Promise<Record<string, string>> {
  return Object.fromEntries(Object.entries((await context.params) ?? {}).map(([k, v]) => [k, String(v)]));
}

/** Path ids that do not parse are "not found", never a 422: an id is not something to correct. */
function parsePath(schema: Schema, path: Record<string, string>): unknown {
  const result = schema.safeParse(path);
  if (!result.success) throw new AppError("not-found", result.error.issues[0]?.message ?? "Not found.");
  return result.data;
}

/**
 * A request that would change a vessel's records. Only the administrator's own vessel routes
 * (`company:manage`: return to service, edit the register of a vessel being laid up) still write.
 */
function changesVessel(request: Request, permission: Permission): boolean {
  return !["GET", "HEAD", "OPTIONS"].includes(request.method) && permission !== "company:manage";
}

/**
 * Fields holding a NUL character, which PostgreSQL cannot store in text (it would be a 500 at the
 * first query): refused here for every contract at once. The walk is bounded like the body is.
 */
function fieldsWithNul(input: unknown, path: string[] = [], found: string[] = [], depth = 0): string[] {
  if (found.length >= 10 || depth > 32) return found;
  if (typeof input === "string") {
    if (input.includes("\u0000")) found.push(path.join(".") || "(body)");
  } else if (input && typeof input === "object") {
    for (const [key, value] of Object.entries(input)) fieldsWithNul(value, [...path, key.slice(0, 60)], found, depth + 1);
  }
  return found;
}

function parseWith(schema: Schema, input: unknown, prefix: string): unknown {
  const nul = fieldsWithNul(input, prefix ? [prefix] : []);
  if (nul.length) {
    throw invalidInput(nul.map((field) => ({ field, message: "Remove the invisible NUL character: it cannot be stored." })));
  }
  const result = schema.safeParse(input);
  if (!result.success) throw invalidInput(fieldErrorsFromZod(result.error, prefix));
  return result.data;
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * A state-changing request must come from Keelson's own pages: browsers send `Origin` on every
 * such request, so a foreign, `null` or missing one is a cross-site attempt (or a script that
 * should send it, as the tests do), refused before the session is even read.
 */
function refuseForeignOrigin(request: Request): void {
  if (SAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get("origin");
  if (origin && TRUSTED_ORIGINS.includes(origin) && request.headers.get("sec-fetch-site") !== "cross-site") return;
  throw new AppError("forbidden", "This request did not come from Keelson’s own pages, so it was refused.");
}

/** JSON bodies are small (a day's readings for 100 counters is about 10 kB); anything far larger is refused unread. */
export const MAX_JSON_BYTES = 256 * 1024;

async function readJson(request: Request): Promise<unknown> {
  // Only a body declared as JSON is parsed as JSON: a form or text/plain post from another site
  // cannot smuggle one in.
  const type = request.headers.get("content-type") ?? "";
  if (!/^application\/([\w.+-]+\+)?json\s*(;|$)/i.test(type)) {
    throw new AppError("unsupported-media-type", "Send the body as JSON, with Content-Type: application/json.");
  }
  const text = await readBounded(request, MAX_JSON_BYTES);
  if (!text.trim()) throw invalidInput([{ field: "(body)", message: "The request has no body." }]);
  try {
    return JSON.parse(text);
  } catch {
    throw invalidInput([{ field: "(body)", message: "The request body is not valid JSON." }]);
  }
}

type TokenOptions<B, Q> = { body?: B; query?: Q };

export type TokenContext<B, Q> = {
  request: Request;
  params: Record<string, string>;
  body: Parsed<B>;
  query: Parsed<Q>;
};

/**
 * The second door, for the few public routes whose request carries its own proof — a signed
 * token from a link in an e-mail — instead of a session. It reads no session; it parses query and
 * body with the zod contract (422 problem+json, as `withAccess`) and turns errors into problem
 * answers. The handler must verify the token before it touches anything, and scope every query by
 * what the token names. The body may be JSON, a form (urlencoded or multipart: what a browser's
 * form and an RFC 8058 one-click client send) or empty (parsed as `{}`).
 */
export function withToken<B extends Schema | undefined = undefined, Q extends Schema | undefined = undefined>(
  options: TokenOptions<B, Q>,
  handler: (ctx: TokenContext<B, Q>) => Promise<unknown>,
) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      const params = await pathParams(context);
      const query = options.query
        ? parseWith(options.query, Object.fromEntries(new URL(request.url).searchParams), "query")
        : undefined;
      const body = options.body ? parseWith(options.body, await readAnyBody(request), "") : undefined;
      const result = await handler({ request, params, body: body as Parsed<B>, query: query as Parsed<Q> });
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return problemResponse(error);
    }
  };
}

async function readAnyBody(request: Request): Promise<unknown> {
  const type = request.headers.get("content-type") ?? "";
  if (type.startsWith("application/x-www-form-urlencoded") || type.startsWith("multipart/form-data")) {
    if (Number(request.headers.get("content-length") ?? 0) > MAX_JSON_BYTES) {
      throw new AppError("too-large", "The request body is too large.");
    }
    try {
      const form = await request.formData();
      return Object.fromEntries([...form.entries()].map(([k, v]) => [k, typeof v === "string" ? v : v.name]));
    } catch {
      throw invalidInput([{ field: "(body)", message: "The request body is not a readable form." }]);
    }
  }
  const text = await readBounded(request, MAX_JSON_BYTES);
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw invalidInput([{ field: "(body)", message: "The request body is not valid JSON." }]);
  }
}

/** The body as text, refused (413) as soon as it passes `limit` bytes: never read whole first. */
async function readBounded(request: Request, limit: number): Promise<string> {
  const tooLarge = () => new AppError("too-large", `The request body is larger than ${Math.round(limit / 1024)} kB.`);
  if (Number(request.headers.get("content-length") ?? 0) > limit) throw tooLarge();
  return new TextDecoder().decode(await readBoundedBody(request, limit, tooLarge));
}

/**
 * The third door, for the one route that answers anyone and reveals nothing: the health check a
 * load balancer or a watchdog polls. No session, no body, no query; errors leave as problem+json.
 */
export function withoutSession(handler: () => Promise<unknown>) {
  return async (): Promise<Response> => {
    try {
      const result = await handler();
      return result instanceof Response ? result : Response.json(result);
    } catch (error) {
      return problemResponse(error);
    }
  };
}
