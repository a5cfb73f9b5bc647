import "server-only";
import { and, desc, eq, gte, inArray, isNull, like, lt, or, sql, type SQL } from "drizzle-orm";
import { getDb } from "@/db/client";
import { auditEntry, user, vessel } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { csvResponse, toCsv } from "@/server/export/csv";
import type { AuditItem, AuditSearch, RecordTrailRequest } from "./contract";
import {
  actionWord,
  AUDIT_KINDS,
  actorUserId,
  changeLines,
  kindOfTable,
  lineValueWords,
  RECORD_FAMILIES,
  recordLabel,
  systemActorWords,
  type TrailRecordTable,
} from "./kinds";

export const SEARCH_PAGE = 50;
/** The CSV's bound: a year of a large fleet's changes; the file says when it was reached. */
export const EXPORT_LIMIT = 50_000;
export const RECORD_TRAIL_LIMIT = 200;

const DAY_MS = 86_400_000;

function searchWhere(access: Access, search: AuditSearch): SQL {
  const conditions: (SQL | undefined)[] = [eq(auditEntry.companyId, access.company.id)];
  if (search.person === "system") {
    conditions.push(or(isNull(auditEntry.actor), like(auditEntry.actor, "system:%")));
  } else if (search.person) {
    conditions.push(eq(auditEntry.actor, `user:${search.person}`));
  }
  if (search.vessel) conditions.push(eq(auditEntry.vesselId, search.vessel));
  if (search.kind) conditions.push(inArray(auditEntry.tableName, [...AUDIT_KINDS[search.kind].tables]));
  // Days are UTC days: the office has no zone of its own, and an entry's instant is the same on every ship.
  if (search.from) conditions.push(gte(auditEntry.at, new Date(`${search.from}T00:00:00Z`)));
  if (search.until) conditions.push(lt(auditEntry.at, new Date(Date.parse(`${search.until}T00:00:00Z`) + DAY_MS)));
  if (search.before) conditions.push(lt(auditEntry.id, search.before));
  return and(...conditions)!;
}

async function loadItems(companyId: string, where: SQL, limit: number): Promise<AuditItem[]> {
  const rows = await getDb()
    .select({
      entry: auditEntry,
      personName: user.name,
      vesselName: vessel.name,
    })
    .from(auditEntry)
    .leftJoin(user, eq(auditEntry.actor, sql`'user:' || ${user.id}`))
    .leftJoin(vessel, and(eq(vessel.id, auditEntry.vesselId), eq(vessel.companyId, companyId)))
    .where(where)
    .orderBy(desc(auditEntry.id))
    .limit(limit);
  return rows.map(({ entry, personName, vesselName }) => {
    const personId = actorUserId(entry.actor);
    const kind = kindOfTable(entry.tableName);
    return {
      id: entry.id,
      at: entry.at.toISOString(),
      by: personId ? (personName ?? `a former user (${personId})`) : systemActorWords(entry.actor),
      byPerson: personId !== null,
      vessel: vesselName,
      kind: kind ? AUDIT_KINDS[kind].label : null,
      record: recordLabel(entry.tableName, entry.before, entry.after),
      action: actionWord(entry.action),
      reason: entry.reason,
      lines: changeLines(entry.action, entry.before, entry.after).map(({ label, before, after }) => ({
        label,
        before,
        after,
      })),
    };
  });
}

export type AuditPage = { items: AuditItem[]; nextBefore: number | null };

/** The administrator's search, newest first, a page at a time (`before` is the last id shown). */
export async function searchTrail(access: Access, search: AuditSearch, limit = SEARCH_PAGE): Promise<AuditPage> {
  const items = await loadItems(access.company.id, searchWhere(access, search), limit + 1);
  const more = items.length > limit;
  const shown = more ? items.slice(0, limit) : items;
  return { items: shown, nextBefore: more ? shown.at(-1)!.id : null };
}

function changesText(item: AuditItem): string {
  return item.lines.map((l) => `${l.label}: ${lineValueWords(item.action, l)}`).join("; ");
}

export async function trailCsv(access: Access, search: AuditSearch): Promise<Response> {
  const items = await loadItems(access.company.id, searchWhere(access, search), EXPORT_LIMIT + 1);
  const cut = items.length > EXPORT_LIMIT;
  const rows = cut ? items.slice(0, EXPORT_LIMIT) : items;
  const csv = toCsv<AuditItem>(
    [
      { header: "Entry", value: (i) => i.id },
      { header: "When (UTC)", value: (i) => i.at.slice(0, 19).replace("T", " ") },
      { header: "By", value: (i) => i.by },
      { header: "Vessel", value: (i) => i.vessel },
      { header: "Kind", value: (i) => i.kind },
      { header: "Record", value: (i) => i.record },
      { header: "Action", value: (i) => i.action },
      { header: "Reason", value: (i) => i.reason },
      { header: "Changes", value: changesText },
    ],
    rows,
  );
  const note = cut
    ? `\r\n"Only the newest ${EXPORT_LIMIT.toLocaleString("en-GB")} entries are in this file: narrow the period for the rest."`
    : "";
  return csvResponse(`${csv}${note}`, `audit-trail-${new Date().toISOString().slice(0, 10)}.csv`);
}

/**
 * One record's trail on its page: its own entries and those of the records that belong to it (a
 * work order's completions, deferrals and defect), on this vessel or company-wide, newest first.
 */
export async function recordTrail(
  access: Access,
  target: VesselRef | null,
  { table, record }: RecordTrailRequest,
): Promise<{ items: AuditItem[]; more: boolean }> {
  // The record must be this vessel's (the company's parts and tolerance rules are everyone's): some
  // of its family's rows (a meter, a routine's parts) carry no vessel of their own, so without this
  // another vessel's record could be read through this vessel's door.
  if (!target && !COMPANY_WIDE.has(table)) return { items: [], more: false };
  if (target && !(await belongsToVessel(access.company.id, target.id, table, record))) return { items: [], more: false };
  const family = RECORD_FAMILIES[table] as readonly (readonly [string, string])[];
  // An entry of a child names its parent among its refs (every `*_id` of the row, even on an update
  // that changed other columns); the GIN index on refs finds them.
  const children = [...new Set(family.map(([child]) => child))];
  const belongs = children.length
    ? [and(inArray(auditEntry.tableName, children), sql`${auditEntry.refs} @> array[${record}]::text[]`)]
    : [];
  const where = and(
    eq(auditEntry.companyId, access.company.id),
    // A company-wide record's family lies on the vessels the person may open (a part's stock on board).
    target
      ? or(eq(auditEntry.vesselId, target.id), isNull(auditEntry.vesselId))
      : access.assignedVesselIds === null
        ? undefined
        : or(isNull(auditEntry.vesselId), access.assignedVesselIds.length ? inArray(auditEntry.vesselId, access.assignedVesselIds) : undefined),
    or(and(eq(auditEntry.tableName, table), eq(auditEntry.recordId, record)), ...belongs),
  )!;
  const items = await loadItems(access.company.id, where, RECORD_TRAIL_LIMIT + 1);
  return { items: items.slice(0, RECORD_TRAIL_LIMIT), more: items.length > RECORD_TRAIL_LIMIT };
}

/** The people who appear in the company's trail, for the search form's list. */
export async function trailPeople(access: Access): Promise<{ id: string; name: string }[]> {
  const rows = await getDb().execute<{ id: string; name: string }>(sql`
    select u.id, u.name from "user" u
    join membership m on m.user_id = u.id and m.company_id = ${access.company.id}
    order by u.name`);
  return rows.rows;
}

const COMPANY_WIDE: ReadonlySet<TrailRecordTable> = new Set(["part", "tolerance_rule"]);

/** The record lives on the vessel now, or its own trail says it did (a removed one). */
async function belongsToVessel(
  companyId: string,
  vesselId: string,
  table: TrailRecordTable,
  record: string,
): Promise<boolean> {
  if (COMPANY_WIDE.has(table)) return true;
  if (table === "vessel") return record === vesselId;
  const { rows } = await getDb().execute<{ found: boolean }>(sql`
    select exists (select 1 from ${sql.identifier(table)} t
                    where t.id = ${record} and t.company_id = ${companyId} and t.vessel_id = ${vesselId})
        or exists (select 1 from audit_entry a
                    where a.company_id = ${companyId} and a.table_name = ${table} and a.record_id = ${record}
                      and a.vessel_id = ${vesselId}) as found`);
  return rows[0]?.found === true;
}
