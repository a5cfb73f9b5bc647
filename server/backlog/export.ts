// The Backlog as CSV: the rows the page shows under the same filters and sort, all pages at once.
import "server-only";
import type { Access, VesselRef } from "@/server/auth/access";
import { type CsvColumn, csvResponse, toCsv } from "@/server/export/csv";
import { shipDay } from "@/server/format/hours";
import type { BacklogFilter, BacklogItem } from "./contract";
import { loadBacklog } from "./queries";

/** More than any vessel's open work; a larger export says to narrow the filters. */
export const EXPORT_LIMIT = 5000;

function columns(timeZone: string): CsvColumn<BacklogItem>[] {
  const day = (iso: string | null) => (iso ? shipDay(new Date(iso), timeZone) : null);
  return [
    { header: "Work order", value: (i) => i.number },
    { header: "Title", value: (i) => i.title },
    { header: "Component", value: (i) => `${i.component.code} ${i.component.name}` },
    { header: "Kind", value: (i) => i.kind },
    { header: "State", value: (i) => i.state.replaceAll("-", " ") },
    { header: "Due day (ship's)", value: (i) => day(i.dueDate) },
    { header: "Due hours", value: (i) => i.dueHours },
    { header: "Projected day", value: (i) => day(i.projectedDate) },
    { header: "Remaining days", value: (i) => i.remainingDays },
    { header: "Remaining hours", value: (i) => i.remainingHours },
    { header: "Planned day", value: (i) => i.plannedDate },
    { header: "Rank", value: (i) => i.rank.replaceAll("-", " ") },
    { header: "Man-hours", value: (i) => i.estimatedManHours },
    { header: "Engine stopped", value: (i) => i.needsEngineStop },
    { header: "Critical", value: (i) => i.critical },
    { header: "Class item", value: (i) => i.classRelated },
    { header: "Awaiting approval", value: (i) => i.awaitingApproval },
    { header: "Deferral asked", value: (i) => i.pendingDeferral },
  ];
}

export async function backlogCsv(
  access: Access,
  vessel: VesselRef,
  f: BacklogFilter,
  now = new Date(),
): Promise<Response> {
  const backlog = await loadBacklog(access, vessel, { ...f, page: 1, pageSize: EXPORT_LIMIT });
  const file = `${vessel.code}-backlog-${shipDay(now, vessel.timeZone)}.csv`;
  return csvResponse(toCsv(columns(vessel.timeZone), backlog.items), file);
}
