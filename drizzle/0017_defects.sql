CREATE TABLE "defect" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"number" text NOT NULL,
	"component_id" uuid NOT NULL,
	"work_order_id" uuid NOT NULL,
	"title" text NOT NULL,
	"description" text DEFAULT '' NOT NULL,
	"found_at" timestamp with time zone NOT NULL,
	"reported_by" text,
	"source" text DEFAULT 'report' NOT NULL,
	"affects_critical" boolean DEFAULT false NOT NULL,
	"affects_safety" boolean DEFAULT false NOT NULL,
	"affects_class" boolean DEFAULT false NOT NULL,
	"needs_engine_stop" boolean DEFAULT false NOT NULL,
	"parts" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"planned_at" timestamp with time zone,
	"cause" text,
	"action" text,
	"closed_at" timestamp with time zone,
	"closed_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "defect_companyId_number_unique" UNIQUE("company_id","number"),
	CONSTRAINT "defect_workOrderId_unique" UNIQUE("work_order_id")
);
--> statement-breakpoint
ALTER TABLE "defect" ADD CONSTRAINT "defect_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "defect" ADD CONSTRAINT "defect_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "defect" ADD CONSTRAINT "defect_component_id_component_id_fk" FOREIGN KEY ("component_id") REFERENCES "public"."component"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "defect" ADD CONSTRAINT "defect_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "defect" ADD CONSTRAINT "defect_reported_by_user_id_fk" FOREIGN KEY ("reported_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "defect" ADD CONSTRAINT "defect_closed_by_user_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "defect_company_id_vessel_id_closed_at_index" ON "defect" USING btree ("company_id","vessel_id","closed_at");