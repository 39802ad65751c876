CREATE TYPE "public"."billing_status" AS ENUM('active', 'past_due', 'lapsing', 'lapsed', 'comped', 'none');--> statement-breakpoint
CREATE TYPE "public"."payment_status" AS ENUM('paid', 'open', 'failed', 'void');--> statement-breakpoint
CREATE TYPE "public"."price_kind" AS ENUM('membership', 'single_review');--> statement-breakpoint
CREATE TABLE "billing_memberships" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"athlete_id" text NOT NULL,
	"team_id" uuid NOT NULL,
	"status" "billing_status" DEFAULT 'none' NOT NULL,
	"provider_status" text,
	"current_period_end" timestamp with time zone,
	"paid_through" timestamp with time zone,
	"cancel_at_period_end" boolean DEFAULT false NOT NULL,
	"provider_customer_id" text,
	"provider_subscription_id" text,
	"provider_state_at" timestamp with time zone,
	"comped_by" text,
	"comped_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "billing_memberships_athlete_team_key" UNIQUE("athlete_id","team_id")
);
--> statement-breakpoint
CREATE TABLE "payments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"athlete_id" text NOT NULL,
	"team_id" uuid NOT NULL,
	"kind" "price_kind" NOT NULL,
	"provider_invoice_id" text,
	"provider_checkout_session_id" text,
	"amount_minor" integer NOT NULL,
	"currency" text NOT NULL,
	"status" "payment_status" NOT NULL,
	"period_start" timestamp with time zone,
	"period_end" timestamp with time zone,
	"paid_at" timestamp with time zone,
	"hosted_invoice_url" text,
	"used_for_set_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "payments_provider_invoice_id_unique" UNIQUE("provider_invoice_id"),
	CONSTRAINT "payments_provider_checkout_session_id_unique" UNIQUE("provider_checkout_session_id"),
	CONSTRAINT "payments_amount_minor_check" CHECK ("payments"."amount_minor" >= 0)
);
--> statement-breakpoint
CREATE TABLE "team_prices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"team_id" uuid NOT NULL,
	"kind" "price_kind" NOT NULL,
	"amount_minor" integer NOT NULL,
	"currency" text NOT NULL,
	"provider_price_id" text,
	"active" boolean DEFAULT true NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "team_prices_amount_minor_check" CHECK ("team_prices"."amount_minor" > 0),
	CONSTRAINT "team_prices_currency_check" CHECK ("team_prices"."currency" ~ '^[A-Z]{3}$')
);
--> statement-breakpoint
CREATE TABLE "webhook_events" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"provider_event_id" text NOT NULL,
	"type" text NOT NULL,
	"provider_created_at" timestamp with time zone NOT NULL,
	"payload" jsonb NOT NULL,
	"received_at" timestamp with time zone DEFAULT now() NOT NULL,
	"processed_at" timestamp with time zone,
	"outcome" text,
	CONSTRAINT "webhook_events_provider_event_id_unique" UNIQUE("provider_event_id")
);
--> statement-breakpoint
ALTER TABLE "billing_memberships" ADD CONSTRAINT "billing_memberships_athlete_id_user_id_fk" FOREIGN KEY ("athlete_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "billing_memberships" ADD CONSTRAINT "billing_memberships_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "billing_memberships" ADD CONSTRAINT "billing_memberships_comped_by_user_id_fk" FOREIGN KEY ("comped_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payments" ADD CONSTRAINT "payments_athlete_id_user_id_fk" FOREIGN KEY ("athlete_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payments" ADD CONSTRAINT "payments_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "team_prices" ADD CONSTRAINT "team_prices_team_id_teams_id_fk" FOREIGN KEY ("team_id") REFERENCES "public"."teams"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "team_prices" ADD CONSTRAINT "team_prices_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "billing_memberships_team_idx" ON "billing_memberships" USING btree ("team_id");--> statement-breakpoint
CREATE UNIQUE INDEX "billing_memberships_subscription_key" ON "billing_memberships" USING btree ("provider_subscription_id");--> statement-breakpoint
CREATE INDEX "payments_team_created_idx" ON "payments" USING btree ("team_id","created_at" DESC NULLS LAST);--> statement-breakpoint
CREATE INDEX "payments_athlete_created_idx" ON "payments" USING btree ("athlete_id","created_at" DESC NULLS LAST);--> statement-breakpoint
CREATE UNIQUE INDEX "team_prices_active_team_kind_key" ON "team_prices" USING btree ("team_id","kind") WHERE "team_prices"."active";--> statement-breakpoint
CREATE INDEX "webhook_events_received_at_idx" ON "webhook_events" USING btree ("received_at");