CREATE TYPE "public"."mail_kind" AS ENUM('due-digest', 'missing-readings', 'escalation', 'fleet-summary', 'invitation', 'password-reset');--> statement-breakpoint
CREATE TYPE "public"."mail_status" AS ENUM('pending', 'sending', 'sent', 'failed');--> statement-breakpoint
CREATE TABLE "mail_opt_out" (
	"company_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"kind" "mail_kind" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "mail_opt_out_companyId_userId_kind_unique" UNIQUE("company_id","user_id","kind")
);
--> statement-breakpoint
CREATE TABLE "mail_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"user_id" text,
	"to_address" text NOT NULL,
	"kind" "mail_kind" NOT NULL,
	"dedupe_key" text NOT NULL,
	"subject" text NOT NULL,
	"html" text NOT NULL,
	"text" text NOT NULL,
	"status" "mail_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"claimed_until" timestamp with time zone,
	"sent_at" timestamp with time zone,
	"message_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "mail_outbox_dedupeKey_unique" UNIQUE("dedupe_key")
);
--> statement-breakpoint
CREATE TABLE "vessel_snapshot" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"day" date NOT NULL,
	"scheduled" integer DEFAULT 0 NOT NULL,
	"window_open" integer DEFAULT 0 NOT NULL,
	"late" integer DEFAULT 0 NOT NULL,
	"out_of_tolerance" integer DEFAULT 0 NOT NULL,
	"deferred" integer DEFAULT 0 NOT NULL,
	"critical_late" integer DEFAULT 0 NOT NULL,
	"critical_out_of_tolerance" integer DEFAULT 0 NOT NULL,
	"class_late" integer DEFAULT 0 NOT NULL,
	"class_out_of_tolerance" integer DEFAULT 0 NOT NULL,
	"pending_deferrals" integer DEFAULT 0 NOT NULL,
	"last_reading_at" timestamp with time zone,
	"completed90" integer DEFAULT 0 NOT NULL,
	"on_time_rate" numeric(5, 4),
	"taken_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "vessel_snapshot_vesselId_day_unique" UNIQUE("vessel_id","day")
);
--> statement-breakpoint
ALTER TABLE "company" ADD COLUMN "digest_hour" integer DEFAULT 6 NOT NULL;--> statement-breakpoint
ALTER TABLE "company" ADD COLUMN "missing_readings_hours" integer DEFAULT 36 NOT NULL;--> statement-breakpoint
ALTER TABLE "company" ADD COLUMN "missing_readings_step_hours" integer DEFAULT 24 NOT NULL;--> statement-breakpoint
ALTER TABLE "membership" ADD COLUMN "invited_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "mail_opt_out" ADD CONSTRAINT "mail_opt_out_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_opt_out" ADD CONSTRAINT "mail_opt_out_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD CONSTRAINT "mail_outbox_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "mail_outbox" ADD CONSTRAINT "mail_outbox_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_snapshot" ADD CONSTRAINT "vessel_snapshot_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_snapshot" ADD CONSTRAINT "vessel_snapshot_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "mail_outbox_status_next_attempt_at_index" ON "mail_outbox" USING btree ("status","next_attempt_at");--> statement-breakpoint
CREATE INDEX "mail_outbox_company_id_created_at_index" ON "mail_outbox" USING btree ("company_id","created_at");--> statement-breakpoint
CREATE INDEX "vessel_snapshot_company_id_day_index" ON "vessel_snapshot" USING btree ("company_id","day");