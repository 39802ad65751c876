CREATE TABLE "clip_upload_starts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"quota_key" text NOT NULL,
	"set_id" uuid NOT NULL,
	"user_id" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "clip_upload_starts_quota_key_created_at_idx" ON "clip_upload_starts" USING btree ("quota_key","created_at");