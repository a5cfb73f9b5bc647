// Copying a whole vessel's plan to a sister ship: its register, counters (new, with empty meters)
// and routines with their settings (not the readings: the sister ship has its own meters), through the import's own checks, preview and apply. The copied
// routines count from the day of the copy at 0 h on the sister ship's new meters (a routine the
// ship already has keeps its own baseline, or with "only what is missing" is left as it is); the
// source's history stays where it was done.
import "server-only";
import { and, eq, inArray } from "drizzle-orm";
import { z } from "zod";
import { getDb } from "@/db/client";
import { vessel as vesselTable } from "@/db/schema";
import type { Access, VesselRef } from "@/server/auth/access";
import { shipDay } from "@/server/format/hours";
import { invalidInput } from "@/server/http/problem";
import { exportRows } from "./export";
import type { ImportKind } from "./layout";
import type { ImportSheet } from "./read-file";
import type { ImportSource } from "./service";
import { loadVesselRows } from "./vessel-now";

export const CopyRequest = z.object({
  fromVesselId: z.uuid({ message: "Choose the vessel to copy the plan from." }),
  /** false: what the copy would do; true: do it. */
  apply: z.boolean({ message: "apply must be true or false." }).default(false),
  /** true: what this vessel has already (by code or name) is left as it is; only the rest is added. */
  onlyMissing: z.boolean({ message: "onlyMissing must be true or false." }).default(false),
});
export type CopyRequest = z.input<typeof CopyRequest>;

const noSuchVessel = () => invalidInput([{ field: "fromVesselId", message: "There is no such vessel of yours to copy from." }]);

/** The source vessel, when it is the company's and the user may open it, and not the target itself. */
async function sourceVessel(access: Access, target: VesselRef, id: string): Promise<VesselRef> {
  if (id === target.id) throw invalidInput([{ field: "fromVesselId", message: "Choose another vessel: this is the one the plan goes to." }]);
  if (access.assignedVesselIds && !access.assignedVesselIds.includes(id)) throw noSuchVessel();
  const [row] = await getDb()
    .select()
    .from(vesselTable)
    .where(and(eq(vesselTable.companyId, access.company.id), inArray(vesselTable.id, [id])));
  if (!row) throw noSuchVessel();
  return row;
}

export async function copySource(access: Access, target: VesselRef, input: z.output<typeof CopyRequest>, now = new Date()): Promise<ImportSource> {
  const from = await sourceVessel(access, target, input.fromVesselId);
  const today = shipDay(now, target.timeZone);
  return {
    names: [`the plan of ${from.name}`],
    retire: false,
    files: [],
    keepBaselines: true,
    read: async (tx) => {
      // The sister ship's readings are not copied: they are not read.
      const rows = await exportRows(access, from, { withReadings: false });
      if (input.onlyMissing) {
        const here = await loadVesselRows(tx, access, target);
        rows.components = rows.components.filter((c) => !here.now.components.has(c.code ?? ""));
        rows.counters = rows.counters.filter((c) => !here.now.counters.has((c.counter ?? "").toLowerCase()));
        rows.routines = rows.routines.filter((r) => !here.now.routines.has(r.code ?? ""));
      }
      // The sister ship's meters are new: every routine counts from today at 0 h.
      rows.readings = [];
      rows["last-done"] = rows.routines.map((r) => ({ routine: r.code ?? "", done_on: today, counter_hours: r.every_hours ? "0" : "", remarks: "" }));
      const sheets: ImportSheet[] = (Object.keys(rows) as ImportKind[]).map((kind) => ({
        kind,
        source: `${from.name} › ${kind}`,
        rows: rows[kind].map((values, i) => ({ line: i + 2, values })),
        decimalComma: false,
      }));
      return { sheets, problems: [] };
    },
  };
}
