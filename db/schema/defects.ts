// Defect reports (issue 13): what was found on board that no routine planned — a leak, a noisy
// bearing, a failed pump, a measurement out of limits — reported, planned, done and closed by the
// chief engineer with its cause and the action taken to prevent it again (ISM Code §9). Its work is
// a corrective work order, so the Backlog, the Calendar, the port-stay planner, escalations and
// deferrals treat it like any other work.
import { boolean, index, jsonb, pgTable, text, unique, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";
import { component } from "./machinery";
import { companyRef, instant, nowStamp, vesselRef } from "./refs";
import { workOrder } from "./work-orders";

export const DEFECT_SOURCES = ["report", "measurement"] as const;
export type DefectSource = (typeof DEFECT_SOURCES)[number];

/** The parts a defect's repair needs, chosen when it is planned. */
export type DefectPart = { partId: string; quantity: number };

export const defect = pgTable(
  "defect",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: companyRef(),
    vesselId: vesselRef(),
    /** "DR-AG-0007": the vessel's code and its own sequence. */
    number: text().notNull(),
    componentId: uuid()
      .notNull()
      .references(() => component.id, { onDelete: "restrict" }),
    /** The corrective work order that carries the repair. */
    workOrderId: uuid()
      .notNull()
      .references(() => workOrder.id, { onDelete: "cascade" }),
    /** What was found, in a line. */
    title: text().notNull(),
    description: text().notNull().default(""),
    foundAt: instant().notNull(),
    reportedBy: text().references(() => user.id, { onDelete: "set null" }),
    source: text({ enum: DEFECT_SOURCES }).notNull().default("report"),
    affectsCritical: boolean().notNull().default(false),
    affectsSafety: boolean().notNull().default(false),
    affectsClass: boolean().notNull().default(false),
    needsEngineStop: boolean().notNull().default(false),
    parts: jsonb().$type<DefectPart[]>().notNull().default([]),
    plannedAt: instant(),
    /** Closed by the chief engineer, with the cause found and the action against a repeat. */
    cause: text(),
    action: text(),
    closedAt: instant(),
    closedBy: text().references(() => user.id, { onDelete: "set null" }),
    createdAt: nowStamp(),
  },
  (t) => [unique().on(t.companyId, t.number), unique().on(t.workOrderId), index().on(t.companyId, t.vesselId, t.closedAt)],
);
