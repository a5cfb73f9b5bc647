// Links from the board into one vessel's Backlog, filtered the same way as the figure clicked
// (the Backlog's own query names: server/backlog/contract.ts).
type Filter = { state?: string[]; critical?: boolean; classRelated?: boolean; defects?: boolean; deferral?: "pending" };

export function backlogHref(vesselId: string, filter: Filter): string {
  const q = new URLSearchParams();
  if (filter.state?.length) q.set("state", filter.state.join(","));
  if (filter.critical) q.set("critical", "true");
  if (filter.classRelated) q.set("classRelated", "true");
  if (filter.defects) q.set("defects", "true");
  if (filter.deferral) q.set("deferral", filter.deferral);
  // Commas kept readable in the address bar: the Backlog splits the state list on them.
  const search = q.toString().replace(/%2C/g, ",");
  return `/vessels/${vesselId}/backlog${search ? `?${search}` : ""}`;
}

export const OVERDUE = ["out-of-tolerance", "late"];
