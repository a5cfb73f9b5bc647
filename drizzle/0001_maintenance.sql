CREATE TYPE "public"."interval_kind" AS ENUM('hours', 'calendar');--> statement-breakpoint
CREATE TYPE "public"."tolerance_unit" AS ENUM('days', 'months', 'hours', 'percent');--> statement-breakpoint
CREATE TYPE "public"."work_order_state" AS ENUM('scheduled', 'window-open', 'late', 'out-of-tolerance', 'deferred', 'done');--> statement-breakpoint
CREATE TABLE "completion" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"work_order_id" uuid NOT NULL,
	"done_at" timestamp with time zone NOT NULL,
	"counter_hours" numeric(12, 1),
	"man_hours" numeric(6, 1) NOT NULL,
	"checklist" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"measurements" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"remarks" text DEFAULT '' NOT NULL,
	"done_by" text,
	"status" text DEFAULT 'awaiting-approval' NOT NULL,
	"decided_by" text,
	"decided_at" timestamp with time zone,
	"decision_note" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "completion_workOrderId_unique" UNIQUE("work_order_id")
);
--> statement-breakpoint
CREATE TABLE "routine" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"component_id" uuid NOT NULL,
	"title" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"checklist" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"interval_hours" numeric(12, 1),
	"calendar_rule" text,
	"anchored" boolean DEFAULT false NOT NULL,
	"anchor_date" date,
	"estimated_man_hours" numeric(6, 1) DEFAULT 1 NOT NULL,
	"rank" text DEFAULT 'engineer' NOT NULL,
	"needs_engine_stop" boolean DEFAULT false NOT NULL,
	"critical" boolean DEFAULT false NOT NULL,
	"class_related" boolean DEFAULT false NOT NULL,
	"class_item_ref" text,
	"measurements" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"spare_parts" text DEFAULT '' NOT NULL,
	"cautions" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"baseline_at" timestamp with time zone,
	"baseline_hours" numeric(12, 1),
	"tolerance_rule_id" uuid,
	"revision" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone,
	CONSTRAINT "routine_has_interval" CHECK ("routine"."interval_hours" is not null or "routine"."calendar_rule" is not null),
	CONSTRAINT "routine_interval_positive" CHECK ("routine"."interval_hours" is null or "routine"."interval_hours" > 0)
);
--> statement-breakpoint
CREATE TABLE "tolerance_rule" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"name" text NOT NULL,
	"kind" interval_kind NOT NULL,
	"min_interval" numeric(10, 1) NOT NULL,
	"max_interval" numeric(10, 1) NOT NULL,
	"window_before_value" numeric(8, 2) NOT NULL,
	"window_before_unit" "tolerance_unit" NOT NULL,
	"grace_after_value" numeric(8, 2) NOT NULL,
	"grace_after_unit" "tolerance_unit" NOT NULL,
	"cap_hours" numeric(12, 1),
	"keeps_anniversary" boolean DEFAULT false NOT NULL,
	"sort_order" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tolerance_rule_companyId_name_unique" UNIQUE("company_id","name"),
	CONSTRAINT "tolerance_rule_range" CHECK ("tolerance_rule"."min_interval" <= "tolerance_rule"."max_interval")
);
--> statement-breakpoint
CREATE TABLE "work_order" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"routine_id" uuid,
	"component_id" uuid NOT NULL,
	"counter_id" uuid,
	"number" text NOT NULL,
	"occurrence" integer NOT NULL,
	"kind" text DEFAULT 'planned' NOT NULL,
	"title" text NOT NULL,
	"state" "work_order_state" NOT NULL,
	"state_changed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"due_date" timestamp with time zone,
	"due_hours" numeric(12, 1),
	"projected_date" timestamp with time zone,
	"calendar_due" timestamp with time zone,
	"governing" interval_kind,
	"window_opens_at" timestamp with time zone,
	"grace_ends_at" timestamp with time zone,
	"window_opens_hours" numeric(12, 1),
	"grace_ends_hours" numeric(12, 1),
	"remaining_hours" numeric(12, 1),
	"remaining_days" numeric(8, 1),
	"planned_date" date,
	"rank" text DEFAULT 'engineer' NOT NULL,
	"estimated_man_hours" numeric(6, 1) DEFAULT 1 NOT NULL,
	"needs_engine_stop" boolean DEFAULT false NOT NULL,
	"critical" boolean DEFAULT false NOT NULL,
	"class_related" boolean DEFAULT false NOT NULL,
	"computed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"completed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "work_order_companyId_number_unique" UNIQUE("company_id","number")
);
--> statement-breakpoint
CREATE TABLE "work_order_state_change" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"work_order_id" uuid NOT NULL,
	"from_state" "work_order_state",
	"to_state" "work_order_state" NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"escalated_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "vessel" ADD COLUMN "work_order_seq" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "completion" ADD CONSTRAINT "completion_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion" ADD CONSTRAINT "completion_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion" ADD CONSTRAINT "completion_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion" ADD CONSTRAINT "completion_done_by_user_id_fk" FOREIGN KEY ("done_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion" ADD CONSTRAINT "completion_decided_by_user_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_component_id_component_id_fk" FOREIGN KEY ("component_id") REFERENCES "public"."component"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_tolerance_rule_id_tolerance_rule_id_fk" FOREIGN KEY ("tolerance_rule_id") REFERENCES "public"."tolerance_rule"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tolerance_rule" ADD CONSTRAINT "tolerance_rule_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order" ADD CONSTRAINT "work_order_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order" ADD CONSTRAINT "work_order_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order" ADD CONSTRAINT "work_order_routine_id_routine_id_fk" FOREIGN KEY ("routine_id") REFERENCES "public"."routine"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order" ADD CONSTRAINT "work_order_component_id_component_id_fk" FOREIGN KEY ("component_id") REFERENCES "public"."component"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order" ADD CONSTRAINT "work_order_counter_id_counter_id_fk" FOREIGN KEY ("counter_id") REFERENCES "public"."counter"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order_state_change" ADD CONSTRAINT "work_order_state_change_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_order_state_change" ADD CONSTRAINT "work_order_state_change_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "completion_company_id_vessel_id_done_at_index" ON "completion" USING btree ("company_id","vessel_id","done_at");--> statement-breakpoint
CREATE INDEX "routine_company_id_vessel_id_index" ON "routine" USING btree ("company_id","vessel_id");--> statement-breakpoint
CREATE INDEX "routine_company_id_component_id_index" ON "routine" USING btree ("company_id","component_id");--> statement-breakpoint
CREATE INDEX "tolerance_rule_company_id_kind_index" ON "tolerance_rule" USING btree ("company_id","kind");--> statement-breakpoint
CREATE UNIQUE INDEX "work_order_routine_occurrence" ON "work_order" USING btree ("routine_id","occurrence");--> statement-breakpoint
CREATE INDEX "work_order_company_id_vessel_id_state_due_date_index" ON "work_order" USING btree ("company_id","vessel_id","state","due_date");--> statement-breakpoint
CREATE INDEX "work_order_company_id_vessel_id_component_id_index" ON "work_order" USING btree ("company_id","vessel_id","component_id");--> statement-breakpoint
CREATE INDEX "work_order_state_change_company_id_work_order_id_changed_at_index" ON "work_order_state_change" USING btree ("company_id","work_order_id","changed_at");