CREATE TABLE "sign_in_failure" (
	"account_key" text PRIMARY KEY NOT NULL,
	"failures" integer NOT NULL,
	"window_started_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE INDEX "sign_in_failure_window_started_at_index" ON "sign_in_failure" USING btree ("window_started_at");