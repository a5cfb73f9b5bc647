// The import of a vessel's plan: preview (read, check, compare; writes nothing) and apply (the same
// checks again, then everything in one transaction, all or nothing, and one recompute after it).
// The files are kept in object storage with the import's record.
import "server-only";
import { randomUUID } from "node:crypto";
import { eq, inArray, sql } from "drizzle-orm";
import { getDb, type Tx } from "@/db/client";
import { component, counter, counterSegment, reading, routine, vesselImport } from "@/db/schema";
import type { ImportCounts } from "@/db/schema/imports";
import type { Access, VesselRef } from "@/server/auth/access";
import { shipDay } from "@/server/format/hours";
import { invalidInput } from "@/server/http/problem";
import { requestRecompute } from "@/server/jobs/recompute-vessel";
import { lockRegister } from "@/server/register/register-scope";
import { dropOpenWorkOrders, routineColumns } from "@/server/routines/queries";
import { putObject } from "@/server/storage/s3";
import { type CheckedImport, checkImport } from "./check-rows";
import { diffImport, type ImportChange, type ImportDiff } from "./diff";
import { type ImportProblem, problemLine } from "./problems";
import { type ImportFile, readImportFiles, type ReadResult } from "./read-file";
import type { ImportUpload } from "./upload";
import { loadVesselRows, type VesselRows } from "./vessel-now";

/** The preview's list of changes is cut here; the counts are always whole. */
export const PREVIEW_CHANGES = 500;

export type ImportPreview = ImportDiff & {
  files: string[];
  problems: ImportProblem[];
  /** More problems than are listed (the list stops at 500). */
  moreProblems: number;
  moreChanges: number;
  retire: boolean;
};
export type ImportResult = { importId: string; counts: ImportCounts; files: string[] };

/** Where an import's rows come from: files read, or another vessel's plan (a copy). */
export type ImportSource = {
  /** The names the preview and the record show. */
  names: string[];
  retire: boolean;
  read: (tx: Tx) => Promise<ReadResult>;
  /** Files to keep with the record (none for a copy). */
  files: ImportFile[];
  /** A copy: routines the vessel already has keep their own baselines. */
  keepBaselines?: boolean;
};

export const fileSource = (upload: ImportUpload): ImportSource => ({
  names: upload.files.map((f) => f.name),
  retire: upload.retire,
  read: () => readImportFiles(upload.files),
  files: upload.files,
});

async function prepare(tx: Tx, access: Access, vessel: VesselRef, source: ImportSource) {
  const read = await source.read(tx);
  const rows = await loadVesselRows(tx, access, vessel, { readings: read.sheets.some((s) => s.kind === "readings" && s.rows.length > 0) });
  const checked = checkImport(read.sheets, rows.now);
  if (source.keepBaselines) {
    const held = new Map(rows.routines.map((r) => [r.key, r]));
    for (const r of checked.routines) {
      const was = held.get(r.code);
      if (was) r.routine = { ...r.routine, baselineAt: was.baselineAt ? shipDay(was.baselineAt, vessel.timeZone) : null, baselineHours: was.baselineHours };
    }
  }
  const diff = diffImport(checked, rows, vessel.timeZone, source.retire);
  const problems = inFileOrder([...read.problems, ...checked.problems, ...stillCounting(read, checked, rows, diff)], source.names);
  if (!problems.length && !read.sheets.some((s) => s.rows.length)) {
    problems.push({ file: source.names.join(", "), row: null, column: null, message: "There are no rows to import." });
  }
  return { checked, rows, problems, diff };
}

/** Problems by file (in the order given), then row: a file's own problems (row null) first. Stable otherwise. */
function inFileOrder(problems: ImportProblem[], names: string[]): ImportProblem[] {
  const fileIndex = (file: string) => {
    const i = names.findIndex((n) => file === n || file.startsWith(`${n} ›`));
    return i < 0 ? names.length : i;
  };
  return problems
    .map((p, i) => ({ p, i }))
    .sort((a, b) => fileIndex(a.p.file) - fileIndex(b.p.file) || a.p.file.localeCompare(b.p.file) || (a.p.row ?? 0) - (b.p.row ?? 0) || a.i - b.i)
    .map((x) => x.p);
}

/** A counter the files would retire while a component would still count its hours. */
function stillCounting(read: ReadResult, checked: CheckedImport, rows: VesselRows, diff: ImportDiff): ImportProblem[] {
  const retired = diff.changes.filter((c) => c.kind === "counters" && c.action === "retire");
  if (!retired.length) return [];
  const file = read.sheets.find((s) => s.kind === "counters")?.source ?? "counters";
  // Each component's counter after the import: the file's word, or the vessel's for a component the file leaves alone.
  const inFile = new Map(checked.components.map((c) => [c.code, c.counterName?.toLowerCase() ?? null]));
  const counterName = new Map(rows.counters.map((c) => [c.id, c.name.toLowerCase()]));
  const counting = new Map<string, string[]>();
  for (const c of rows.components) if (!inFile.has(c.code)) inFile.set(c.code, c.counterId ? (counterName.get(c.counterId) ?? null) : null);
  for (const [code, name] of inFile) if (name) counting.set(name, [...(counting.get(name) ?? []), code]);
  return retired.flatMap((c) => {
    const users = counting.get(c.key.toLowerCase());
    if (!users?.length) return [];
    const named = `${users.slice(0, 5).join(", ")}${users.length > 5 ? ` and ${users.length - 5} more` : ""}`;
    return [{ file, row: null, column: "counter", message: `“${c.key}” is not in the counters file, but ${named} still count${users.length === 1 ? "s" : ""} its hours: give ${users.length === 1 ? "it" : "them"} another counter in the components file, or keep “${c.key}” in the counters file.` }];
  });
}

export async function previewImport(access: Access, vessel: VesselRef, source: ImportSource): Promise<ImportPreview> {
  const { problems, diff } = await getDb().transaction((tx) => prepare(tx, access, vessel, source), { accessMode: "read only" });
  return {
    ...diff,
    changes: diff.changes.slice(0, PREVIEW_CHANGES),
    moreChanges: Math.max(diff.changes.length - PREVIEW_CHANGES, 0),
    problems: problems.slice(0, PREVIEW_CHANGES),
    moreProblems: Math.max(problems.length - PREVIEW_CHANGES, 0),
    files: source.names,
    retire: source.retire,
  };
}

export async function applyImport(access: Access, vessel: VesselRef, source: ImportSource): Promise<ImportResult> {
  const importId = randomUUID();
  const keys = source.files.map((f, i) => `${access.company.id}/${vessel.id}/imports/${importId}/${i + 1}-${f.name.replace(/[^\w.-]+/g, "_").slice(0, 80)}`);
  return getDb().transaction(async (tx) => {
    await lockRegister(tx, vessel);
    const { checked, rows, problems, diff } = await prepare(tx, access, vessel, source);
    if (problems.length) {
      throw invalidInput(
        problems.slice(0, 200).map((p) => ({ field: "file", message: problemLine(p) })),
        `The import was refused: ${problems.length} problem${problems.length === 1 ? "" : "s"} in the files. Nothing was written.`,
      );
    }
    await write(tx, access, vessel, checked, rows, diff.changes);
    const counts = countsOf(diff);
    for (const [i, f] of source.files.entries()) await putObject(keys[i]!, f.bytes, contentType(f.name));
    await tx.insert(vesselImport).values({
      id: importId,
      companyId: access.company.id,
      vesselId: vessel.id,
      importedBy: access.user.id,
      fileNames: source.names,
      objectKeys: keys,
      counts,
    });
    await requestRecompute(tx, access.company.id, vessel.id);
    return { importId, counts, files: source.names };
  });
}

function contentType(name: string): string {
  return /\.xlsx$/i.test(name) ? "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" : "text/csv";
}

function countsOf(diff: ImportDiff): ImportCounts {
  const of = (k: keyof ImportDiff["counts"]) => ({ created: diff.counts[k].create, changed: diff.counts[k].change, retired: diff.counts[k].retire });
  return { counters: of("counters"), components: of("components"), routines: of("routines"), readings: of("readings") };
}

const CHUNK = 500;
async function inChunks<T>(items: T[], run: (chunk: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < items.length; i += CHUNK) await run(items.slice(i, i + CHUNK));
}

async function write(tx: Tx, access: Access, vessel: VesselRef, checked: CheckedImport, rows: VesselRows, changes: ImportChange[]) {
  const companyId = access.company.id;
  const now = new Date();
  const acts = new Map(changes.map((c) => [`${c.kind}:${c.key}`, c.action]));
  const act = (kind: ImportChange["kind"], key: string) => acts.get(`${kind}:${key}`);

  // Counters: new ones with their first meter; a changed planned rate.
  const counterId = new Map(rows.counters.map((c) => [c.name.toLowerCase(), c.id]));
  let order = rows.counters.reduce((m, c) => Math.max(m, c.sortOrder), -1);
  const history = new Map(checked.readings.map((r) => [r.counterName.toLowerCase(), r]));
  for (const c of checked.counters) {
    const action = act("counters", c.name);
    if (action === "create") {
      const own = history.get(c.name.toLowerCase());
      const [row] = await tx
        .insert(counter)
        .values({
          companyId,
          vesselId: vessel.id,
          name: c.name,
          plannedHoursPerDay: c.plannedHoursPerDay,
          sortOrder: (order += 1),
          currentSegment: 1 + (own?.segments.length ?? 0),
        })
        .returning({ id: counter.id });
      // The first meter from its first reading in the file, or from now at 0 h; later meters as the file has them.
      const first = own?.readings[0];
      await tx.insert(counterSegment).values([
        { companyId, counterId: row!.id, segment: 1, startedAt: first?.readAt ?? now, startMeter: first?.meterValue ?? 0, offsetHours: 0, createdBy: access.user.id },
        ...(own?.segments ?? []).map((m) => ({ companyId, counterId: row!.id, ...m, reason: "Meter replacement, from the imported readings", createdBy: access.user.id })),
      ]);
      counterId.set(c.name.toLowerCase(), row!.id);
    } else if (action === "change") {
      await tx.update(counter).set({ plannedHoursPerDay: c.plannedHoursPerDay }).where(eq(counter.id, counterId.get(c.name.toLowerCase())!));
    }
  }

  // Components: the new ones first without parents (a parent may be new too), then every parent set.
  const componentId = new Map(rows.components.map((c) => [c.code, c.id]));
  const fields = (c: CheckedImport["components"][number]) => ({
    name: c.name,
    critical: c.critical,
    classItemRef: c.classItemRef,
    counterId: c.counterName ? (counterId.get(c.counterName.toLowerCase()) ?? null) : null,
    maker: c.maker,
    model: c.model,
  });
  const created = checked.components.filter((c) => act("components", c.code) === "create");
  await inChunks(created, async (chunk) => {
    const ids = await tx
      .insert(component)
      .values(chunk.map((c) => ({ companyId, vesselId: vessel.id, code: c.code, sortOrder: c.line, ...fields(c) })))
      .returning({ id: component.id, code: component.code });
    for (const r of ids) componentId.set(r.code, r.id);
  });
  for (const c of checked.components) {
    const action = act("components", c.code);
    if (!action) continue;
    const parentId = c.parentCode ? componentId.get(c.parentCode)! : null;
    await tx
      .update(component)
      .set(action === "create" ? { parentId } : { ...fields(c), parentId, updatedAt: now })
      .where(eq(component.id, componentId.get(c.code)!));
  }

  // Readings: the total is the meter's value and its meter's offset.
  const offsets = new Map<string, Map<number, number>>();
  for (const [name, held] of rows.now.readings) offsets.set(name, new Map(held.segments.map((m) => [m.segment, m.offsetHours])));
  for (const c of checked.readings) {
    if (offsets.has(c.counterName.toLowerCase())) continue;
    offsets.set(c.counterName.toLowerCase(), new Map([[1, 0], ...c.segments.map((m) => [m.segment, m.offsetHours] as const)]));
  }
  const readingRows = checked.readings.flatMap((c) => {
    const id = counterId.get(c.counterName.toLowerCase())!;
    const offset = offsets.get(c.counterName.toLowerCase())!;
    return c.readings.map((r) => ({
      companyId,
      vesselId: vessel.id,
      counterId: id,
      readAt: r.readAt,
      segment: r.segment,
      meterValue: r.meterValue,
      totalHours: Math.round((r.meterValue + (offset.get(r.segment) ?? 0)) * 10) / 10,
      enteredBy: access.user.id,
      remark: r.remark,
    }));
  });
  await inChunks(readingRows, (chunk) => tx.insert(reading).values(chunk));

  // Routines: new ones in chunks, changed ones one by one (a new revision), retired ones last.
  const routineId = new Map([...[...rows.retired.values()].map((r) => [r.key, r.id] as const), ...rows.routines.map((r) => [r.key, r.id] as const)]);
  const columns = (r: CheckedImport["routines"][number]) =>
    routineColumns({ ...r.routine, componentId: componentId.get(r.componentCode)! }, vessel.timeZone);
  const newRoutines = checked.routines.filter((r) => act("routines", r.code) === "create");
  await inChunks(newRoutines, (chunk) =>
    tx.insert(routine).values(chunk.map((r) => ({ companyId, vesselId: vessel.id, code: r.code, ...columns(r) }))),
  );
  for (const r of checked.routines) {
    if (act("routines", r.code) !== "change") continue;
    await tx
      .update(routine)
      // A routine made in the app takes its key as its code from now on.
      .set({ ...columns(r), code: r.code, retiredAt: null, updatedAt: now, revision: sql`${routine.revision} + 1` })
      .where(eq(routine.id, routineId.get(r.code)!));
  }
  const retiredCounters = changes.filter((c) => c.kind === "counters" && c.action === "retire").map((c) => counterId.get(c.key.toLowerCase())!);
  if (retiredCounters.length) await tx.update(counter).set({ retiredAt: now }).where(inArray(counter.id, retiredCounters));
  const retired = changes.filter((c) => c.kind === "routines" && c.action === "retire").map((c) => routineId.get(c.key)!);
  if (retired.length) {
    await tx.update(routine).set({ retiredAt: now, updatedAt: now, revision: sql`${routine.revision} + 1` }).where(inArray(routine.id, retired));
    await dropOpenWorkOrders(tx, companyId, retired);
  }
}
