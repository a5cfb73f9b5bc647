// Columns every tenant table repeats: the company (the tenant key), the vessel, timestamps.
import { timestamp, uuid } from "drizzle-orm/pg-core";
import { company, vessel } from "./tenancy";

export const companyRef = () =>
  uuid()
    .notNull()
    .references(() => company.id, { onDelete: "cascade" });

export const vesselRef = () =>
  uuid()
    .notNull()
    .references(() => vessel.id, { onDelete: "cascade" });

export const instant = () => timestamp({ withTimezone: true });
/** A timestamp that defaults to the time of the insert. */
export const nowStamp = () => instant().notNull().defaultNow();
