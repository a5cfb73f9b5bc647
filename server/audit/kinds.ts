// What the trail's entries are about, in the words of the screens: which kind of record a table
// holds, how one entry is named and which columns are shown. Pure, for the page, the CSV and tests.
import type { AuditAction } from "@/db/schema/audit";

export const AUDIT_KINDS = {
  routines: { label: "Routines", tables: ["routine", "routine_part"] },
  register: { label: "Components and counters", tables: ["component", "counter", "counter_segment"] },
  readings: { label: "Readings", tables: ["reading"] },
  "work-orders": { label: "Work orders", tables: ["work_order", "work_package_item"] },
  completions: { label: "Completions and approvals", tables: ["completion", "completion_attachment"] },
  deferrals: { label: "Deferrals", tables: ["deferral"] },
  defects: { label: "Defects", tables: ["defect"] },
  "port-stays": { label: "Port stays", tables: ["port_stay"] },
  parts: {
    label: "Parts and stores",
    tables: ["part", "part_fit", "store_location", "stock_movement", "requisition", "requisition_line"],
  },
  tolerance: { label: "Tolerance rules", tables: ["tolerance_rule"] },
  people: { label: "People, roles and assignments", tables: ["user", "membership", "vessel_assignment"] },
  company: { label: "Company, vessels and settings", tables: ["company", "vessel", "vessel_clock_change", "mail_opt_out", "vessel_import"] },
} as const;

export type AuditKind = keyof typeof AUDIT_KINDS;
export const AUDIT_KIND_KEYS = Object.keys(AUDIT_KINDS) as [AuditKind, ...AuditKind[]];

const KIND_OF_TABLE = new Map<string, AuditKind>(
  AUDIT_KIND_KEYS.flatMap((kind) => AUDIT_KINDS[kind].tables.map((t) => [t, kind] as const)),
);

export function kindOfTable(table: string): AuditKind | null {
  return KIND_OF_TABLE.get(table) ?? null;
}

const RECORD_WORDS: Record<string, string> = {
  routine: "routine",
  routine_part: "part of a routine",
  component: "component",
  counter: "counter",
  counter_segment: "meter",
  reading: "reading",
  work_order: "work order",
  work_package_item: "job in a work package",
  completion: "completion",
  completion_attachment: "photo or file of a completion",
  deferral: "deferral",
  defect: "defect",
  port_stay: "port stay",
  part: "part",
  part_fit: "part fitted to a component",
  store_location: "store location",
  stock_movement: "stock movement",
  requisition: "requisition",
  requisition_line: "requisition line",
  tolerance_rule: "tolerance rule",
  user: "person",
  membership: "role",
  vessel_assignment: "vessel assignment",
  company: "company",
  vessel: "vessel",
  vessel_clock_change: "change of the ship's clock",
  mail_opt_out: "e-mail choice",
  vessel_import: "plan import",
};

export function recordWord(table: string): string {
  return RECORD_WORDS[table] ?? table.replaceAll("_", " ");
}

const ACTION_WORDS: Record<AuditAction, string> = { insert: "added", update: "changed", delete: "removed" };

export function actionWord(action: AuditAction): string {
  return ACTION_WORDS[action];
}

/**
 * Which records count as part of a record's own trail: a work order's page shows the entries of
 * its completions, deferrals and defect too. Each table lists the tables and the column naming it.
 */
export const RECORD_FAMILIES = {
  work_order: [
    ["completion", "work_order_id"],
    ["completion_attachment", "work_order_id"],
    ["deferral", "work_order_id"],
    ["defect", "work_order_id"],
    ["work_package_item", "work_order_id"],
    ["stock_movement", "work_order_id"],
  ],
  routine: [["routine_part", "routine_id"]],
  component: [["part_fit", "component_id"]],
  counter: [
    ["counter_segment", "counter_id"],
    ["reading", "counter_id"],
  ],
  port_stay: [["work_package_item", "port_stay_id"]],
  requisition: [["requisition_line", "requisition_id"]],
  part: [["part_fit", "part_id"]],
  defect: [],
  tolerance_rule: [],
  vessel: [],
} as const satisfies Record<string, readonly (readonly [string, string])[]>;

export type TrailRecordTable = keyof typeof RECORD_FAMILIES;
export const TRAIL_RECORD_TABLES = Object.keys(RECORD_FAMILIES) as [TrailRecordTable, ...TrailRecordTable[]];

/** Columns never shown: keys, tenancy, and the bookkeeping every row has. */
const HIDDEN = new Set(["id", "company_id", "vessel_id", "created_at", "updated_at", "computed_at"]);
/** Never shown at all, even as "changed". */
const SECRET = new Set(["password", "token"]);

const ACRONYMS: Record<string, string> = { imo: "IMO", utc: "UTC", url: "URL" };

export function columnWords(column: string): string {
  const words = column.replace(/_id$/, "").split("_").map((w) => ACRONYMS[w] ?? w);
  const text = words.join(" ");
  return text.charAt(0).toUpperCase() + text.slice(1);
}

export type ChangeLine = { column: string; label: string; before: string | null; after: string | null };

function valueText(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string") return value.length > 200 ? `${value.slice(0, 199)}…` : value;
  if (typeof value === "number") return String(value);
  const json = JSON.stringify(value);
  return json.length > 200 ? `${json.slice(0, 199)}…` : json;
}

/**
 * The lines of one entry: for a change, each changed column's old and new value; for an addition
 * the values set, for a removal the values the row had (empty ones left out).
 */
export function changeLines(
  action: AuditAction,
  before: Record<string, unknown> | null,
  after: Record<string, unknown> | null,
): ChangeLine[] {
  const columns = Object.keys(action === "delete" ? (before ?? {}) : (after ?? {}));
  const lines: ChangeLine[] = [];
  for (const column of columns) {
    if (HIDDEN.has(column) || SECRET.has(column)) continue;
    const old = action === "insert" ? null : valueText(before?.[column]);
    const now = action === "delete" ? null : valueText(after?.[column]);
    if (action !== "update" && old === null && now === null) continue;
    lines.push({ column, label: columnWords(column), before: old, after: now });
  }
  return lines;
}

/** One line's values in words: "1020 → 1012" for a change, the value for an addition or a removal. */
export function lineValueWords(action: string, line: { before: string | null; after: string | null }): string {
  return action === actionWord("update") ? `${line.before ?? "—"} → ${line.after ?? "—"}` : (line.after ?? line.before ?? "");
}

/** A name for the record an entry is about, from its own values: number, title, name or code. */
export function recordLabel(
  table: string,
  before: Record<string, unknown> | null,
  after: Record<string, unknown> | null,
): string {
  const pick = (key: string) => {
    const v = after?.[key] ?? before?.[key];
    return typeof v === "string" && v ? v : null;
  };
  const name = pick("number") ?? pick("title") ?? pick("name") ?? pick("code") ?? pick("email") ?? pick("role");
  return name ? `${recordWord(table)} ${name}` : recordWord(table);
}

/** `user:<id>` → the id; anything else is not a person. */
export function actorUserId(actor: string | null): string | null {
  return actor?.startsWith("user:") ? actor.slice(5) : null;
}

/** How an actor that is not a person is shown. */
export function systemActorWords(actor: string | null): string {
  if (!actor) return "not recorded";
  if (actor.startsWith("system:worker ")) return `Keelson's worker (${actor.slice(14)})`;
  if (actor.startsWith("system:")) return `Keelson (${actor.slice(7)})`;
  return actor;
}
