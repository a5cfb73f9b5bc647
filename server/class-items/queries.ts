import "server-only";
import { sql } from "drizzle-orm";
import { getDb } from "@/db/client";
import { OPEN_STATES_BY_URGENCY, type OpenState } from "@/db/schema/work-order-states";
import type { Access } from "@/server/auth/access";
import { formatHours, shipDay } from "@/server/format/hours";
import { describeCalendarRule } from "@/server/scheduling/calendar-rule-words";
import type { ClassItem, ClassItemSort } from "./contract";

type Row = {
  vessel_id: string;
  vessel_name: string;
  vessel_code: string;
  time_zone: string;
  routine_id: string;
  reference: string | null;
  title: string;
  critical: boolean;
  component_code: string;
  component_name: string;
  interval_hours: string | null;
  calendar_rule: string | null;
  anchored: boolean;
  anchor_date: string | null;
  done_at: Date | null;
  done_hours: string | null;
  work_order_id: string | null;
  number: string | null;
  state: OpenState | null;
  due_date: Date | null;
  due_hours: string | null;
  plan_from: string | null;
  plan_until: string | null;
  deferral_status: "pending" | "approved" | null;
  deferral_day: string | null;
  deferral_hours: string | null;
};

const num = (v: string | null) => (v === null ? null : Number(v));

function intervalWords(hours: number | null, rule: string | null): string {
  const parts: string[] = [];
  if (rule) {
    try {
      parts.push(describeCalendarRule(rule));
    } catch {
      parts.push(rule);
    }
  }
  if (hours) parts.push(`every ${formatHours(hours)}`);
  return parts.join(" or ") || "—";
}

/**
 * The class-related routines of the vessels given (those the person may open), each with its last
 * approved completion, its open work order and the deferral in force or asked for on it.
 */
export async function listClassItems(access: Access, vesselIds: string[] | null, sort: ClassItemSort): Promise<ClassItem[]> {
  const assigned = access.assignedVesselIds;
  const { rows } = await getDb().execute<Row>(sql`
    select v.id as vessel_id, v.name as vessel_name, v.code as vessel_code, v.time_zone,
           r.id as routine_id, coalesce(r.class_item_ref, c.class_item_ref) as reference, r.title, r.critical,
           c.code as component_code, c.name as component_name,
           r.interval_hours, r.calendar_rule, r.anchored, r.anchor_date,
           last.done_at, last.counter_hours as done_hours,
           w.id as work_order_id, w.number, w.state, w.due_date, w.due_hours, w.plan_from, w.plan_until,
           d.status as deferral_status, d.proposed_due_day as deferral_day, d.proposed_due_hours as deferral_hours
      from routine r
      join vessel v on v.id = r.vessel_id and v.company_id = ${access.company.id}
      join component c on c.id = r.component_id and c.company_id = ${access.company.id}
      left join lateral (
        select cp.done_at, cp.counter_hours from completion cp
          join work_order dw on dw.id = cp.work_order_id and dw.company_id = ${access.company.id}
         where cp.company_id = ${access.company.id} and dw.routine_id = r.id and cp.status = 'approved'
         order by cp.done_at desc limit 1) last on true
      left join lateral (
        select * from work_order ow
         where ow.company_id = ${access.company.id} and ow.routine_id = r.id and ow.state <> 'done'
         order by ow.occurrence desc limit 1) w on true
      left join lateral (
        select df.status, df.proposed_due_day, df.proposed_due_hours from deferral df
         where df.company_id = ${access.company.id} and df.vessel_id = r.vessel_id and df.work_order_id = w.id
           and df.status in ('pending', 'approved')
         order by df.requested_at desc limit 1) d on true
     where r.company_id = ${access.company.id} and r.class_related and r.retired_at is null
       ${vesselIds ? sql`and r.vessel_id in (${sql.join(vesselIds.map((id) => sql`${id}`), sql`, `)})` : sql``}
       ${assigned ? (assigned.length ? sql`and r.vessel_id in (${sql.join(assigned.map((id) => sql`${id}`), sql`, `)})` : sql`and false`) : sql``}`);

  const items = rows.map((r): ClassItem => {
    const tz = r.time_zone;
    return {
      vessel: { id: r.vessel_id, name: r.vessel_name, code: r.vessel_code },
      routineId: r.routine_id,
      reference: r.reference,
      title: r.title,
      critical: r.critical,
      component: { code: r.component_code, name: r.component_name },
      interval: intervalWords(num(r.interval_hours), r.calendar_rule),
      anniversary: r.anchored ? r.anchor_date : null,
      lastDone: r.done_at ? { day: shipDay(new Date(r.done_at), tz), hours: num(r.done_hours) } : null,
      workOrder:
        r.work_order_id && r.number && r.state
          ? {
              id: r.work_order_id,
              number: r.number,
              state: r.state,
              dueDay: r.due_date ? shipDay(new Date(r.due_date), tz) : null,
              dueHours: num(r.due_hours),
              windowFrom: r.plan_from,
              windowUntil: r.plan_until,
            }
          : null,
      deferral: r.deferral_status
        ? { status: r.deferral_status, toDay: r.deferral_day, toHours: num(r.deferral_hours) }
        : null,
    };
  });
  return items.sort(comparator(sort));
}

const urgency = (item: ClassItem) =>
  item.workOrder ? OPEN_STATES_BY_URGENCY.indexOf(item.workOrder.state) : OPEN_STATES_BY_URGENCY.length;
const text = (a: string | null | undefined, b: string | null | undefined) =>
  (a ?? "\uffff").localeCompare(b ?? "\uffff", "en", { numeric: true });

function comparator(sort: ClassItemSort): (a: ClassItem, b: ClassItem) => number {
  const byReference = (a: ClassItem, b: ClassItem) =>
    text(a.vessel.name, b.vessel.name) || text(a.reference, b.reference) || text(a.component.code, b.component.code);
  switch (sort) {
    case "component":
      return (a, b) => text(a.vessel.name, b.vessel.name) || text(a.component.code, b.component.code) || byReference(a, b);
    case "due":
      return (a, b) => text(a.workOrder?.dueDay, b.workOrder?.dueDay) || byReference(a, b);
    case "state":
      return (a, b) => urgency(a) - urgency(b) || text(a.workOrder?.dueDay, b.workOrder?.dueDay) || byReference(a, b);
    default:
      return byReference;
  }
}
