CREATE TABLE "search_outbox" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"firm_id" text NOT NULL,
	"case_id" text NOT NULL,
	"reason" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"last_error" text,
	CONSTRAINT "search_outbox_attempts_check" CHECK ("search_outbox"."attempts" >= 0)
);
--> statement-breakpoint
ALTER TABLE "case" ADD COLUMN "summary" text;--> statement-breakpoint
ALTER TABLE "search_outbox" ADD CONSTRAINT "search_outbox_firm_id_firm_id_fk" FOREIGN KEY ("firm_id") REFERENCES "public"."firm"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "search_outbox_due_idx" ON "search_outbox" USING btree ("next_attempt_at");