ALTER TABLE "port_stay" DROP CONSTRAINT "port_stay_immobilisation";--> statement-breakpoint
ALTER TABLE "routine" DROP CONSTRAINT "routine_has_interval";--> statement-breakpoint
ALTER TABLE "completion" ADD COLUMN "responsible_id" text;--> statement-breakpoint
ALTER TABLE "completion" ADD COLUMN "worked_by" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "port_stay" ADD COLUMN "workday_from" smallint DEFAULT 480 NOT NULL;--> statement-breakpoint
ALTER TABLE "port_stay" ADD COLUMN "workday_to" smallint DEFAULT 1020 NOT NULL;--> statement-breakpoint
ALTER TABLE "port_stay" ADD COLUMN "engine_stop_from" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "port_stay" ADD COLUMN "engine_stop_to" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "port_stay" ADD COLUMN "watches" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "routine" ADD COLUMN "team" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "routine" ADD COLUMN "elapsed_hours" numeric(6, 1) DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "routine" ADD COLUMN "needs_port" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "routine" ADD COLUMN "port_event" text;--> statement-breakpoint
ALTER TABLE "routine" ADD COLUMN "port_event_hours" numeric(5, 1);--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "team" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "elapsed_hours" numeric(6, 1) DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "needs_port" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "port_event" text;--> statement-breakpoint
ALTER TABLE "work_order" ADD COLUMN "port_event_hours" numeric(5, 1);--> statement-breakpoint
ALTER TABLE "work_package_item" ADD COLUMN "starts_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD COLUMN "ends_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD COLUMN "segments" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "work_package_item" ADD COLUMN "people" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "completion" ADD CONSTRAINT "completion_responsible_id_user_id_fk" FOREIGN KEY ("responsible_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
-- Data: an immobilisation budget becomes a slot from the arrival; a rank's man-hours a day become
-- people (8 h a person, at least one where there were hours); accepted jobs get a start at 08:00 of
-- their day in the vessel's zone and one working period as long as their man-hours.
UPDATE "port_stay" SET "engine_stop_from" = "arrives_at", "engine_stop_to" = least("departs_at", "arrives_at" + "immobilisation_hours" * interval '1 hour') WHERE "engine_may_stop" AND "immobilisation_hours" > 0;--> statement-breakpoint
UPDATE "port_stay" SET "crew" = (SELECT coalesce(jsonb_agg(jsonb_build_object('rank', e->>'rank', 'count', CASE WHEN coalesce((e->>'manHoursPerDay')::numeric, 0) <= 0 THEN 0 ELSE greatest(1, round((e->>'manHoursPerDay')::numeric / 8))::int END)), '[]'::jsonb) FROM jsonb_array_elements("crew") e) WHERE EXISTS (SELECT 1 FROM jsonb_array_elements("crew") e WHERE e ? 'manHoursPerDay');--> statement-breakpoint
UPDATE "work_package_item" i SET "starts_at" = (i."planned_date"::timestamp + interval '8 hours') AT TIME ZONE v."time_zone" FROM "vessel" v WHERE v."id" = i."vessel_id";--> statement-breakpoint
UPDATE "work_package_item" i SET "ends_at" = i."starts_at" + greatest(w."estimated_man_hours", 0.5) * interval '1 hour' FROM "work_order" w WHERE w."id" = i."work_order_id";--> statement-breakpoint
UPDATE "work_package_item" SET "segments" = jsonb_build_array(jsonb_build_object('from', to_char("starts_at" AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'), 'to', to_char("ends_at" AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"'))) WHERE "starts_at" IS NOT NULL AND "ends_at" IS NOT NULL;--> statement-breakpoint
-- Ranks: the electrician is the electro-technical officer (STCW's name); then every routine and
-- work order gets its team as one person of its rank for the man-hours' length.
UPDATE "routine" SET "rank" = 'electro-technical-officer' WHERE "rank" = 'electrician';--> statement-breakpoint
UPDATE "work_order" SET "rank" = 'electro-technical-officer' WHERE "rank" = 'electrician';--> statement-breakpoint
UPDATE "membership" SET "rank" = 'electro-technical-officer' WHERE "rank" = 'electrician';--> statement-breakpoint
UPDATE "port_stay" SET "crew" = replace("crew"::text, '"electrician"', '"electro-technical-officer"')::jsonb;--> statement-breakpoint
UPDATE "routine" SET "team" = jsonb_build_array(jsonb_build_object('rank', "rank", 'count', 1)), "elapsed_hours" = greatest("estimated_man_hours", 0.1) WHERE "team" = '[]'::jsonb;--> statement-breakpoint
UPDATE "work_order" SET "team" = jsonb_build_array(jsonb_build_object('rank', "rank", 'count', 1)), "elapsed_hours" = greatest("estimated_man_hours", 0.1) WHERE "team" = '[]'::jsonb;--> statement-breakpoint
ALTER TABLE "port_stay" DROP COLUMN "engine_may_stop";--> statement-breakpoint
ALTER TABLE "port_stay" DROP COLUMN "immobilisation_hours";--> statement-breakpoint
ALTER TABLE "port_stay" ADD CONSTRAINT "port_stay_workday" CHECK ("port_stay"."workday_from" >= 0 and "port_stay"."workday_from" < "port_stay"."workday_to" and "port_stay"."workday_to" <= 1440);--> statement-breakpoint
ALTER TABLE "port_stay" ADD CONSTRAINT "port_stay_engine_stop" CHECK (("port_stay"."engine_stop_from" is null and "port_stay"."engine_stop_to" is null) or "port_stay"."engine_stop_to" > "port_stay"."engine_stop_from");--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_port_event" CHECK (("routine"."port_event" is null and "routine"."port_event_hours" is null) or ("routine"."port_event_hours" > 0 and "routine"."interval_hours" is null and "routine"."calendar_rule" is null));--> statement-breakpoint
ALTER TABLE "routine" ADD CONSTRAINT "routine_has_interval" CHECK ("routine"."interval_hours" is not null or "routine"."calendar_rule" is not null or "routine"."port_event" is not null);