CREATE TABLE "routine_plan_problem" (
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"routine_id" uuid NOT NULL,
	"reason" text NOT NULL,
	"since" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "routine_plan_problem_company_id_routine_id_pk" PRIMARY KEY("company_id","routine_id")
);
--> statement-breakpoint
ALTER TABLE "routine_plan_problem" ADD CONSTRAINT "routine_plan_problem_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine_plan_problem" ADD CONSTRAINT "routine_plan_problem_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "routine_plan_problem" ADD CONSTRAINT "routine_plan_problem_routine_id_routine_id_fk" FOREIGN KEY ("routine_id") REFERENCES "public"."routine"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "routine_plan_problem_company_id_vessel_id_index" ON "routine_plan_problem" USING btree ("company_id","vessel_id");