// Tables of the public schema without the audit trigger, each with the reason. Every other table
// must carry it: tests/audit/audit.test.ts reads the catalogue and fails for a table that has
// neither (a new table's migration calls `SELECT keelson_audit_attach('<table>', 'all')`).
export const AUDIT_EXEMPT: Record<string, string> = {
  audit_entry: "the trail itself",
  session: "better-auth's sign-in sessions: not records, renewed on every visit",
  account: "better-auth's password hashes: never copied anywhere",
  verification: "better-auth's one-time tokens",
  sign_in_failure: "the sign-in limit's counters, keyed by a hash",
  mail_outbox: "the outbox is itself the log of every message",
  vessel_snapshot: "the worker's daily figures, computed from the records",
  routine_plan_problem: "the worker's findings, computed from the routines",
  work_order_state_change: "the worker's log of derived states",
  reading_correction: "the Hour log's own list; the reading's entry in the trail carries the same change and reason",
};
