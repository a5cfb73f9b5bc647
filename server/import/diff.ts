// What an import would do to the vessel: each counter, component and routine of the files is new,
// changed (and which of its fields) or the same; with "retire" ticked, the routines and counters
// the files no longer list are retired. Over the rows loaded by vessel-now.ts; it reads nothing itself.
import "server-only";
import { shipDay } from "@/server/format/hours";
import { routineColumns } from "@/server/routines/queries";
import { type CheckedImport, ROUTINE_COLUMN } from "./check-rows";
import type { VesselRows } from "./vessel-now";

export type ImportKindCounts = { create: number; change: number; same: number; retire: number };
export type ImportChange = { kind: "counters" | "components" | "routines" | "readings"; key: string; action: "create" | "change" | "retire"; fields: string[] };
export type ImportDiff = {
  counts: Record<ImportChange["kind"], ImportKindCounts>;
  changes: ImportChange[];
};

const same = (a: unknown, b: unknown) => JSON.stringify(norm(a)) === JSON.stringify(norm(b));
function norm(v: unknown): unknown {
  if (v instanceof Date) return v.toISOString();
  if (v === undefined || v === "") return null;
  return v;
}

/** The change of a retired routine the file lists again: back in use, with its history. */
export const BACK_IN_USE = "back in use";

export function diffImport(checked: CheckedImport, rows: VesselRows, timeZone: string, retire: boolean): ImportDiff {
  const counts = {
    counters: { create: 0, change: 0, same: 0, retire: 0 },
    components: { create: 0, change: 0, same: 0, retire: 0 },
    routines: { create: 0, change: 0, same: 0, retire: 0 },
    readings: { create: 0, change: 0, same: 0, retire: 0 },
  };
  const changes: ImportChange[] = [];
  const note = (kind: ImportChange["kind"], key: string, fields: string[] | null) => {
    if (fields === null) {
      counts[kind].create += 1;
      changes.push({ kind, key, action: "create", fields: [] });
    } else if (fields.length) {
      counts[kind].change += 1;
      changes.push({ kind, key, action: "change", fields });
    } else {
      counts[kind].same += 1;
    }
  };

  const counterByName = new Map(rows.counters.map((c) => [c.name.toLowerCase(), c]));
  for (const c of checked.counters) {
    const was = counterByName.get(c.name.toLowerCase());
    note("counters", c.name, was ? (same(was.plannedHoursPerDay, c.plannedHoursPerDay) ? [] : ["planned_hours_per_day"]) : null);
  }

  const componentByCode = new Map(rows.components.map((c) => [c.code, c]));
  const codeOfId = new Map(rows.components.map((c) => [c.id, c.code]));
  const counterNameOfId = new Map(rows.counters.map((c) => [c.id, c.name.toLowerCase()]));
  for (const c of checked.components) {
    const was = componentByCode.get(c.code);
    if (!was) {
      note("components", c.code, null);
      continue;
    }
    const fields: string[] = [];
    if (was.name !== c.name) fields.push("name");
    if ((was.parentId ? codeOfId.get(was.parentId) : null) !== c.parentCode) fields.push("parent");
    if (was.critical !== c.critical) fields.push("critical");
    if (!same(was.classItemRef, c.classItemRef)) fields.push("class_item");
    if ((was.counterId ? counterNameOfId.get(was.counterId) : null) !== (c.counterName?.toLowerCase() ?? null)) fields.push("counter");
    if (!same(was.maker, c.maker)) fields.push("maker");
    if (!same(was.model, c.model)) fields.push("model");
    note("components", c.code, fields);
  }

  const routineByCode = new Map(rows.routines.map((r) => [r.key, r]));
  const componentIdOf = (code: string) => componentByCode.get(code)?.id ?? `new:${code}`;
  for (const r of checked.routines) {
    const retired = routineByCode.has(r.code) ? undefined : rows.retired.get(r.code);
    const was = routineByCode.get(r.code) ?? retired;
    if (!was) {
      note("routines", r.code, null);
      continue;
    }
    const next = routineColumns({ ...r.routine, componentId: componentIdOf(r.componentCode) }, timeZone);
    const fields = (Object.keys(next) as (keyof typeof next)[]).filter((k) => !same(was[k], next[k]));
    note("routines", r.code, [...(retired ? [BACK_IN_USE] : []), ...new Set(fields.map((f) => ROUTINE_COLUMN[f] ?? f))]);
  }
  if (retire && checked.routines.length) {
    const listed = new Set(checked.routines.map((r) => r.code));
    for (const r of rows.routines) {
      if (listed.has(r.key)) continue;
      counts.routines.retire += 1;
      changes.push({ kind: "routines", key: r.key, action: "retire", fields: [] });
    }
  }
  if (retire && checked.counters.length) {
    const listed = new Set(checked.counters.map((c) => c.name.toLowerCase()));
    for (const c of rows.counters) {
      if (listed.has(c.name.toLowerCase())) continue;
      counts.counters.retire += 1;
      changes.push({ kind: "counters", key: c.name, action: "retire", fields: [] });
    }
  }
  for (const c of checked.readings) {
    counts.readings.create += c.readings.length;
    counts.readings.same += c.same;
    if (!c.readings.length) continue;
    const first = c.readings[0]!.readAt;
    const last = c.readings.at(-1)!.readAt;
    const span = `${shipDay(first, timeZone)}${last > first ? ` to ${shipDay(last, timeZone)}` : ""}`;
    const meters = c.segments.length ? `, ${c.segments.length + 1} meters` : "";
    changes.push({ kind: "readings", key: c.counterName, action: "create", fields: [`${c.readings.length} reading${c.readings.length === 1 ? "" : "s"}, ${span}${meters}`] });
  }
  return { counts, changes };
}
