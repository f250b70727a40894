CREATE TABLE "attachment" (
	"id" text PRIMARY KEY NOT NULL,
	"firm_id" text NOT NULL,
	"case_id" text NOT NULL,
	"added_in_revision" integer NOT NULL,
	"removed_in_revision" integer,
	"uploader_id" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size" bigint NOT NULL,
	"sha256" text NOT NULL,
	"storage_key" text NOT NULL,
	"thumbnail_key" text,
	"caption" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"removed_at" timestamp with time zone,
	CONSTRAINT "attachment_size_check" CHECK ("attachment"."size" > 0),
	CONSTRAINT "attachment_revisions_check" CHECK ("attachment"."removed_in_revision" is null or "attachment"."removed_in_revision" >= "attachment"."added_in_revision"),
	CONSTRAINT "attachment_caption_check" CHECK (length("attachment"."caption") <= 500)
);
--> statement-breakpoint
ALTER TABLE "attachment" ADD CONSTRAINT "attachment_firm_id_firm_id_fk" FOREIGN KEY ("firm_id") REFERENCES "public"."firm"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachment" ADD CONSTRAINT "attachment_uploader_id_user_id_fk" FOREIGN KEY ("uploader_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "attachment" ADD CONSTRAINT "attachment_case_fk" FOREIGN KEY ("case_id","firm_id") REFERENCES "public"."case"("id","firm_id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "attachment_case_idx" ON "attachment" USING btree ("case_id","created_at");--> statement-breakpoint
CREATE INDEX "attachment_firm_idx" ON "attachment" USING btree ("firm_id");