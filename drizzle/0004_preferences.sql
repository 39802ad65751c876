CREATE TYPE "public"."length_unit" AS ENUM('metric', 'imperial');--> statement-breakpoint
CREATE TYPE "public"."mass_unit" AS ENUM('kg', 'lb');--> statement-breakpoint
CREATE TABLE "user_preferences" (
	"user_id" text PRIMARY KEY NOT NULL,
	"mass_unit" "mass_unit" NOT NULL,
	"length_unit" "length_unit" NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "user_preferences" ADD CONSTRAINT "user_preferences_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;