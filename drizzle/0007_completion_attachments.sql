CREATE TABLE "completion_attachment" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"vessel_id" uuid NOT NULL,
	"work_order_id" uuid NOT NULL,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"byte_size" integer NOT NULL,
	"sha256" text NOT NULL,
	"caption" text,
	"uploaded_by" text,
	"uploaded_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "completion_attachment_objectKey_unique" UNIQUE("object_key"),
	CONSTRAINT "completion_attachment_caption_length" CHECK (char_length("completion_attachment"."caption") <= 200),
	CONSTRAINT "completion_attachment_size" CHECK ("completion_attachment"."byte_size" > 0)
);
--> statement-breakpoint
ALTER TABLE "completion_attachment" ADD CONSTRAINT "completion_attachment_company_id_company_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."company"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion_attachment" ADD CONSTRAINT "completion_attachment_vessel_id_vessel_id_fk" FOREIGN KEY ("vessel_id") REFERENCES "public"."vessel"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion_attachment" ADD CONSTRAINT "completion_attachment_work_order_id_work_order_id_fk" FOREIGN KEY ("work_order_id") REFERENCES "public"."work_order"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "completion_attachment" ADD CONSTRAINT "completion_attachment_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "completion_attachment_company_id_work_order_id_uploaded_at_index" ON "completion_attachment" USING btree ("company_id","work_order_id","uploaded_at");