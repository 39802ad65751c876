// Coaching memberships and payments: a team's prices, each athlete's billing state on a team, the
// provider's invoices and one-off payments, and every webhook event received. Money is integer minor units
// (cents) beside an ISO 4217 currency code; never floating point.
import { relations, sql } from "drizzle-orm";
import { boolean, check, index, integer, jsonb, pgEnum, pgTable, text, unique, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { timestamptz } from "./columns";
import { user, teams } from "./schema";
import { BILLING_STATUSES, PAYMENT_STATUSES, PRICE_KINDS } from "../lib/billing/constants";


export const priceKindEnum = pgEnum("price_kind", PRICE_KINDS);
export const billingStatusEnum = pgEnum("billing_status", BILLING_STATUSES);
export const paymentStatusEnum = pgEnum("payment_status", PAYMENT_STATUSES);

/** A team's price for a monthly membership or a single set review; a change adds a row and retires the old one. */
export const teamPrices = pgTable(
  "team_prices",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    kind: priceKindEnum("kind").notNull(),
    amountMinor: integer("amount_minor").notNull(),
    /** ISO 4217, upper case ("EUR"); the provider takes it in lower case. */
    currency: text("currency").notNull(),
    /** Created at the provider on first checkout when null (the demo seed has no provider). */
    providerPriceId: text("provider_price_id"),
    active: boolean("active").default(true).notNull(),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: timestamptz("created_at").defaultNow().notNull(),
  },
  (t) => [
    uniqueIndex("team_prices_active_team_kind_key").on(t.teamId, t.kind).where(sql`${t.active}`),
    check("team_prices_amount_minor_check", sql`${t.amountMinor} > 0`),
    check("team_prices_currency_check", sql`${t.currency} ~ '^[A-Z]{3}$'`),
  ],
);

/**
 * An athlete's billing state on one team. `paidThrough` only moves forward, from paid invoices: uploads are
 * allowed while it lies in the future (or the membership is comped), whatever order the provider's events come in.
 */
export const billingMemberships = pgTable(
  "billing_memberships",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    athleteId: text("athlete_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    status: billingStatusEnum("status").default("none").notNull(),
    /** The provider's own subscription status ("active", "past_due", "canceled" …); kept while comped. */
    providerStatus: text("provider_status"),
    /** End of the provider subscription's current period (the renewal date while active). */
    currentPeriodEnd: timestamptz("current_period_end"),
    paidThrough: timestamptz("paid_through"),
    cancelAtPeriodEnd: boolean("cancel_at_period_end").default(false).notNull(),
    providerCustomerId: text("provider_customer_id"),
    providerSubscriptionId: text("provider_subscription_id"),
    /** `created` of the newest provider event applied to the subscription state; older ones are ignored. */
    providerStateAt: timestamptz("provider_state_at"),
    compedBy: text("comped_by").references(() => user.id, { onDelete: "set null" }),
    compedAt: timestamptz("comped_at"),
    createdAt: timestamptz("created_at").defaultNow().notNull(),
    updatedAt: timestamptz("updated_at")
      .defaultNow()
      .$onUpdate(() => new Date())
      .notNull(),
  },
  (t) => [
    unique("billing_memberships_athlete_team_key").on(t.athleteId, t.teamId),
    index("billing_memberships_team_idx").on(t.teamId),
    uniqueIndex("billing_memberships_subscription_key").on(t.providerSubscriptionId),
  ],
);

/** One provider invoice (membership) or one-off checkout payment (single review). */
export const payments = pgTable(
  "payments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    athleteId: text("athlete_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    teamId: uuid("team_id")
      .notNull()
      .references(() => teams.id, { onDelete: "cascade" }),
    kind: priceKindEnum("kind").notNull(),
    providerInvoiceId: text("provider_invoice_id").unique(),
    providerCheckoutSessionId: text("provider_checkout_session_id").unique(),
    amountMinor: integer("amount_minor").notNull(),
    currency: text("currency").notNull(),
    status: paymentStatusEnum("status").notNull(),
    periodStart: timestamptz("period_start"),
    periodEnd: timestamptz("period_end"),
    paidAt: timestamptz("paid_at"),
    hostedInvoiceUrl: text("hosted_invoice_url"),
    /** A paid single review is a credit until a review request uses it on this set. */
    usedForSetId: uuid("used_for_set_id"),
    createdAt: timestamptz("created_at").defaultNow().notNull(),
    updatedAt: timestamptz("updated_at")
      .defaultNow()
      .$onUpdate(() => new Date())
      .notNull(),
  },
  (t) => [
    index("payments_team_created_idx").on(t.teamId, t.createdAt.desc()),
    index("payments_athlete_created_idx").on(t.athleteId, t.createdAt.desc()),
    check("payments_amount_minor_check", sql`${t.amountMinor} >= 0`),
  ],
);

/** Every event the provider sent, verified or not processed yet; the unique id makes replays no-ops. */
export const webhookEvents = pgTable(
  "webhook_events",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    providerEventId: text("provider_event_id").notNull().unique(),
    type: text("type").notNull(),
    providerCreatedAt: timestamptz("provider_created_at").notNull(),
    payload: jsonb("payload").$type<Record<string, unknown>>().notNull(),
    receivedAt: timestamptz("received_at").defaultNow().notNull(),
    processedAt: timestamptz("processed_at"),
    /** What handling the event did: "applied", "stale", "ignored", "unmatched" or "error: …". */
    outcome: text("outcome"),
  },
  (t) => [index("webhook_events_received_at_idx").on(t.receivedAt)],
);

export const teamPriceRelations = relations(teamPrices, ({ one }) => ({
  team: one(teams, { fields: [teamPrices.teamId], references: [teams.id] }),
}));

export const billingMembershipRelations = relations(billingMemberships, ({ one }) => ({
  team: one(teams, { fields: [billingMemberships.teamId], references: [teams.id] }),
  athlete: one(user, { fields: [billingMemberships.athleteId], references: [user.id] }),
}));

export const paymentRelations = relations(payments, ({ one }) => ({
  team: one(teams, { fields: [payments.teamId], references: [teams.id] }),
  athlete: one(user, { fields: [payments.athleteId], references: [user.id] }),
}));

export type TeamPrice = typeof teamPrices.$inferSelect;
export type NewTeamPrice = typeof teamPrices.$inferInsert;
export type BillingMembership = typeof billingMemberships.$inferSelect;
export type NewBillingMembership = typeof billingMemberships.$inferInsert;
export type Payment = typeof payments.$inferSelect;
export type NewPayment = typeof payments.$inferInsert;
export type WebhookEvent = typeof webhookEvents.$inferSelect;
export type NewWebhookEvent = typeof webhookEvents.$inferInsert;
