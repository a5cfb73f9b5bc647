// The tenant (company), who belongs to it with which role, and its vessels.
import { sql } from "drizzle-orm";
import { boolean, check, index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uuid } from "drizzle-orm/pg-core";
import { user } from "./auth";

export const memberRole = pgEnum("member_role", ["admin", "superintendent", "chief-engineer", "engineer", "viewer"]);

export const company = pgTable("company", {
  id: uuid().primaryKey().defaultRandom(),
  name: text().notNull(),
  slug: text().notNull().unique(),
  /** Whether a chief engineer may decide deferrals of work that is neither critical nor class-related. */
  chiefDecidesDeferrals: boolean().notNull().default(true),
  /** The vessel-local hour (0–23) of the daily due digest. */
  digestHour: integer().notNull().default(6),
  /** Hours without a reading before the first missing-readings reminder, and between its steps. */
  missingReadingsHours: integer().notNull().default(36),
  missingReadingsStepHours: integer().notNull().default(24),
  /** The company's own names for Keelson's ranks ("oiler" → "wiper"); a rank not named keeps Keelson's word. */
  rankNames: jsonb().$type<Record<string, string>>().notNull().default({}),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

export const membership = pgTable(
  "membership",
  {
    companyId: uuid()
      .notNull()
      .references(() => company.id, { onDelete: "cascade" }),
    userId: text()
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    role: memberRole().notNull(),
    rank: text(),
    /** Set when an administrator invited the user by e-mail; cleared when they set a password. */
    invitedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.companyId, t.userId), index().on(t.userId)],
);

export const vessel = pgTable(
  "vessel",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => company.id, { onDelete: "cascade" }),
    name: text().notNull(),
    imoNumber: text().notNull(),
    code: text().notNull(),
    timeZone: text().notNull(),
    /** Last work-order sequence number used: WO-<code>-<sequence>. */
    workOrderSeq: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    retiredAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    unique().on(t.companyId, t.code),
    unique().on(t.companyId, t.imoNumber),
    index().on(t.companyId, t.name),
    check("vessel_imo_format", sql`${t.imoNumber} ~ '^[0-9]{7}$'`),
    check("vessel_code_format", sql`${t.code} ~ '^[A-Z0-9]{2,6}$'`),
  ],
);

export const vesselAssignment = pgTable(
  "vessel_assignment",
  {
    companyId: uuid()
      .notNull()
      .references(() => company.id, { onDelete: "cascade" }),
    vesselId: uuid()
      .notNull()
      .references(() => vessel.id, { onDelete: "cascade" }),
    userId: text()
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.companyId, t.userId, t.vesselId), index().on(t.companyId, t.vesselId)],
);

/**
 * The ship's clock changes on passage (issue 14): from `effectiveAt` the ship keeps `timeZone` (an
 * IANA zone; a whole-hour offset is stored as `Etc/GMT∓h`). Entered by the chief engineer; the
 * worker moves `vessel.time_zone` to the zone in force (server/vessels/clock.ts), so every reader of
 * the vessel's zone follows the history.
 */
export const vesselClockChange = pgTable(
  "vessel_clock_change",
  {
    id: uuid().primaryKey().defaultRandom(),
    companyId: uuid()
      .notNull()
      .references(() => company.id, { onDelete: "cascade" }),
    vesselId: uuid()
      .notNull()
      .references(() => vessel.id, { onDelete: "cascade" }),
    effectiveAt: timestamp({ withTimezone: true }).notNull(),
    /** The zone kept before the change, for the history's words. */
    fromTimeZone: text().notNull(),
    timeZone: text().notNull(),
    note: text().notNull().default(""),
    enteredBy: text().references(() => user.id, { onDelete: "set null" }),
    enteredAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [unique().on(t.vesselId, t.effectiveAt), index().on(t.companyId, t.vesselId, t.effectiveAt.desc())],
);
