// A vessel's maintenance history as CSV — or one component's, with the parts below it: every job
// recorded, newest first, with who did it, who answered for it, what was measured and the chief
// engineer's decision. For the office's records and for a handover to another system.
import "server-only";
import { aliasedTable, and, desc, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { getDb } from "@/db/client";
import { completion, component, routine, user, workOrder } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { type CsvColumn, toCsv } from "@/server/export/csv";
import { shipClock, shipDay } from "@/server/format/hours";
import { invalidInput } from "@/server/http/problem";
import { ComponentCode } from "@/server/register/contract";
import { withKeys } from "./vessel-now";

export const HistoryQuery = z.object({
  /** A component's code: its history and its parts'. */
  component: ComponentCode.optional(),
});

/** More jobs than twenty years of a big vessel's: past it, the file holds the newest 50,000 (a component's history narrows it). */
export const HISTORY_LIMIT = 50_000;

type Row = {
  number: string;
  routine: string;
  componentCode: string;
  componentName: string;
  title: string;
  doneAt: Date;
  counterHours: number | null;
  manHours: number;
  status: string;
  doneBy: string | null;
  responsible: string | null;
  workedBy: { rank: string; name: string }[];
  measurements: { name: string; unit: string; value: number; outOfLimits: boolean }[];
  remarks: string;
  decidedBy: string | null;
  decisionNote: string | null;
};

function columns(timeZone: string): CsvColumn<Row>[] {
  return [
    { header: "work_order", value: (r) => r.number },
    { header: "routine", value: (r) => r.routine },
    { header: "component", value: (r) => r.componentCode },
    { header: "component_name", value: (r) => r.componentName },
    { header: "title", value: (r) => r.title },
    { header: "done_on", value: (r) => shipDay(r.doneAt, timeZone) },
    { header: "done_at", value: (r) => `${shipDay(r.doneAt, timeZone)} ${shipClock(r.doneAt, timeZone)}` },
    { header: "counter_hours", value: (r) => r.counterHours },
    { header: "man_hours", value: (r) => r.manHours },
    { header: "status", value: (r) => r.status.replaceAll("-", " ") },
    { header: "recorded_by", value: (r) => r.doneBy },
    { header: "responsible", value: (r) => r.responsible },
    { header: "worked_by", value: (r) => r.workedBy.map((w) => `${w.name} (${w.rank.replaceAll("-", " ")})`).join("; ") },
    { header: "measurements", value: (r) => r.measurements.map((m) => `${m.name} = ${m.value}${m.unit ? ` ${m.unit}` : ""}${m.outOfLimits ? " (outside limits)" : ""}`).join(" | ") },
    { header: "remarks", value: (r) => r.remarks },
    { header: "decided_by", value: (r) => r.decidedBy },
    { header: "decision_note", value: (r) => r.decisionNote },
  ];
}

export async function historyCsv(access: Access, vessel: VesselRef, componentCode?: string): Promise<string> {
  const db = getDb();
  const companyId = access.company.id;
  const components = await db
    .select({ id: component.id, code: component.code, parentId: component.parentId })
    .from(component)
    .where(and(eq(component.companyId, companyId), eq(component.vesselId, vessel.id)));
  let scope: string[] | null = null;
  if (componentCode) {
    const top = components.find((c) => c.code === componentCode);
    if (!top) throw invalidInput([{ field: "component", message: `${componentCode}: there is no such component on ${vessel.name}.` }]);
    // The component and every part below it: each component visited once, so the walk ends.
    const children = new Map<string, string[]>();
    for (const c of components) if (c.parentId) children.set(c.parentId, [...(children.get(c.parentId) ?? []), c.id]);
    const seen = new Set<string>([top.id]);
    for (const id of seen) for (const child of children.get(id) ?? []) seen.add(child);
    scope = [...seen];
  }
  const recorder = aliasedTable(user, "recorder");
  const responsible = aliasedTable(user, "responsible");
  const decider = aliasedTable(user, "decider");
  const rows = await db
    .select({
      number: workOrder.number,
      routineId: workOrder.routineId,
      componentCode: component.code,
      componentName: component.name,
      title: workOrder.title,
      doneAt: completion.doneAt,
      counterHours: completion.counterHours,
      manHours: completion.manHours,
      status: completion.status,
      doneBy: recorder.name,
      responsible: responsible.name,
      workedBy: completion.workedBy,
      measurements: completion.measurements,
      remarks: completion.remarks,
      decidedBy: decider.name,
      decisionNote: completion.decisionNote,
    })
    .from(completion)
    .innerJoin(workOrder, eq(workOrder.id, completion.workOrderId))
    .innerJoin(component, eq(component.id, workOrder.componentId))
    .leftJoin(recorder, eq(recorder.id, completion.doneBy))
    .leftJoin(responsible, eq(responsible.id, completion.responsibleId))
    .leftJoin(decider, eq(decider.id, completion.decidedBy))
    .where(
      and(
        eq(completion.companyId, companyId),
        eq(completion.vesselId, vessel.id),
        ...(scope ? [inArray(workOrder.componentId, scope)] : []),
      ),
    )
    .orderBy(desc(completion.doneAt), desc(workOrder.number))
    .limit(HISTORY_LIMIT);
  // Routines by the key the import and export use: their code, or the one derived for an uncoded routine.
  const routines = await db
    .select()
    .from(routine)
    .where(and(eq(routine.companyId, companyId), eq(routine.vesselId, vessel.id)));
  // As the export keys them: live routines by code or derived key, retired ones by their code.
  const live = withKeys(
    routines.filter((r) => !r.retiredAt),
    new Map(components.map((c) => [c.id, c.code])),
  );
  const keyOf = new Map([...routines.map((r) => [r.id, r.code ?? ""] as const), ...live.map((r) => [r.id, r.key] as const)]);
  return toCsv(
    columns(vessel.timeZone),
    rows.map((r) => ({ ...r, routine: r.routineId ? (keyOf.get(r.routineId) ?? "") : "" })),
  );
}
