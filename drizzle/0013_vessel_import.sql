CREATE TABLE "vessel_import" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"imported_by" text,
	"imported_at" timestamp with time zone DEFAULT now() NOT NULL,
	"file_names" jsonb NOT NULL,
	"object_keys" jsonb NOT NULL,
	"counts" jsonb NOT NULL
);
--> statement-breakpoint
ALTER TABLE "routine" ADD COLUMN "code" text;--> statement-breakpoint
ALTER TABLE "vessel_import" ADD CONSTRAINT "vessel_import_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_import" ADD CONSTRAINT "vessel_import_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "vessel_import" ADD CONSTRAINT "vessel_import_imported_by_user_id_fk" FOREIGN KEY ("imported_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "vessel_import_company_id_vessel_id_imported_at_index" ON "vessel_import" USING btree ("company_id","vessel_id","imported_at");--> statement-breakpoint
CREATE UNIQUE INDEX "routine_code_on_vessel" ON "routine" USING btree ("company_id","vessel_id","code");--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_code_format" CHECK ("routine"."code" is null or "routine"."code" ~ '^[A-Z0-9][A-Z0-9._/-]{0,59}$');