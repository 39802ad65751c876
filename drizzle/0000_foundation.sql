CREATE TYPE "public"."camera_view" AS ENUM('side', 'front');--> statement-breakpoint
CREATE TYPE "public"."clip_status" AS ENUM('none', 'uploading', 'stored', 'deleted');--> statement-breakpoint
CREATE TYPE "public"."lift" AS ENUM('squat', 'bench', 'deadlift');--> statement-breakpoint
CREATE TYPE "public"."membership_role" AS ENUM('coach', 'athlete');--> statement-breakpoint
CREATE TYPE "public"."scale_method" AS ENUM('plate', 'scale', 'athlete-height');--> statement-breakpoint
CREATE TYPE "public"."set_status" AS ENUM('draft', 'uploaded', 'analysed', 'failed');--> statement-breakpoint
CREATE TYPE "public"."unit_preference" AS ENUM('kg', 'lb');--> statement-breakpoint
CREATE TABLE "account" (
	"id" text PRIMARY KEY NOT NULL,
	"account_id" text NOT NULL,
	"provider_id" text NOT NULL,
	"user_id" text NOT NULL,
	"access_token" text,
	"refresh_token" text,
	"id_token" text,
	"access_token_expires_at" timestamp with time zone,
	"refresh_token_expires_at" timestamp with time zone,
	"scope" text,
	"password" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "analyses" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"set_id" uuid NOT NULL,
	"is_current" boolean DEFAULT true NOT NULL,
	"model" text NOT NULL,
	"engine_version" text NOT NULL,
	"settings" jsonb NOT NULL,
	"calibration" jsonb,
	"scale_metres_per_pixel" double precision NOT NULL,
	"scale_method" "scale_method" NOT NULL,
	"scale_uncertainty_pct" double precision NOT NULL,
	"scale_note" text,
	"cautions" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"frames" jsonb,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "athlete_profiles" (
	"user_id" text PRIMARY KEY NOT NULL,
	"body_mass_kg" double precision,
	"height_m" double precision,
	"unit_preference" "unit_preference" DEFAULT 'kg' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "athlete_profiles_body_mass_kg_check" CHECK ("athlete_profiles"."body_mass_kg" is null or "athlete_profiles"."body_mass_kg" > 0),
	CONSTRAINT "athlete_profiles_height_m_check" CHECK ("athlete_profiles"."height_m" is null or "athlete_profiles"."height_m" > 0)
);
--> statement-breakpoint
CREATE TABLE "invitations" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"email" text NOT NULL,
	"role" "membership_role" DEFAULT 'athlete' NOT NULL,
	"token_hash" text NOT NULL,
	"invited_by" text,
	"expires_at" timestamp with time zone NOT NULL,
	"last_sent_at" timestamp with time zone DEFAULT now() NOT NULL,
	"accepted_at" timestamp with time zone,
	"accepted_by" text,
	"revoked_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "invitations_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
CREATE TABLE "memberships" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"role" "membership_role" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "memberships_team_user_role_key" UNIQUE("team_id","user_id","role")
);
--> statement-breakpoint
CREATE TABLE "one_rep_maxes" (
	"user_id" text NOT NULL,
	"lift" "lift" NOT NULL,
	"load_kg" double precision NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "one_rep_maxes_pkey" PRIMARY KEY("user_id","lift"),
	CONSTRAINT "one_rep_maxes_load_kg_check" CHECK ("one_rep_maxes"."load_kg" > 0)
);
--> statement-breakpoint
CREATE TABLE "rep_series" (
	"rep_id" uuid NOT NULL,
	"name" text NOT NULL,
	"points" real[] NOT NULL,
	CONSTRAINT "rep_series_pkey" PRIMARY KEY("rep_id","name"),
	CONSTRAINT "rep_series_points_length_check" CHECK (cardinality("rep_series"."points") = 101)
);
--> statement-breakpoint
CREATE TABLE "reps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"analysis_id" uuid NOT NULL,
	"rep_index" integer NOT NULL,
	"start_s" double precision NOT NULL,
	"end_s" double precision NOT NULL,
	"concentric_start_s" double precision,
	"concentric_end_s" double precision,
	"bottom_s" double precision,
	"rom_m" double precision,
	"mean_concentric_velocity_mps" double precision,
	"peak_concentric_velocity_mps" double precision,
	"mean_propulsive_velocity_mps" double precision,
	"concentric_duration_s" double precision,
	"eccentric_duration_s" double precision,
	"pause_duration_s" double precision,
	"sticking_point_time_s" double precision,
	"sticking_point_height_m" double precision,
	"sticking_point_velocity_mps" double precision,
	"max_horizontal_deviation_cm" double precision,
	"net_horizontal_drift_cm" double precision,
	"path_length_m" double precision,
	"bench_path_shape_cm" double precision,
	"knee_angle_at_start_deg" double precision,
	"knee_angle_at_bottom_deg" double precision,
	"knee_angle_at_lockout_deg" double precision,
	"hip_angle_at_start_deg" double precision,
	"hip_angle_at_bottom_deg" double precision,
	"hip_angle_at_lockout_deg" double precision,
	"ankle_angle_at_start_deg" double precision,
	"ankle_angle_at_bottom_deg" double precision,
	"ankle_angle_at_lockout_deg" double precision,
	"torso_angle_at_start_deg" double precision,
	"torso_angle_at_bottom_deg" double precision,
	"torso_angle_at_lockout_deg" double precision,
	"shin_angle_at_start_deg" double precision,
	"shin_angle_at_bottom_deg" double precision,
	"shin_angle_at_lockout_deg" double precision,
	"hip_rise_index" double precision,
	"depth_reached" boolean,
	"depth_margin_cm" double precision,
	"bar_over_mid_foot_offset_cm" double precision,
	"knee_projection_angle_deg" double precision,
	"stance_to_shoulder_width_ratio" double precision,
	"left_right_asymmetry" jsonb,
	"flags" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "reps_analysis_rep_index_key" UNIQUE("analysis_id","rep_index"),
	CONSTRAINT "reps_rep_index_check" CHECK ("reps"."rep_index" >= 1)
);
--> statement-breakpoint
CREATE TABLE "session" (
	"id" text PRIMARY KEY NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"token" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"ip_address" text,
	"user_agent" text,
	"user_id" text NOT NULL,
	"impersonated_by" text,
	CONSTRAINT "session_token_unique" UNIQUE("token")
);
--> statement-breakpoint
CREATE TABLE "set_measures" (
	"analysis_id" uuid PRIMARY KEY NOT NULL,
	"rep_count" integer NOT NULL,
	"best_mean_velocity_mps" double precision,
	"last_mean_velocity_mps" double precision,
	"velocity_loss_pct" double precision,
	"start_position_spread_cm" double precision,
	"bar_path_consistency_cm" double precision,
	"estimated_reps_in_reserve" double precision,
	"estimated_reps_in_reserve_source" text,
	"estimated_percent_one_rep_max" double precision,
	"estimated_percent_one_rep_max_source" text,
	"estimated_one_rep_max_kg" double precision,
	"estimated_one_rep_max_kg_source" text,
	"flags" jsonb DEFAULT '[]'::jsonb NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"session_id" uuid NOT NULL,
	"athlete_id" text NOT NULL,
	"team_id" uuid,
	"lift" "lift" NOT NULL,
	"variant" text,
	"load_kg" double precision NOT NULL,
	"reps" integer NOT NULL,
	"rpe" real,
	"camera_view" "camera_view" NOT NULL,
	"note" text,
	"clip_storage_key" text,
	"clip_status" "clip_status" DEFAULT 'none' NOT NULL,
	"status" "set_status" DEFAULT 'draft' NOT NULL,
	"recorded_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "sets_load_kg_check" CHECK ("sets"."load_kg" >= 0),
	CONSTRAINT "sets_reps_check" CHECK ("sets"."reps" >= 1),
	CONSTRAINT "sets_rpe_check" CHECK ("sets"."rpe" is null or ("sets"."rpe" >= 1 and "sets"."rpe" <= 10))
);
--> statement-breakpoint
CREATE TABLE "teams" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"name" text NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "training_sessions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"athlete_id" text NOT NULL,
	"team_id" uuid,
	"session_date" date NOT NULL,
	"note" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "training_sessions_athlete_team_date_key" UNIQUE NULLS NOT DISTINCT("athlete_id","team_id","session_date")
);
--> statement-breakpoint
CREATE TABLE "user" (
	"id" text PRIMARY KEY NOT NULL,
	"name" text NOT NULL,
	"email" text NOT NULL,
	"email_verified" boolean DEFAULT false NOT NULL,
	"image" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"role" text,
	"banned" boolean DEFAULT false,
	"ban_reason" text,
	"ban_expires" timestamp with time zone,
	CONSTRAINT "user_email_unique" UNIQUE("email")
);
--> statement-breakpoint
CREATE TABLE "verification" (
	"id" text PRIMARY KEY NOT NULL,
	"identifier" text NOT NULL,
	"value" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "account" ADD CONSTRAINT "account_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_set_id_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "analyses" ADD CONSTRAINT "analyses_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "athlete_profiles" ADD CONSTRAINT "athlete_profiles_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_invited_by_user_id_fk" FOREIGN KEY ("invited_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_accepted_by_user_id_fk" FOREIGN KEY ("accepted_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "memberships" ADD CONSTRAINT "memberships_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "one_rep_maxes" ADD CONSTRAINT "one_rep_maxes_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rep_series" ADD CONSTRAINT "rep_series_rep_id_reps_id_fk" FOREIGN KEY ("rep_id") REFERENCES "public"."reps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reps" ADD CONSTRAINT "reps_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "session" ADD CONSTRAINT "session_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "set_measures" ADD CONSTRAINT "set_measures_analysis_id_analyses_id_fk" FOREIGN KEY ("analysis_id") REFERENCES "public"."analyses"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sets" ADD CONSTRAINT "sets_session_id_training_sessions_id_fk" FOREIGN KEY ("session_id") REFERENCES "public"."training_sessions"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sets" ADD CONSTRAINT "sets_athlete_id_user_id_fk" FOREIGN KEY ("athlete_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sets" ADD CONSTRAINT "sets_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sets" ADD CONSTRAINT "sets_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "teams" ADD CONSTRAINT "teams_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "training_sessions" ADD CONSTRAINT "training_sessions_athlete_id_user_id_fk" FOREIGN KEY ("athlete_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "training_sessions" ADD CONSTRAINT "training_sessions_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "account_user_id_idx" ON "account" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "analyses_set_id_idx" ON "analyses" USING btree ("set_id","created_at" DESC NULLS LAST);--> statement-breakpoint
CREATE UNIQUE INDEX "analyses_current_set_key" ON "analyses" USING btree ("set_id") WHERE "analyses"."is_current";--> statement-breakpoint
CREATE INDEX "invitations_team_id_idx" ON "invitations" USING btree ("team_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "invitations_open_team_email_key" ON "invitations" USING btree ("team_id","email") WHERE "invitations"."accepted_at" is null and "invitations"."revoked_at" is null;--> statement-breakpoint
CREATE INDEX "memberships_user_id_idx" ON "memberships" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "session_user_id_idx" ON "session" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "sets_athlete_recorded_at_idx" ON "sets" USING btree ("athlete_id","recorded_at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "sets_team_recorded_at_idx" ON "sets" USING btree ("team_id","recorded_at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "sets_session_id_idx" ON "sets" USING btree ("session_id");--> statement-breakpoint
CREATE INDEX "training_sessions_team_date_idx" ON "training_sessions" USING btree ("team_id","session_date");--> statement-breakpoint
CREATE INDEX "verification_identifier_idx" ON "verification" USING btree ("identifier");