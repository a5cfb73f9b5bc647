CREATE TYPE "public"."deferral_status" AS ENUM('pending', 'approved', 'rejected', 'withdrawn');--> statement-breakpoint
CREATE TABLE "deferral" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"work_order_id" uuid NOT NULL,
	"status" "deferral_status" DEFAULT 'pending' NOT NULL,
	"reason" text NOT NULL,
	"proposed_due_day" date,
	"proposed_due_hours" numeric(12, 1),
	"needs_office" boolean NOT NULL,
	"requested_by" text,
	"requested_at" timestamp with time zone DEFAULT now() NOT NULL,
	"decided_by" text,
	"decided_at" timestamp with time zone,
	"decision_note" text,
	CONSTRAINT "deferral_has_limit" CHECK ("deferral"."proposed_due_day" is not null or "deferral"."proposed_due_hours" is not null)
);
--> statement-breakpoint
CREATE TABLE "port_stay" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"port" text NOT NULL,
	"arrives_at" timestamp with time zone NOT NULL,
	"departs_at" timestamp with time zone NOT NULL,
	"engine_may_stop" boolean DEFAULT false NOT NULL,
	"immobilisation_hours" numeric(6, 1) DEFAULT 0 NOT NULL,
	"crew" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"remarks" text DEFAULT '' NOT NULL,
	"package_accepted_at" timestamp with time zone,
	"package_accepted_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "port_stay_order" CHECK ("port_stay"."departs_at" > "port_stay"."arrives_at"),
	CONSTRAINT "port_stay_immobilisation" CHECK ("port_stay"."immobilisation_hours" >= 0)
);
--> statement-breakpoint
CREATE TABLE "work_package_item" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"port_stay_id" uuid NOT NULL,
	"work_order_id" uuid NOT NULL,
	"planned_date" date NOT NULL,
	"reason" text NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "work_package_item_portStayId_workOrderId_unique" UNIQUE("port_stay_id","work_order_id")
);
--> statement-breakpoint
ALTER TABLE "company" ADD COLUMN "chief_decides_deferrals" boolean DEFAULT true NOT NULL;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "plan_from" date;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "plan_until" date;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "out_of_tolerance_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "deferred_due_date" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "deferred_due_hours" numeric(12, 1);--> statement-breakpoint
ALTER TABLE "deferral" ADD CONSTRAINT "deferral_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deferral" ADD CONSTRAINT "deferral_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deferral" ADD CONSTRAINT "deferral_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deferral" ADD CONSTRAINT "deferral_requested_by_user_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deferral" ADD CONSTRAINT "deferral_decided_by_user_id_fk" FOREIGN KEY ("decided_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "port_stay" ADD CONSTRAINT "port_stay_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "port_stay" ADD CONSTRAINT "port_stay_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "port_stay" ADD CONSTRAINT "port_stay_package_accepted_by_user_id_fk" FOREIGN KEY ("package_accepted_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD CONSTRAINT "work_package_item_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD CONSTRAINT "work_package_item_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD CONSTRAINT "work_package_item_port_stay_id_port_stay_id_fk" FOREIGN KEY ("port_stay_id") REFERENCES "public"."port_stay"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD CONSTRAINT "work_package_item_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "deferral_one_pending" ON "deferral" USING btree ("work_order_id") WHERE "deferral"."status" = 'pending';--> statement-breakpoint
CREATE INDEX "deferral_company_id_vessel_id_status_index" ON "deferral" USING btree ("company_id","vessel_id","status");--> statement-breakpoint
CREATE INDEX "port_stay_company_id_vessel_id_arrives_at_index" ON "port_stay" USING btree ("company_id","vessel_id","arrives_at");--> statement-breakpoint
CREATE INDEX "work_package_item_company_id_work_order_id_index" ON "work_package_item" USING btree ("company_id","work_order_id");