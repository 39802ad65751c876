CREATE TYPE "public"."markup_kind" AS ENUM('ruler', 'protractor', 'arrow', 'ring', 'pen', 'note');--> statement-breakpoint
CREATE TYPE "public"."review_status" AS ENUM('in_review', 'answered', 'seen');--> statement-breakpoint
CREATE TABLE "markup_shapes" (
	"id" uuid PRIMARY KEY NOT NULL,
	"set_id" uuid NOT NULL,
	"kind" "markup_kind" NOT NULL,
	"frame_index" integer NOT NULL,
	"frame_time_s" double precision NOT NULL,
	"span_end_s" double precision,
	"geometry" jsonb NOT NULL,
	"style" jsonb NOT NULL,
	"created_by" text,
	"updated_by" text,
	"revision" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"deleted_at" timestamp with time zone,
	CONSTRAINT "markup_shapes_frame_index_check" CHECK ("markup_shapes"."frame_index" >= 0),
	CONSTRAINT "markup_shapes_revision_check" CHECK ("markup_shapes"."revision" >= 1),
	CONSTRAINT "markup_shapes_span_check" CHECK ("markup_shapes"."span_end_s" is null or "markup_shapes"."span_end_s" >= "markup_shapes"."frame_time_s")
);
--> statement-breakpoint
CREATE TABLE "set_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"set_id" uuid NOT NULL,
	"parent_id" uuid,
	"author_id" text,
	"body" text NOT NULL,
	"time_s" double precision NOT NULL,
	"frame_index" integer NOT NULL,
	"rep_number" integer,
	"deleted_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "set_comments_time_s_check" CHECK ("set_comments"."time_s" >= 0),
	CONSTRAINT "set_comments_frame_index_check" CHECK ("set_comments"."frame_index" >= 0),
	CONSTRAINT "set_comments_rep_number_check" CHECK ("set_comments"."rep_number" is null or "set_comments"."rep_number" >= 1)
);
--> statement-breakpoint
CREATE TABLE "set_reviews" (
	"set_id" uuid PRIMARY KEY NOT NULL,
	"status" "review_status" DEFAULT 'in_review' NOT NULL,
	"summary" text DEFAULT '' NOT NULL,
	"cues" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"started_by" text,
	"started_at" timestamp with time zone DEFAULT now() NOT NULL,
	"answered_by" text,
	"answered_at" timestamp with time zone,
	"seen_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "set_shares" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"set_id" uuid NOT NULL,
	"team_id" uuid NOT NULL,
	"shared_by" text,
	"shared_at" timestamp with time zone DEFAULT now() NOT NULL,
	"withdrawn_by" text,
	"withdrawn_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "markup_shapes" ADD CONSTRAINT "markup_shapes_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "markup_shapes" ADD CONSTRAINT "markup_shapes_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "markup_shapes" ADD CONSTRAINT "markup_shapes_updated_by_user_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_comments" ADD CONSTRAINT "set_comments_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_comments" ADD CONSTRAINT "set_comments_parent_id_set_comments_id_fk" FOREIGN KEY ("parent_id") REFERENCES "public"."set_comments"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_comments" ADD CONSTRAINT "set_comments_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_reviews" ADD CONSTRAINT "set_reviews_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_reviews" ADD CONSTRAINT "set_reviews_started_by_user_id_fk" FOREIGN KEY ("started_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_reviews" ADD CONSTRAINT "set_reviews_answered_by_user_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_shares" ADD CONSTRAINT "set_shares_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_shares" ADD CONSTRAINT "set_shares_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_shares" ADD CONSTRAINT "set_shares_shared_by_user_id_fk" FOREIGN KEY ("shared_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_shares" ADD CONSTRAINT "set_shares_withdrawn_by_user_id_fk" FOREIGN KEY ("withdrawn_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "markup_shapes_set_id_idx" ON "markup_shapes" USING btree ("set_id","frame_index");--> statement-breakpoint
CREATE INDEX "set_comments_set_id_idx" ON "set_comments" USING btree ("set_id","created_at");--> statement-breakpoint
CREATE INDEX "set_comments_parent_id_idx" ON "set_comments" USING btree ("parent_id");--> statement-breakpoint
CREATE INDEX "set_reviews_status_idx" ON "set_reviews" USING btree ("status");--> statement-breakpoint
CREATE UNIQUE INDEX "set_shares_active_set_key" ON "set_shares" USING btree ("set_id") WHERE "set_shares"."withdrawn_at" is null;--> statement-breakpoint
CREATE INDEX "set_shares_team_id_idx" ON "set_shares" USING btree ("team_id");