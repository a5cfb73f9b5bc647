// What the fuzz test needs to know about each write route beyond what the access matrix reads:
// the zod contract its door parses the body and query with (read from the route file and
// imported, so the test decides "valid" exactly as the door does), and one valid example of its
// input. A route whose door names a body or query schema and has no example here fails the test.
import { readFileSync } from "node:fs";
import path from "node:path";
import type { z } from "zod";
import type { RouteMethod } from "../access/matrix-routes";

const ROOT = path.resolve(import.meta.dirname, "../..");

export type Contract = {
  /** The names in the door's options (`body: ReadingBatchInput`), whether or not they could be imported. */
  bodyName: string | null;
  queryName: string | null;
  /** The schemas themselves; null when the route defines them locally without exporting them. */
  body: z.ZodType | null;
  query: z.ZodType | null;
};

/** The door's options of one method: `export const POST = withAccess({ ... }, ...)`. */
function doorOptions(source: string, method: string): string {
  const call = new RegExp(`export\\s+const\\s+${method}\\s*=\\s*(?:withAccess|withToken)\\s*\\(\\s*(\\{[^{}]*\\})?`);
  return call.exec(source)?.[1] ?? "";
}

export async function contractOf(route: RouteMethod): Promise<Contract> {
  const source = readFileSync(path.join(ROOT, route.file), "utf8");
  const options = doorOptions(source, route.method);
  const bodyName = /\bbody:\s*([A-Za-z_$][\w$]*)/.exec(options)?.[1] ?? null;
  const queryName = /\bquery:\s*([A-Za-z_$][\w$]*)/.exec(options)?.[1] ?? null;
  return {
    bodyName,
    queryName,
    body: bodyName ? await importedSchema(source, bodyName) : null,
    query: queryName ? await importedSchema(source, queryName) : null,
  };
}

/** The schema `name` as the route file imports it from `@/…`; null for one the file defines itself. */
async function importedSchema(source: string, name: string): Promise<z.ZodType | null> {
  for (const [, names, from] of source.matchAll(/import\s*\{([^}]*)\}\s*from\s*"(@\/[^"]+)"/g)) {
    const imported = names!.split(",").map((n) => n.trim().replace(/^type\s+/, ""));
    if (!imported.includes(name)) continue;
    const exports: Record<string, unknown> = await import(path.join(ROOT, from!.slice(2)));
    const schema = exports[name];
    return schema && typeof schema === "object" && "safeParse" in schema ? (schema as z.ZodType) : null;
  }
  return null;
}

/** Real ids of the fuzz company and the days an example needs, in vessel A's ship's time. */
export type ExampleContext = {
  companyId: string;
  userId: string;
  componentId: string;
  counterId: string;
  /** The day and clock an hour ago on board (a reading or completion then is not in the future). */
  shipDay: string;
  time: string;
  /** Ten and twelve days ahead: inside the planning range. */
  plannedDay: string;
  laterDay: string;
  tag: string;
};

export type Example = { body?: unknown; query?: Record<string, string> };

const completion = (c: ExampleContext) => ({
  doneOn: c.shipDay,
  time: c.time,
  // The routine counts the main engine's hours, whose fixture reading is 1,000 h.
  counterHours: 1000,
  manHours: 2,
  checklist: [],
  measurements: [],
  remarks: "",
});

/** One valid input per write route that reads one, keyed like the matrix's exceptions. */
export const EXAMPLES: Record<string, (c: ExampleContext) => Example> = {
  "POST /api/admin/users": (c) => ({
    body: {
      name: "Fuzz Person",
      email: `fuzz.${c.tag}@fixture.example`,
      role: "engineer",
      initialPassword: "fuzz-password-1",
    },
  }),
  "PATCH /api/admin/users/[userId]": () => ({ body: { name: "Fuzz Viewer", rank: "Cadet" } }),
  "PATCH /api/admin/settings": () => ({ body: { chiefDecidesDeferrals: true } }),
  "PUT /api/admin/rank-names": () => ({ body: { oiler: "Wiper" } }),
  // 9074729: the check digit of the contract's own example (7·9+6·0+5·7+4·4+3·7+2·2 = 139 → 9).
  "POST /api/admin/vessels": () => ({
    body: { name: "Fuzz Carrier", imoNumber: "IMO 9074729", code: "FZ", timeZone: "UTC" },
  }),
  "PATCH /api/admin/vessels/[vesselId]": () => ({ body: { name: "Alpha Fuzzed" } }),
  "POST /api/admin/tolerance-rules": (c) => ({ body: toleranceRule(`Fuzz rule ${c.tag}`) }),
  "PATCH /api/admin/tolerance-rules/[ruleId]": () => ({ body: { name: "Fuzz rule renamed" } }),
  "PUT /api/account/mail-preferences": () => ({ body: { receive: { "due-digest": false } } }),
  // The token is forged: the route must refuse it (422 on query.t), so it never writes.
  "POST /api/unsubscribe": (c) => ({ body: {}, query: { u: c.userId, c: c.companyId, k: "due-digest", t: "forged" } }),
  // A uuid that is no vessel: the contract takes it and the copy refuses it (422), so nothing is written.
  "POST /api/vessels/[vesselId]/import/copy": (c) => ({ body: { fromVesselId: c.componentId } }),
  "POST /api/parts": (c) => ({ body: { number: `FZ-${c.tag.slice(0, 8)}`, description: "Fuzz gasket", unit: "piece", fits: [c.componentId] } }),
  "PATCH /api/parts/[partId]": () => ({ body: { description: "Fuzz gasket, renamed", minimumOnBoard: "2" } }),
  "PUT /api/vessels/[vesselId]/routines/[routineId]/parts": () => ({ body: { parts: [] } }),
  "POST /api/vessels/[vesselId]/stores/locations": (c) => ({ body: { store: `Fuzz store ${c.tag}`, rack: "1", bin: "A" } }),
  "POST /api/vessels/[vesselId]/stores/movements": (c) => ({ body: { kind: "received", partId: c.componentId, locationId: c.componentId, quantity: 2 } }),
  // A uuid that is no part: the contract takes it and the draft refuses it (422), so nothing is written.
  "POST /api/vessels/[vesselId]/requisitions": (c) => ({ body: { note: "Fuzz", lines: [{ partId: c.componentId, quantity: 1, reason: "Fuzz" }] } }),
  "PATCH /api/vessels/[vesselId]/requisitions/[requisitionId]": () => ({ body: { note: "Fuzz note" } }),
  "POST /api/vessels/[vesselId]/requisitions/[requisitionId]/state": () => ({ body: { to: "sent" } }),
  "POST /api/vessels/[vesselId]/requisitions/[requisitionId]/receipts": () => ({ body: { items: [], complete: true } }),
  "POST /api/vessels/[vesselId]/defects": (c) => ({
    body: { componentId: c.componentId, title: "Fuzz leak at the drain", foundOn: c.shipDay, time: c.time, affectsSafety: true },
  }),
  "POST /api/vessels/[vesselId]/defects/[defectId]/plan": (c) => ({ body: { targetDay: c.laterDay, rank: "motorman", manHours: "2,5" } }),
  // Tomorrow, so the fixture vessel keeps its zone while the other routes are fuzzed.
  "POST /api/vessels/[vesselId]/clock": (c) => ({
    body: {
      shipDay: new Date(Date.parse(`${c.shipDay}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10),
      time: "02:00",
      zone: "UTC-5",
      note: "Fuzz passage",
    },
  }),
  "POST /api/vessels/[vesselId]/components": (c) => ({ body: { code: `FZ.${c.tag.slice(0, 6)}`, name: "Fuzz pump" } }),
  "PATCH /api/vessels/[vesselId]/components/[componentId]": () => ({ body: { name: "Fuzz pump renamed" } }),
  "POST /api/vessels/[vesselId]/counters": (c) => ({ body: { name: `Fuzz meter ${c.tag}`, plannedHoursPerDay: 12 } }),
  "PATCH /api/vessels/[vesselId]/counters/[counterId]": () => ({ body: { plannedHoursPerDay: 20 } }),
  "POST /api/vessels/[vesselId]/counters/[counterId]/replacements": (c) => ({
    body: {
      replacedAt: { shipDay: c.shipDay, time: c.time },
      oldMeterFinal: 510,
      newMeterStart: 0,
      reason: "Meter failed",
    },
  }),
  "POST /api/vessels/[vesselId]/deferrals/[deferralId]/decision": () => ({ body: { decision: "approve", note: "" } }),
  "POST /api/vessels/[vesselId]/routines": (c) => ({
    body: {
      componentId: c.componentId,
      title: "Fuzz routine",
      team: [
        { rank: "third-engineer", count: 1 },
        { rank: "motorman", count: 2 },
      ],
      elapsedHours: 3,
      intervalHours: 2000,
      baselineAt: c.shipDay,
      baselineHours: 900,
    },
  }),
  "PATCH /api/vessels/[vesselId]/routines/[routineId]": () => ({ body: { title: "Fuzz routine renamed" } }),
  "POST /api/vessels/[vesselId]/routines/[routineId]/copies": (c) => ({ body: { componentIds: [c.componentId] } }),
  "POST /api/vessels/[vesselId]/readings": (c) => ({
    body: { shipDay: c.shipDay, time: c.time, entries: [{ counterId: c.counterId, value: 1010, remark: "fuzz" }] },
  }),
  "PATCH /api/vessels/[vesselId]/readings/[readingId]": () => ({ body: { value: 1001, reason: "Typed wrong" } }),
  "DELETE /api/vessels/[vesselId]/readings/[readingId]": () => ({ body: { reason: "Entered twice" } }),
  "POST /api/vessels/[vesselId]/work-orders/[workOrderId]/deferrals": (c) => ({
    body: { reason: "Spares awaited from the maker", proposedDueDay: c.plannedDay },
  }),
  "POST /api/vessels/[vesselId]/work-orders/[workOrderId]/completion": (c) => ({ body: completion(c) }),
  "PUT /api/vessels/[vesselId]/work-orders/[workOrderId]/completion": (c) => ({ body: completion(c) }),
  "POST /api/vessels/[vesselId]/work-orders/[workOrderId]/completion/decision": () => ({
    body: { decision: "approve" },
  }),
  "PUT /api/vessels/[vesselId]/work-orders/[workOrderId]/planned-date": (c) => ({
    body: { plannedDate: c.plannedDay },
  }),
  "POST /api/vessels/[vesselId]/port-stays": (c) => ({ body: portStay(c) }),
  "PATCH /api/vessels/[vesselId]/port-stays/[stayId]": () => ({ body: { port: "Antwerp" } }),
  "DELETE /api/vessels/[vesselId]/port-stays/[stayId]": () => ({ query: { releasePackage: "false" } }),
  "PUT /api/vessels/[vesselId]/port-stays/[stayId]/package": () => ({ body: { items: [] } }),
  "POST /api/vessels/[vesselId]/port-stays/[stayId]/package/check": () => ({ body: { items: [] } }),
};

export function toleranceRule(name: string) {
  return {
    name,
    kind: "hours",
    minInterval: 0,
    maxInterval: 100_000,
    windowBefore: { value: 10, unit: "percent" },
    graceAfter: { value: 10, unit: "percent" },
    capHours: null,
    keepsAnniversary: false,
  };
}

export function portStay(c: ExampleContext) {
  return {
    port: "Rotterdam",
    arrivesAt: `${c.plannedDay}T08:00`,
    departsAt: `${c.laterDay}T17:00`,
    workdayFrom: "08:00",
    workdayTo: "17:00",
    engineStop: { from: `${c.plannedDay}T08:00`, to: `${c.plannedDay}T20:00` },
    crew: [
      { rank: "second-engineer", count: 1 },
      { rank: "motorman", count: 2 },
    ],
    watches: [{ rank: "motorman", person: 2, from: `${c.plannedDay}T18:00`, to: `${c.plannedDay}T22:00`, label: "bunkering" }],
  };
}
