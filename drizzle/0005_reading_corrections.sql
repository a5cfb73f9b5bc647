CREATE TABLE "reading_correction" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"reading_id" uuid,
	"counter_id" uuid NOT NULL,
	"read_at" timestamp with time zone NOT NULL,
	"segment" integer NOT NULL,
	"kind" text NOT NULL,
	"old_meter_value" numeric(12, 1) NOT NULL,
	"new_meter_value" numeric(12, 1),
	"old_remark" text,
	"new_remark" text,
	"reason" text NOT NULL,
	"corrected_by" text,
	"corrected_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reading_correction_new_value" CHECK (("reading_correction"."kind" = 'removed') = ("reading_correction"."new_meter_value" is null))
);
--> statement-breakpoint
ALTER TABLE "reading_correction" ADD CONSTRAINT "reading_correction_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_correction" ADD CONSTRAINT "reading_correction_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_correction" ADD CONSTRAINT "reading_correction_reading_id_reading_id_fk" FOREIGN KEY ("reading_id") REFERENCES "public"."reading"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_correction" ADD CONSTRAINT "reading_correction_counter_id_counter_id_fk" FOREIGN KEY ("counter_id") REFERENCES "public"."counter"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reading_correction" ADD CONSTRAINT "reading_correction_corrected_by_user_id_fk" FOREIGN KEY ("corrected_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "reading_correction_company_id_counter_id_read_at_index" ON "reading_correction" USING btree ("company_id","counter_id","read_at");--> statement-breakpoint
CREATE INDEX "reading_correction_company_id_reading_id_index" ON "reading_correction" USING btree ("company_id","reading_id");