CREATE TABLE "approval" (
	"id" text PRIMARY KEY NOT NULL,
	"round_id" text NOT NULL,
	"case_id" text NOT NULL,
	"firm_id" text NOT NULL,
	"revision_number" integer NOT NULL,
	"reviewer_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"solver_version" text NOT NULL,
	"snapshot" jsonb NOT NULL,
	"cancelled_at" timestamp with time zone
);
--> statement-breakpoint
CREATE TABLE "firm_review_setting" (
	"firm_id" text PRIMARY KEY NOT NULL,
	"required_approvals" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "firm_review_required_approvals_check" CHECK ("firm_review_setting"."required_approvals" in (1, 2))
);
--> statement-breakpoint
CREATE TABLE "review_round" (
	"id" text PRIMARY KEY NOT NULL,
	"case_id" text NOT NULL,
	"firm_id" text NOT NULL,
	"submitted_revision" integer NOT NULL,
	"submitted_by" text NOT NULL,
	"submitted_at" timestamp with time zone DEFAULT now() NOT NULL,
	"reviewer_ids" text[] DEFAULT '{}'::text[] NOT NULL,
	"outcome" text,
	"closed_at" timestamp with time zone,
	CONSTRAINT "review_round_outcome_check" CHECK ("review_round"."outcome" is null or "review_round"."outcome" in ('returned', 'published'))
);
--> statement-breakpoint
ALTER TABLE "case" ADD COLUMN "published_revision" integer;--> statement-breakpoint
ALTER TABLE "approval" ADD CONSTRAINT "approval_round_id_review_round_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."review_round"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "approval" ADD CONSTRAINT "approval_reviewer_id_user_id_fk" FOREIGN KEY ("reviewer_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "approval" ADD CONSTRAINT "approval_case_fk" FOREIGN KEY ("case_id","firm_id") REFERENCES "public"."case"("id","firm_id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "firm_review_setting" ADD CONSTRAINT "firm_review_setting_firm_id_firm_id_fk" FOREIGN KEY ("firm_id") REFERENCES "public"."firm"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_round" ADD CONSTRAINT "review_round_submitted_by_user_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_round" ADD CONSTRAINT "review_round_case_fk" FOREIGN KEY ("case_id","firm_id") REFERENCES "public"."case"("id","firm_id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "approval_one_per_reviewer" ON "approval" USING btree ("case_id","revision_number","reviewer_id") WHERE "approval"."cancelled_at" is null;--> statement-breakpoint
CREATE UNIQUE INDEX "review_round_one_open" ON "review_round" USING btree ("case_id") WHERE "review_round"."outcome" is null;--> statement-breakpoint
CREATE INDEX "review_round_firm_idx" ON "review_round" USING btree ("firm_id","submitted_at");