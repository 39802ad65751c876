CREATE TYPE "public"."markup_kind" AS ENUM('ruler', 'protractor', 'arrow', 'ring', 'pen', 'note');--> statement-breakpoint
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
ALTER TABLE "markup_shapes" ADD CONSTRAINT "markup_shapes_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "markup_shapes" ADD CONSTRAINT "markup_shapes_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "markup_shapes" ADD CONSTRAINT "markup_shapes_updated_by_user_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "markup_shapes_set_id_idx" ON "markup_shapes" USING btree ("set_id","frame_index");