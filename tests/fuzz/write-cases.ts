// The hostile and careless inputs of the fuzz test, as fast-check arbitraries: raw JSON text (so
// -0, 1e308, 10,000 levels of nesting and malformed text reach the server as typed, which
// JSON.stringify would not allow) and a query string. Each case says which field it broke, when
// it broke one, so the answer can be checked for naming it.
import fc from "fast-check";

export type FuzzCase = {
  kind: string;
  /** The body exactly as sent (always declared as JSON); undefined sends none. */
  text: string | undefined;
  query: Record<string, string>;
  /** The field the case changed in a valid example, e.g. ["entries", "0", "value"]. */
  mutated?: string[];
};

// A placeholder string replaced by raw JSON text after JSON.stringify.
const RAW = "@@raw@@";
const raw = (text: string) => `${RAW}${text}${RAW}`;
const unraw = (json: string) =>
  !json.includes(RAW)
    ? json
    : json.replace(new RegExp(`"${RAW}(.*?)${RAW}"`, "gs"), (_, text: string) => text.replace(/\\"/g, '"'));

export const ONE_MB = "x".repeat(1024 * 1024);
/** Under the door's 256 kB body limit, so it reaches the contract: a key or value echoed must be cut short. */
const LONG = "k".repeat(200_000);

export const nested = (levels: number, shape: "array" | "object") =>
  shape === "array" ? "[".repeat(levels) + "]".repeat(levels) : '{"a":'.repeat(levels) + "1" + "}".repeat(levels);

export const BAD_DATES = ["0000-00-00", "275760-09-13", "9999-12-31"];

/** Values that no careful client sends, each legal JSON once placed in a body. */
const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom<unknown>(
    null,
    true,
    0,
    "",
    "   ",
    [],
    {},
    [null],
    ...BAD_DATES,
    "+275760-09-13",
    "2026-02-30",
    "1900-01-01",
    "not-a-uuid",
    "00000000-0000-0000-0000-000000000000",
    "6f1c2a3b-0000-4000-8000-00000000000g",
    "\u0000",
    "a\u0000b",
    "\u0007\u001b[2J\u0008",
    "\ud800",
    "\u202eevil",
    "' OR 1=1 --",
    "<script>alert(1)</script>",
    "NaN",
    "2147483648",
    "12,431.5",
    "24:00",
    "__proto__",
    LONG,
  ),
  fc
    .constantFrom(
      "-0",
      "1e308",
      "-1e308",
      "1e309",
      "5e-324",
      "123456789012345678901234567890",
      "-1",
      "24.05",
      "99999.95",
      // Past what an integer or numeric(12,1) column holds, where a contract forgot its bound.
      "2147483648",
      "-2147483649",
      "1e15",
    )
    .map(raw),
  fc.constantFrom(1_000, 10_000).map((n) => raw(nested(n, "array"))),
  fc.string({ unit: "binary", maxLength: 30 }),
  fc.integer(),
  fc.double({ noNaN: true }),
  fc.array(fc.oneof(fc.string({ maxLength: 5 }), fc.integer(), fc.constant(null)), { maxLength: 4 }),
  fc.constant(protoObject()),
);

/** An object whose own key is `__proto__` (an assignment would set the prototype instead). */
function protoObject(): Record<string, unknown> {
  const o: Record<string, unknown> = {};
  Object.defineProperty(o, "__proto__", { value: { admin: true, role: "admin" }, enumerable: true });
  return o;
}

const unknownKey = fc.oneof(
  fc.constantFrom("__proto__", "constructor", "prototype", "toString", "", "companyId", "id", LONG),
  fc.string({ maxLength: 12 }),
);

type Json = unknown;
type Path = string[];

/** Every place in a value: the root, each object or array, each leaf. */
function placesOf(value: Json, at: Path = []): Path[] {
  const inner =
    value && typeof value === "object" ? Object.entries(value).flatMap(([k, v]) => placesOf(v, [...at, k])) : [];
  return [at, ...inner];
}

function withAt(value: Json, at: Path, change: (old: Json) => Json | undefined): Json {
  if (!at.length) return change(value);
  const [head, ...rest] = at;
  if (Array.isArray(value)) {
    const copy: unknown[] = [...value];
    const next = withAt(copy[Number(head)], rest, change);
    if (next === undefined) copy.splice(Number(head), 1);
    else copy[Number(head)] = next;
    return copy;
  }
  const copy: Record<string, unknown> = { ...(value as Record<string, unknown>) };
  const next = withAt(copy[head!], rest, change);
  if (next === undefined) delete copy[head!];
  else copy[head!] = next;
  return copy;
}

function withKey(container: Json, key: string, value: Json): Json {
  const copy: Record<string, unknown> = { ...(container as Record<string, unknown>) };
  Object.defineProperty(copy, key, { value, enumerable: true, configurable: true, writable: true });
  return copy;
}

const bodyCase = (kind: string, body: Json, query: Record<string, string>, mutated?: Path): FuzzCase => ({
  kind,
  text: unraw(JSON.stringify(body)),
  query,
  ...(mutated ? { mutated } : {}),
});

/** A valid example changed in one place: a value replaced or removed, or an unknown key added. */
function mutationOf(example: Json, query: Record<string, string>): fc.Arbitrary<FuzzCase> {
  const places = placesOf(example);
  const objects = places.filter((p) => {
    const v = p.reduce<Json>((o, k) => (o as Record<string, unknown>)[k], example);
    return v !== null && typeof v === "object" && !Array.isArray(v);
  });
  const replaced = fc.tuple(fc.constantFrom(...places), hostileValue).map(([at, value]) =>
    bodyCase(
      "replaced",
      withAt(example, at, () => value),
      query,
      at,
    ),
  );
  const leaves = places.filter((p) => p.length);
  const removed = leaves.length
    ? [
        fc.constantFrom(...leaves).map((at) =>
          bodyCase(
            "removed",
            withAt(example, at, () => undefined),
            query,
            at,
          ),
        ),
      ]
    : [];
  const added = fc.tuple(fc.constantFrom(...objects), unknownKey, hostileValue).map(([at, key, value]) =>
    bodyCase(
      "unknown key",
      withAt(example, at, (o) => withKey(o, key, value)),
      query,
      [...at, key],
    ),
  );
  const arbitraries = [replaced, added, ...removed];
  return fc.oneof(...arbitraries);
}

const malformedText = fc.oneof(
  fc.constantFrom(
    "{",
    '{"a":',
    "[1,2",
    "{'a':1}",
    '{"a":1,}',
    "nul",
    "tru",
    '{"a":01}',
    '"open',
    '{"a" 1}',
    "{}x",
    "",
    "  \n",
  ),
  fc.string({ maxLength: 20 }).filter((s) => !parses(s)),
);

function parses(text: string): boolean {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
}

/** A query of ids and values no form sends; an example's own query is kept and sometimes broken. */
function queryOf(example: Record<string, string>): fc.Arbitrary<Record<string, string>> {
  const value = fc.oneof(
    fc.constantFrom("not-a-uuid", "\u0000", "%00", "-0", "1e308", ...BAD_DATES, "x".repeat(2000), "true", ""),
    fc.string({ maxLength: 12 }),
  );
  const keys = fc.oneof(
    fc.constantFrom("id", "vesselId", "counterId", "__proto__", "constructor", ...Object.keys(example)),
    fc.string({ maxLength: 8 }),
  );
  return fc.dictionary(keys, value, { maxKeys: 3 }).map((extra) => ({ ...example, ...extra }));
}

export function casesFor(example: { body?: Json; query?: Record<string, string> }): fc.Arbitrary<FuzzCase> {
  const body = example.body ?? {};
  const baseQuery = example.query ?? {};
  return queryOf(baseQuery).chain((query) =>
    fc.oneof(
      { weight: 5, arbitrary: mutationOf(body, query) },
      { weight: 1, arbitrary: malformedText.map((text): FuzzCase => ({ kind: "malformed JSON", text, query })) },
      {
        weight: 1,
        arbitrary: fc
          .constantFrom<Json>(null, 0, "text", true, [], [body], [[body]])
          .map((whole) => bodyCase("wrong type for the body", whole, query)),
      },
      // Built only when drawn: a megabyte per run adds up.
      {
        weight: 1,
        arbitrary: fc.constant("note").map((key) => bodyCase("1 MB string", withKey(body, key, ONE_MB), query)),
      },
    ),
  );
}

/** The cases every route gets whatever the seed: the list, each once. */
export function namedCases(example: { body?: Json; query?: Record<string, string> }): FuzzCase[] {
  const body = example.body ?? {};
  const query = example.query ?? {};
  const leaves = placesOf(body).filter((p) => p.length);
  const first =
    leaves.find((p) =>
      /^\d{4}-\d\d-\d\d/.test(String(p.reduce<Json>((o, k) => (o as Record<string, unknown>)[k], body))),
    ) ?? leaves[0];
  const at = (value: Json, kind: string): FuzzCase[] =>
    first
      ? [
          bodyCase(
            kind,
            withAt(body, first, () => value),
            query,
            first,
          ),
        ]
      : [];
  return [
    { kind: "malformed JSON", text: '{"a":', query },
    { kind: "no body", text: undefined, query },
    bodyCase("null body", null, query),
    bodyCase("array for the object", [body], query),
    bodyCase("1 MB string", withKey(body, "note", ONE_MB), query),
    bodyCase("200 kB unknown key", withKey(body, LONG, 1), query, [LONG]),
    { kind: "10,000 levels of arrays", text: nested(10_000, "array"), query },
    { kind: "10,000 levels of objects", text: nested(10_000, "object"), query },
    bodyCase("__proto__ key", withKey(body, "__proto__", { admin: true }), query, ["__proto__"]),
    bodyCase("constructor key", withKey(body, "constructor", { prototype: { admin: true } }), query, ["constructor"]),
    ...at(raw("1e308"), "1e308"),
    ...at(raw("-0"), "-0"),
    ...BAD_DATES.flatMap((day) => at(day, `date ${day}`)),
    ...at("a\u0000b", "NUL in a field"),
    ...at("\u0007\u001b[2J", "control characters"),
    ...at("not-a-uuid", "non-uuid id in the body"),
    bodyCase("non-uuid ids in the query", body, { ...query, id: "not-a-uuid", vesselId: "x\u0000y" }),
  ];
}
