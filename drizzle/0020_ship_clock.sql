CREATE TABLE "vessel_clock_change" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"effective_at" timestamp with time zone NOT NULL,
	"from_time_zone" text NOT NULL,
	"time_zone" text NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"entered_by" text,
	"entered_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "vessel_clock_change_vesselId_effectiveAt_unique" UNIQUE("vessel_id","effective_at")
);
--> statement-breakpoint
ALTER TABLE "vessel_clock_change" ADD CONSTRAINT "vessel_clock_change_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_clock_change" ADD CONSTRAINT "vessel_clock_change_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_clock_change" ADD CONSTRAINT "vessel_clock_change_entered_by_user_id_fk" FOREIGN KEY ("entered_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "vessel_clock_change_company_id_vessel_id_effective_at_index" ON "vessel_clock_change" USING btree ("company_id","vessel_id","effective_at" DESC NULLS LAST);--> statement-breakpoint
SELECT keelson_audit_attach('vessel_clock_change', 'all');
