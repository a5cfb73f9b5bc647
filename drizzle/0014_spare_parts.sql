CREATE TABLE "part" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"number" text NOT NULL,
	"maker_ref" text,
	"description" text NOT NULL,
	"unit" text DEFAULT 'piece' NOT NULL,
	"critical" boolean DEFAULT false NOT NULL,
	"minimum_on_board" numeric(12, 3) DEFAULT 0 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "part_companyId_number_unique" UNIQUE("company_id","number"),
	CONSTRAINT "part_minimum" CHECK ("part"."minimum_on_board" >= 0),
	CONSTRAINT "part_number_format" CHECK ("part"."number" ~ '^[A-Za-z0-9][A-Za-z0-9._/-]{0,39}$')
);
--> statement-breakpoint
CREATE TABLE "part_fit" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"component_id" uuid NOT NULL,
	CONSTRAINT "part_fit_partId_componentId_unique" UNIQUE("part_id","component_id")
);
--> statement-breakpoint
CREATE TABLE "routine_part" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"routine_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"quantity" numeric(12, 3) NOT NULL,
	CONSTRAINT "routine_part_routineId_partId_unique" UNIQUE("routine_id","part_id"),
	CONSTRAINT "routine_part_quantity" CHECK ("routine_part"."quantity" > 0)
);
--> statement-breakpoint
CREATE TABLE "stock_movement" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"part_id" uuid NOT NULL,
	"location_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"quantity" numeric(12, 3) NOT NULL,
	"work_order_id" uuid,
	"move_id" uuid,
	"reason" text DEFAULT '' NOT NULL,
	"moved_by" text,
	"moved_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "stock_movement_sign" CHECK (("stock_movement"."kind" in ('received', 'moved-in', 'returned') and "stock_movement"."quantity" > 0)
      or ("stock_movement"."kind" in ('used', 'moved-out') and "stock_movement"."quantity" < 0)
      or ("stock_movement"."kind" = 'counted' and "stock_movement"."quantity" <> 0))
);
--> statement-breakpoint
CREATE TABLE "store_location" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"store" text NOT NULL,
	"rack" text DEFAULT '' NOT NULL,
	"bin" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "store_location_companyId_vesselId_store_rack_bin_unique" UNIQUE("company_id","vessel_id","store","rack","bin")
);
--> statement-breakpoint
ALTER TABLE "part" ADD CONSTRAINT "part_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_fit" ADD CONSTRAINT "part_fit_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_fit" ADD CONSTRAINT "part_fit_part_id_part_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."part"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_fit" ADD CONSTRAINT "part_fit_component_id_component_id_fk" FOREIGN KEY ("component_id") REFERENCES "public"."component"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine_part" ADD CONSTRAINT "routine_part_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine_part" ADD CONSTRAINT "routine_part_routine_id_routine_id_fk" FOREIGN KEY ("routine_id") REFERENCES "public"."routine"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine_part" ADD CONSTRAINT "routine_part_part_id_part_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."part"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_part_id_part_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."part"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_location_id_store_location_id_fk" FOREIGN KEY ("location_id") REFERENCES "public"."store_location"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stock_movement" ADD CONSTRAINT "stock_movement_moved_by_user_id_fk" FOREIGN KEY ("moved_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "store_location" ADD CONSTRAINT "store_location_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "store_location" ADD CONSTRAINT "store_location_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "part_fit_company_id_component_id_index" ON "part_fit" USING btree ("company_id","component_id");--> statement-breakpoint
CREATE INDEX "routine_part_company_id_part_id_index" ON "routine_part" USING btree ("company_id","part_id");--> statement-breakpoint
CREATE INDEX "stock_movement_company_id_vessel_id_part_id_index" ON "stock_movement" USING btree ("company_id","vessel_id","part_id");--> statement-breakpoint
CREATE INDEX "stock_movement_company_id_vessel_id_moved_at_index" ON "stock_movement" USING btree ("company_id","vessel_id","moved_at");