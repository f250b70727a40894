CREATE TABLE "case" (
	"id" text PRIMARY KEY NOT NULL,
	"firm_id" text NOT NULL,
	"title" text NOT NULL,
	"slug" text NOT NULL,
	"structure_type" text NOT NULL,
	"section_shape" text NOT NULL,
	"project_reference" text,
	"region" text,
	"tags" text[] DEFAULT '{}'::text[] NOT NULL,
	"author_id" text NOT NULL,
	"state" text DEFAULT 'draft' NOT NULL,
	"latest_revision" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "case_id_firm_unique" UNIQUE("id","firm_id"),
	CONSTRAINT "case_state_check" CHECK ("case"."state" in ('draft', 'in_review', 'returned', 'published', 'superseded', 'withdrawn')),
	CONSTRAINT "case_latest_revision_check" CHECK ("case"."latest_revision" >= 1)
);
--> statement-breakpoint
CREATE TABLE "case_revision" (
	"id" text PRIMARY KEY NOT NULL,
	"case_id" text NOT NULL,
	"firm_id" text NOT NULL,
	"number" integer NOT NULL,
	"body" text NOT NULL,
	"author_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"fr1_min" double precision,
	"fr1_max" double precision,
	"discharge_min" double precision,
	"discharge_max" double precision,
	"v1" double precision,
	"y1" double precision,
	"y2" double precision,
	"relative_loss" double precision,
	"section_shapes" text[] DEFAULT '{}'::text[] NOT NULL,
	"calc_kinds" text[] DEFAULT '{}'::text[] NOT NULL,
	"results" jsonb NOT NULL,
	"solver_version" text NOT NULL,
	CONSTRAINT "case_revision_number_check" CHECK ("case_revision"."number" >= 1)
);
--> statement-breakpoint
ALTER TABLE "case" ADD CONSTRAINT "case_firm_id_firm_id_fk" FOREIGN KEY ("firm_id") REFERENCES "public"."firm"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case" ADD CONSTRAINT "case_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_revision" ADD CONSTRAINT "case_revision_firm_id_firm_id_fk" FOREIGN KEY ("firm_id") REFERENCES "public"."firm"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_revision" ADD CONSTRAINT "case_revision_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_revision" ADD CONSTRAINT "case_revision_case_fk" FOREIGN KEY ("case_id","firm_id") REFERENCES "public"."case"("id","firm_id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "case_firm_slug_unique" ON "case" USING btree ("firm_id","slug");--> statement-breakpoint
CREATE INDEX "case_firm_updated_idx" ON "case" USING btree ("firm_id","updated_at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "case_author_idx" ON "case" USING btree ("author_id");--> statement-breakpoint
CREATE UNIQUE INDEX "case_revision_case_number_unique" ON "case_revision" USING btree ("case_id","number");