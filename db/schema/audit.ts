// The audit trail (issue 14): one row per change of a record, written by the PostgreSQL trigger
// `keelson_audit` (drizzle/0019_audit_trail.sql) in the transaction of the change. The acting person
// comes from the connection's `keelson.actor` setting, which db/client.ts stamps from the request's
// actor (db/actor.ts) when a connection is taken from the pool. No foreign keys: an entry outlives
// the record, the user and the vessel it names. Rows are never updated or deleted (a trigger refuses).
import { sql } from "drizzle-orm";
import { bigint, bigserial, index, jsonb, pgTable, text, uuid } from "drizzle-orm/pg-core";
import { nowStamp } from "./refs";

export const AUDIT_ACTIONS = ["insert", "update", "delete"] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const auditEntry = pgTable(
  "audit_entry",
  {
    id: bigserial({ mode: "number" }).primaryKey(),
    /** The transaction's start: every entry of one change has the same instant and `txId`. */
    at: nowStamp(),
    txId: bigint({ mode: "number" }).notNull(),
    /** Null only for rows written outside any company's context (none today). */
    companyId: uuid(),
    vesselId: uuid(),
    /** `user:<id>` for a person, `system:<what>` for the worker, the demo set-up or a script; null when unknown. */
    actor: text(),
    /** The reason the person gave, where one was asked (a reading corrected, a deferral decided). */
    reason: text(),
    tableName: text().notNull(),
    recordId: text().notNull(),
    /** The row's other ids (its `*_id` columns but the company's): a record's trail finds its family by them. */
    refs: text().array().notNull().default(sql`'{}'::text[]`),
    action: text({ enum: AUDIT_ACTIONS }).notNull(),
    /** Insert: null. Update: the changed columns' old values. Delete: the whole row. */
    before: jsonb().$type<Record<string, unknown>>(),
    /** Insert: the whole row. Update: the changed columns' new values. Delete: null. */
    after: jsonb().$type<Record<string, unknown>>(),
  },
  (t) => [
    index().on(t.companyId, t.at.desc()),
    index().on(t.companyId, t.tableName, t.recordId),
    index().on(t.companyId, t.vesselId, t.at.desc()),
    index().on(t.companyId, t.actor, t.at.desc()),
    index().using("gin", t.refs),
  ],
);
