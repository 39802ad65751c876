ALTER TABLE "analyses" ADD COLUMN "bar_frames" "bytea";--> statement-breakpoint
ALTER TABLE "analyses" DROP COLUMN "frames";