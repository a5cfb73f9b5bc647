// Reads every app/api/**/route.ts at test time and says, for each exported method, which door it
// goes through and with what options, so a route added tomorrow is in the access matrix without
// anyone editing the test. What the reading cannot classify is a problem, named, never skipped.
import { randomUUID } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import type { z } from "zod";
import { can, type Permission } from "@/server/auth/roles";
import * as pathSchemas from "@/server/http/params";

const ROOT = path.resolve(import.meta.dirname, "../..");
const API_DIR = path.join(ROOT, "app/api");
const HTTP_METHODS = ["GET", "HEAD", "POST", "PUT", "PATCH", "DELETE", "OPTIONS"] as const;
export const STATE_CHANGING = new Set(["POST", "PUT", "PATCH", "DELETE"]);

/**
 * Routes outside the session door, each with what it expects. A route file that does not use
 * `withAccess` fails the matrix until it is listed here; an entry whose file is gone fails too.
 */
export const EXPLICIT_ROUTES: Record<string, { expect: "public" | "not-called"; why: string }> = {
  "app/api/auth/[...all]/route.ts": {
    expect: "not-called",
    why: "better-auth's own endpoints (sign-in, sign-out, session); tests/security covers sign-in",
  },
  "app/api/health/route.ts": { expect: "public", why: "withoutSession: the health check answers anyone" },
  "app/api/unsubscribe/route.ts": { expect: "public", why: "withToken: the link's signed token is the proof" },
};

/**
 * Allowed requests that write with an empty `{}` body, because the route takes none. They run
 * after the no-change checks, so they cannot be mistaken for a write that slipped through.
 */
export const WRITES_WITHOUT_BODY: Record<string, string> = {
  "POST /api/admin/tolerance-rules/presets": "adds back the preset rules the company lacks",
  "DELETE /api/admin/vessels/[vesselId]": "retires the vessel",
};

/** Allowed requests not sent at all, because their effect reaches past the fixture companies. */
export const NOT_SENT_WHEN_ALLOWED: Record<string, string> = {
  "DELETE /api/admin/mail/caught": "empties the SMTP fake that every test file shares",
};

export type PathId = { name: string; good: string; malformed: string };

export type RouteMethod = {
  file: string;
  method: string;
  /** `/api/vessels/[vesselId]/readings`: the pattern, filled in per target. */
  pattern: string;
  door: { kind: "session"; permission: Permission; vessel: boolean } | { kind: "public" };
  /** The path's ids other than `[vesselId]`, with a value the route's schema takes and one it refuses. */
  ids: PathId[];
  /** The 404 detail the door gives when every id in `ids` is malformed (the schema's own message). */
  malformedDetail: string | null;
};

export type Discovery = { routes: RouteMethod[]; problems: string[] };

export function discoverRoutes(): Discovery {
  const routes: RouteMethod[] = [];
  const problems: string[] = [];
  const files = routeFiles(API_DIR).map((f) => path.relative(ROOT, f));
  for (const file of files) {
    const explicit = EXPLICIT_ROUTES[file];
    if (explicit?.expect === "not-called") continue;
    const read = readRoute(file, readFileSync(path.join(ROOT, file), "utf8"));
    problems.push(...read.problems);
    for (const route of read.routes) {
      if (route.door.kind === "public" && !explicit) {
        problems.push(
          `${route.method} ${file}: a public door (withToken/withoutSession) not listed in EXPLICIT_ROUTES`,
        );
      } else if (route.door.kind === "session" && explicit) {
        problems.push(`${route.method} ${file}: listed in EXPLICIT_ROUTES as ${explicit.expect} but uses withAccess`);
      } else {
        routes.push(route);
      }
    }
  }
  for (const listed of Object.keys(EXPLICIT_ROUTES)) {
    if (!files.includes(listed)) problems.push(`EXPLICIT_ROUTES names ${listed}, which no longer exists`);
  }
  const keys = new Set(routes.map((r) => `${r.method} ${r.pattern}`));
  for (const listed of [...Object.keys(WRITES_WITHOUT_BODY), ...Object.keys(NOT_SENT_WHEN_ALLOWED)]) {
    if (!keys.has(listed)) problems.push(`the matrix's exception ${listed} names no route method`);
  }
  return { routes, problems };
}

function routeFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true })
    .flatMap((entry) => {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) return routeFiles(full);
      return entry.name === "route.ts" ? [full] : [];
    })
    .sort();
}

// `export const GET = withAccess({ ... }, handler)`: the options are a flat object literal (schema
// names, a string, a boolean), so a brace-free match reads them whole.
const DOOR_CALL = /export\s+const\s+([A-Z]+)\s*=\s*(withAccess|withToken|withoutSession)\s*\(\s*(\{[^{}]*\})?/g;
// Every way a module can export a name, to catch a method the door pattern above missed.
const ANY_EXPORT = /export\s+(?:const|let|var|async\s+function|function)\s+(?:\{([^}]*)\}|([A-Za-z_$][\w$]*))/g;

function readRoute(file: string, source: string): { routes: RouteMethod[]; problems: string[] } {
  const routes: RouteMethod[] = [];
  const problems: string[] = [];
  const pattern =
    "/" +
    path
      .dirname(file)
      .split(path.sep)
      .filter((s) => !/^\(.*\)$/.test(s))
      .slice(1)
      .join("/");
  const classified = new Set<string>();
  for (const [, method, door, options] of source.matchAll(DOOR_CALL)) {
    const where = `${method} ${file}`;
    classified.add(method!);
    if (door !== "withAccess") {
      routes.push({ file, method: method!, pattern, door: { kind: "public" }, ids: [], malformedDetail: null });
      continue;
    }
    const read = readOptions(where, pattern, options ?? "");
    if (typeof read === "string") problems.push(read);
    else routes.push({ file, method: method!, pattern, ...read });
  }
  for (const [, list, single] of source.matchAll(ANY_EXPORT)) {
    const names = list
      ? list.split(",").map((n) =>
          n
            .trim()
            .split(/\s*:\s*/)
            .pop()!,
        )
      : [single!];
    for (const name of names) {
      if ((HTTP_METHODS as readonly string[]).includes(name) && !classified.has(name)) {
        problems.push(
          `${name} ${file}: exported without a door the matrix can read (withAccess, withToken, withoutSession)`,
        );
      }
    }
  }
  if (classified.size === 0 && !problems.some((p) => p.endsWith(file))) {
    problems.push(`${file}: exports no method the matrix can read`);
  }
  return { routes, problems };
}

type Options = Pick<RouteMethod, "door" | "ids" | "malformedDetail">;

function readOptions(where: string, pattern: string, options: string): Options | string {
  const permission = /permission:\s*"([^"]+)"/.exec(options)?.[1];
  if (!permission || !isPermission(permission))
    return `${where}: no permission the matrix knows (${permission ?? "none"})`;
  const vessel = /vessel:\s*true/.test(options);
  const segments = [...pattern.matchAll(/\[([^\]]+)\]/g)].map((m) => m[1]!);
  if (vessel !== segments.includes("vesselId")) {
    return `${where}: vessel: ${vessel} but the path ${segments.includes("vesselId") ? "has" : "has no"} [vesselId]`;
  }
  const inner = segments.filter((s) => s !== "vesselId");
  const schemaName = /params:\s*([A-Za-z_$][\w$]*)/.exec(options)?.[1];
  if (!schemaName) {
    if (inner.length) return `${where}: path ids ${inner.join(", ")} but no params schema`;
    return { door: { kind: "session", permission, vessel }, ids: [], malformedDetail: null };
  }
  const schema = pathSchemaNamed(schemaName);
  if (!schema) return `${where}: params ${schemaName} is not an object schema of server/http/params.ts`;
  const keys = Object.keys(schema.shape).sort();
  if (keys.join(",") !== [...inner].sort().join(",")) {
    return `${where}: params ${schemaName} reads ${keys.join(", ")} but the path has ${inner.join(", ") || "no ids"}`;
  }
  const ids: PathId[] = [];
  for (const name of inner) {
    const good = randomUUID();
    // "not-a-uuid" is a well-formed better-auth user id, so that schema gets a character it refuses.
    const malformed = ["not-a-uuid", "not~a~uuid"].find((value) => !schema.shape[name]!.safeParse(value).success);
    if (!schema.shape[name]!.safeParse(good).success || !malformed) {
      return `${where}: the matrix has no good and malformed value for [${name}] under ${schemaName}`;
    }
    ids.push({ name, good, malformed });
  }
  const refused = schema.safeParse(Object.fromEntries(ids.map((id) => [id.name, id.malformed])));
  const malformedDetail = refused.success ? null : (refused.error.issues[0]?.message ?? null);
  return { door: { kind: "session", permission, vessel }, ids, malformedDetail };
}

function isPermission(name: string): name is Permission {
  try {
    can("admin", name as Permission);
    return true;
  } catch {
    return false; // roles.ts has no grant list for it
  }
}

type ObjectSchema = z.ZodObject<Record<string, z.ZodType>>;

function pathSchemaNamed(name: string): ObjectSchema | null {
  const found: unknown = (pathSchemas as Record<string, unknown>)[name];
  const shape = found && typeof found === "object" && "shape" in found ? found.shape : null;
  return shape && typeof shape === "object" ? (found as ObjectSchema) : null;
}
