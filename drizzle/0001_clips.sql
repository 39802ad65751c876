ALTER TYPE "public"."camera_view" ADD VALUE 'oblique';--> statement-breakpoint
ALTER TABLE "sets" ALTER COLUMN "clip_status" SET DATA TYPE text;--> statement-breakpoint
ALTER TABLE "sets" ALTER COLUMN "clip_status" SET DEFAULT 'none'::text;--> statement-breakpoint
UPDATE "sets" SET "clip_status" = 'uploaded' WHERE "clip_status" = 'stored';--> statement-breakpoint
DROP TYPE "public"."clip_status";--> statement-breakpoint
CREATE TYPE "public"."clip_status" AS ENUM('none', 'uploading', 'uploaded', 'converting', 'ready', 'failed', 'deleted');--> statement-breakpoint
ALTER TABLE "sets" ALTER COLUMN "clip_status" SET DEFAULT 'none'::"public"."clip_status";--> statement-breakpoint
ALTER TABLE "sets" ALTER COLUMN "clip_status" SET DATA TYPE "public"."clip_status" USING "clip_status"::"public"."clip_status";--> statement-breakpoint
ALTER TABLE "analyses" ADD COLUMN "notes" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "analyses" ADD COLUMN "track_storage_key" text;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "eccentric_start_s" double precision;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "eccentric_end_s" double precision;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "propulsive_duration_s" double precision;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "bar_over_mid_foot_method" text;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "knee_projection_angle_left_deg" double precision;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "knee_projection_angle_right_deg" double precision;--> statement-breakpoint
ALTER TABLE "reps" ADD COLUMN "bar_coverage" double precision;--> statement-breakpoint
ALTER TABLE "set_measures" ADD COLUMN "start_torso_angle_spread_deg" double precision;--> statement-breakpoint
ALTER TABLE "set_measures" ADD COLUMN "estimated_one_rep_max_detail" jsonb;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_upload_id" text;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_size_bytes" bigint;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_container" text;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_codec" text;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_duration_s" double precision;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_width_px" integer;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_height_px" integer;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_converted_key" text;--> statement-breakpoint
ALTER TABLE "sets" ADD COLUMN "clip_error" text;