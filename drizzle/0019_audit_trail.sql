CREATE TABLE "audit_entry" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL,
	"tx_id" bigint NOT NULL,
	"company_id" uuid,
	"vessel_id" uuid,
	"actor" text,
	"reason" text,
	"table_name" text NOT NULL,
	"record_id" text NOT NULL,
	"refs" text[] DEFAULT '{}'::text[] NOT NULL,
	"action" text NOT NULL,
	"before" jsonb,
	"after" jsonb
);
--> statement-breakpoint
ALTER TABLE "tolerance_rule" ADD COLUMN "grace_on_time" boolean DEFAULT false NOT NULL;--> statement-breakpoint
CREATE INDEX "audit_entry_company_id_at_index" ON "audit_entry" USING btree ("company_id","at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "audit_entry_company_id_table_name_record_id_index" ON "audit_entry" USING btree ("company_id","table_name","record_id");--> statement-breakpoint
CREATE INDEX "audit_entry_company_id_vessel_id_at_index" ON "audit_entry" USING btree ("company_id","vessel_id","at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "audit_entry_company_id_actor_at_index" ON "audit_entry" USING btree ("company_id","actor","at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "audit_entry_refs_index" ON "audit_entry" USING gin ("refs");
--> statement-breakpoint
-- The trail's one mechanism: an AFTER row trigger on every table of records (the list below; a new
-- table gets it with `SELECT keelson_audit_attach('<table>', 'all')` in its migration, and
-- tests/audit/audit.test.ts fails for a table that has neither the trigger nor a line in
-- server/audit/exempt.ts). The person comes from the connection's settings, stamped by db/client.ts.
CREATE FUNCTION keelson_audit() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  actor text := nullif(current_setting('keelson.actor', true), '');
  old_row jsonb;
  new_row jsonb;
  rec jsonb;
  changed_before jsonb;
  changed_after jsonb;
  key_columns text[] := TG_ARGV[1:];
  record_key text;
  related text[];
  company uuid;
BEGIN
  -- 'people': a table the worker writes from other records (work orders); only a person's change is kept.
  IF TG_ARGV[0] = 'people' AND (actor IS NULL OR actor NOT LIKE 'user:%') THEN
    RETURN NULL;
  END IF;
  IF TG_OP <> 'INSERT' THEN old_row := to_jsonb(OLD); END IF;
  IF TG_OP <> 'DELETE' THEN new_row := to_jsonb(NEW); END IF;
  IF TG_OP = 'UPDATE' THEN
    SELECT jsonb_object_agg(n.key, n.value), jsonb_object_agg(n.key, old_row -> n.key)
      INTO changed_after, changed_before
      FROM jsonb_each(new_row) n
      WHERE n.value IS DISTINCT FROM old_row -> n.key
        -- Bookkeeping the worker rewrites on every recompute: not a change anyone made to the record.
        AND n.key NOT IN ('updated_at', 'computed_at', 'running_rate', 'rate_basis', 'rate_computed_at', 'work_order_seq');
    IF changed_after IS NULL THEN RETURN NULL; END IF;
  ELSE
    changed_before := old_row;
    changed_after := new_row;
  END IF;
  rec := coalesce(new_row, old_row);
  SELECT string_agg(rec ->> k, ':') INTO record_key FROM unnest(key_columns) k;
  SELECT coalesce(array_agg(r.value), '{}') INTO related
    FROM jsonb_each_text(rec) r
   WHERE r.key LIKE '%\_id' AND r.key <> 'company_id' AND r.value IS NOT NULL;
  company := coalesce(
    (rec ->> 'company_id')::uuid,
    CASE WHEN TG_TABLE_NAME = 'company' THEN (rec ->> 'id')::uuid END,
    nullif(current_setting('keelson.company', true), '')::uuid,
    CASE WHEN TG_TABLE_NAME = 'user'
      THEN (SELECT m.company_id FROM membership m WHERE m.user_id = rec ->> 'id' LIMIT 1) END
  );
  INSERT INTO audit_entry (tx_id, company_id, vessel_id, actor, reason, table_name, record_id, refs, action, before, after)
  VALUES (
    txid_current(),
    company,
    CASE WHEN TG_TABLE_NAME = 'vessel' THEN (rec ->> 'id')::uuid ELSE (rec ->> 'vessel_id')::uuid END,
    actor,
    nullif(current_setting('keelson.reason', true), ''),
    TG_TABLE_NAME,
    coalesce(record_key, '?'),
    related,
    lower(TG_OP),
    changed_before,
    changed_after
  );
  RETURN NULL;
END $$;
--> statement-breakpoint
CREATE FUNCTION keelson_audit_attach(tbl text, mode text) RETURNS void LANGUAGE plpgsql AS $$
DECLARE
  key_args text;
BEGIN
  -- The primary key names a record; a table without one (a membership) is named by its first unique key.
  SELECT string_agg(quote_literal(a.attname), ', ' ORDER BY array_position(i.indkey::int2[], a.attnum))
    INTO key_args
    FROM (SELECT * FROM pg_index
           WHERE indrelid = format('public.%I', tbl)::regclass AND (indisprimary OR indisunique)
           ORDER BY indisprimary DESC, indexrelid
           LIMIT 1) i
    JOIN pg_attribute a ON a.attrelid = i.indrelid AND a.attnum = ANY (i.indkey::int2[])
   GROUP BY i.indexrelid;
  IF key_args IS NULL THEN
    RAISE EXCEPTION 'table % has no primary or unique key to name its records by', tbl;
  END IF;
  EXECUTE format('DROP TRIGGER IF EXISTS audit_row ON public.%I', tbl);
  EXECUTE format(
    'CREATE TRIGGER audit_row AFTER INSERT OR UPDATE OR DELETE ON public.%I FOR EACH ROW EXECUTE FUNCTION keelson_audit(%L, %s)',
    tbl, mode, key_args);
END $$;
--> statement-breakpoint
CREATE FUNCTION keelson_audit_refuse() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  RAISE EXCEPTION 'the audit trail is kept as written: entries are never changed or deleted';
END $$;
--> statement-breakpoint
CREATE TRIGGER audit_entry_kept BEFORE UPDATE OR DELETE ON audit_entry
  FOR EACH ROW EXECUTE FUNCTION keelson_audit_refuse();
--> statement-breakpoint
SELECT keelson_audit_attach(t, CASE WHEN t = 'work_order' THEN 'people' ELSE 'all' END)
  FROM unnest(ARRAY[
    'company', 'membership', 'vessel', 'vessel_assignment', 'user',
    'counter', 'counter_segment', 'component', 'reading',
    'tolerance_rule', 'routine', 'routine_part',
    'work_order', 'completion', 'completion_attachment', 'deferral', 'defect',
    'port_stay', 'work_package_item',
    'part', 'part_fit', 'store_location', 'stock_movement', 'requisition', 'requisition_line',
    'mail_opt_out', 'vessel_import'
  ]) t;
--> statement-breakpoint
-- The reading corrections kept before the trail existed become entries of it (the reading's own
-- change, with the reason); later corrections are written by the reading's trigger.
INSERT INTO audit_entry (at, tx_id, company_id, vessel_id, actor, reason, table_name, record_id, refs, action, before, after)
SELECT c.corrected_at, 0, c.company_id, c.vessel_id, 'user:' || c.corrected_by, c.reason, 'reading',
       coalesce(c.reading_id::text, c.id::text), ARRAY[c.vessel_id::text, c.counter_id::text],
       CASE c.kind WHEN 'removed' THEN 'delete' ELSE 'update' END,
       jsonb_build_object('counter_id', c.counter_id, 'read_at', c.read_at, 'meter_value', c.old_meter_value, 'remark', c.old_remark),
       CASE c.kind WHEN 'removed' THEN NULL
         ELSE jsonb_build_object('meter_value', c.new_meter_value, 'remark', c.new_remark) END
  FROM reading_correction c
 ORDER BY c.corrected_at;
--> statement-breakpoint
SELECT set_config('keelson.actor', 'system:upgrade', true);
--> statement-breakpoint
-- The class-survey presets as shipped count their whole window on time (HSSC, IMO Res. A.1104(29)
-- 4.2.1); a rule the company renamed or changed keeps its own setting, to be ticked on Tolerance rules.
UPDATE "tolerance_rule" SET "grace_on_time" = true
 WHERE "name" IN ('Annual: 3 months either side of the anniversary', 'Two to three years: 3 months either side');
