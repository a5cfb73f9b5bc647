// A vessel's plan in Keelson's import layout: the same columns, so that export → import on an empty
// vessel reproduces its register, counters, routines and baselines. The last-done row of a routine
// is its last approved completion (day and counter hours), or its baseline when never done.
import "server-only";
import { and, asc, desc, eq, inArray } from "drizzle-orm";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import { getDb } from "@/db/client";
import { completion, counter, reading, toleranceRule, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { toCsv } from "@/server/export/csv";
import { shipDay, shipTimeWithOffset } from "@/server/format/hours";
import { rankWords } from "@/server/routines/rank-names";
import { IMPORT_KINDS, type ImportKind, LAYOUT } from "./layout";
import { loadVesselRows } from "./vessel-now";

type Row = Record<string, string>;
/** Keelson's own rank words: a file read back by any company's import. */
const KEELSON_WORDS = rankWords();
const yes = (b: boolean) => (b ? "yes" : "no");
const text = (v: string | number | null | undefined) => (v === null || v === undefined ? "" : String(v));

/** The vessel's plan as import rows; `withReadings: false` leaves out the readings (the largest kind). */
export async function exportRows(access: Access, vessel: VesselRef, { withReadings = true } = {}): Promise<Record<ImportKind, Row[]>> {
  const db = getDb();
  const rows = await db.transaction((tx) => loadVesselRows(tx, access, vessel), { accessMode: "read only" });
  const codeOf = new Map(rows.components.map((c) => [c.id, c.code]));
  const counterName = new Map(rows.counters.map((c) => [c.id, c.name]));
  const rules = new Map(
    (await db.select({ id: toleranceRule.id, name: toleranceRule.name }).from(toleranceRule).where(eq(toleranceRule.companyId, access.company.id))).map(
      (r) => [r.id, r.name],
    ),
  );
  const ids = rows.routines.map((r) => r.id);
  const done = ids.length
    ? await db
        .selectDistinctOn([workOrder.routineId], { routineId: workOrder.routineId, doneAt: completion.doneAt, counterHours: completion.counterHours })
        .from(completion)
        .innerJoin(workOrder, eq(workOrder.id, completion.workOrderId))
        .where(and(eq(completion.companyId, access.company.id), eq(completion.status, "approved"), inArray(workOrder.routineId, ids)))
        .orderBy(workOrder.routineId, desc(completion.doneAt))
    : [];
  const lastDone = new Map(done.map((d) => [d.routineId!, d]));
  const readings = withReadings
    ? await db
        .select({ counterId: reading.counterId, readAt: reading.readAt, meterValue: reading.meterValue, segment: reading.segment, remark: reading.remark })
        .from(reading)
        .innerJoin(counter, eq(counter.id, reading.counterId))
        .where(and(eq(reading.companyId, access.company.id), eq(reading.vesselId, vessel.id)))
        .orderBy(asc(counter.sortOrder), asc(reading.readAt))
    : [];

  return {
    components: [...rows.components]
      .sort((a, b) => a.sortOrder - b.sortOrder || a.code.localeCompare(b.code))
      .map((c) => ({
        code: c.code,
        name: c.name,
        parent: c.parentId ? (codeOf.get(c.parentId) ?? "") : "",
        critical: yes(c.critical),
        class_item: text(c.classItemRef),
        counter: c.counterId ? (counterName.get(c.counterId) ?? "") : "",
        maker: text(c.maker),
        model: text(c.model),
      })),
    counters: rows.counters.map((c) => ({ counter: c.name, planned_hours_per_day: String(c.plannedHoursPerDay) })),
    routines: rows.routines.map((r) => ({
      code: r.key,
      component: codeOf.get(r.componentId) ?? "",
      title: r.title,
      every_hours: text(r.intervalHours),
      every: "",
      rrule: text(r.calendarRule),
      anniversary: r.anchored ? text(r.anchorDate) : "",
      tolerance_rule: r.toleranceRuleId ? (rules.get(r.toleranceRuleId) ?? "") : "",
      team: r.team.map((t) => `${KEELSON_WORDS.label(t.rank).toLowerCase()}${t.count > 1 ? ` x${t.count}` : ""}`).join("; "),
      elapsed_hours: String(r.elapsedHours),
      engine_stop: yes(r.needsEngineStop),
      needs_port: yes(r.needsPort),
      port_event: text(r.portEvent),
      port_event_hours: text(r.portEventHours),
      critical: yes(r.critical),
      class_related: yes(r.classRelated),
      class_item: text(r.classItemRef),
      checklist: r.checklist.join(" | "),
      measurements: r.measurements.map((m) => `${m.name}${m.unit ? ` [${m.unit}]` : ""}${m.lower !== null || m.upper !== null ? ` ${text(m.lower)}..${text(m.upper)}` : ""}`).join(" | "),
      spare_parts: r.spareParts,
      cautions: r.cautions.join("; "),
      description: r.description,
    })),
    "last-done": rows.routines.flatMap((r) => {
      const d = lastDone.get(r.id);
      const at = d?.doneAt ?? r.baselineAt;
      if (!at) return [];
      return [{ routine: r.key, done_on: shipDay(at, vessel.timeZone), counter_hours: text(d ? d.counterHours : r.baselineHours), remarks: "" }];
    }),
    // With the UTC offset: the ship's clock alone is ambiguous in the hour a zone turns its clocks back.
    readings: readings.flatMap((r) => {
      const name = counterName.get(r.counterId);
      if (!name) return [];
      return [{ counter: name, read_at: shipTimeWithOffset(r.readAt, vessel.timeZone), value: String(r.meterValue), meter: String(r.segment), remark: text(r.remark) }];
    }),
  };
}

export function kindCsv(kind: ImportKind, rows: Row[]): string {
  return toCsv(
    LAYOUT[kind].columns.map((c) => ({ header: c.name, value: (row: Row) => row[c.name] })),
    rows,
  );
}

/** One workbook, a worksheet per kind, in the layout's column order; every cell as text. */
export async function workbookOf(all: Record<ImportKind, Row[]>): Promise<Uint8Array> {
  const book = new ExcelJS.Workbook();
  for (const kind of IMPORT_KINDS) {
    const sheet = book.addWorksheet(kind);
    const columns = LAYOUT[kind].columns.map((c) => c.name);
    sheet.addRow(columns).font = { bold: true };
    for (const row of all[kind]) sheet.addRow(columns.map((c) => row[c] ?? ""));
    sheet.columns.forEach((col) => {
      col.width = 18;
    });
  }
  return new Uint8Array(await book.xlsx.writeBuffer());
}

/** A zip of one CSV per kind, named as the import knows them (components.csv…). */
export async function zipOf(all: Record<ImportKind, Row[]>): Promise<Uint8Array> {
  const zip = new JSZip();
  for (const kind of IMPORT_KINDS) zip.file(`${kind}.csv`, `\uFEFF${kindCsv(kind, all[kind])}\r\n`);
  return zip.generateAsync({ type: "uint8array", compression: "DEFLATE" });
}
