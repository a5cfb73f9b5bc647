CREATE TABLE "requisition" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"number" text NOT NULL,
	"port_stay_id" uuid,
	"state" text DEFAULT 'drafted' NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"order_ref" text DEFAULT '' NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"sent_at" timestamp with time zone,
	"ordered_at" timestamp with time zone,
	"delivered_at" timestamp with time zone,
	"cancelled_at" timestamp with time zone,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "requisition_companyId_number_unique" UNIQUE("company_id","number")
);
--> statement-breakpoint
CREATE TABLE "requisition_line" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"requisition_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"quantity" numeric(12, 3) NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"position" integer DEFAULT 0 NOT NULL,
	CONSTRAINT "requisition_line_requisitionId_partId_unique" UNIQUE("requisition_id","part_id"),
	CONSTRAINT "requisition_line_quantity" CHECK ("requisition_line"."quantity" > 0)
);
--> statement-breakpoint
ALTER TABLE "stock_movement" ADD COLUMN "requisition_line_id" uuid;--> statement-breakpoint
ALTER TABLE "requisition" ADD CONSTRAINT "requisition_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "requisition" ADD CONSTRAINT "requisition_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "requisition" ADD CONSTRAINT "requisition_port_stay_id_port_stay_id_fk" FOREIGN KEY ("port_stay_id") REFERENCES "public"."port_stay"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "requisition" ADD CONSTRAINT "requisition_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "requisition_line" ADD CONSTRAINT "requisition_line_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "requisition_line" ADD CONSTRAINT "requisition_line_requisition_id_requisition_id_fk" FOREIGN KEY ("requisition_id") REFERENCES "public"."requisition"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "requisition_line" ADD CONSTRAINT "requisition_line_part_id_part_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."part"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "requisition_company_id_vessel_id_state_index" ON "requisition" USING btree ("company_id","vessel_id","state");--> statement-breakpoint
CREATE INDEX "requisition_line_company_id_part_id_index" ON "requisition_line" USING btree ("company_id","part_id");--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_requisition_line_id_requisition_line_id_fk" FOREIGN KEY ("requisition_line_id") REFERENCES "public"."requisition_line"("id") ON DELETE set null ON UPDATE no action;