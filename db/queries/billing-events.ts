// Applies the payment provider's webhook events. Every event is recorded once (its id is unique), processed in
// one transaction under a lock on its row, and marked processed: a replay finds it processed and changes nothing.
// Subscription state only moves forward: an event older than the state already applied is recorded as "stale",
// a cancelled subscription never comes back, and a tie (same second) is settled by reading the subscription from
// the provider. Paid periods only extend (`paidThrough` is a maximum).
import "server-only";
import { and, eq, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db";
import { memberships, teams, user } from "@/db/schema";
import { billingMemberships, payments, webhookEvents, type BillingMembership } from "@/db/schema-billing";
import { statusFromSubscription } from "@/lib/billing/period";
import { idOf, retrieveSubscription, subscriptionPeriodEnd, type Stripe } from "@/lib/payments";

export type BillingNotice =
  | { kind: "receipt"; paymentId: string }
  | { kind: "payment_failed"; paymentId: string };

export interface EventResult {
  outcome: string;
  duplicate: boolean;
  notices: BillingNotice[];
}

interface Owner {
  athleteId: string;
  teamId: string;
}

const LIVE_STATUSES = new Set(["active", "trialing", "past_due", "unpaid"]);

function ownerFrom(metadata: Record<string, string> | null | undefined): Owner | null {
  const athleteId = metadata?.athleteId;
  const teamId = metadata?.teamId;
  return athleteId && teamId && /^[0-9a-f-]{36}$/i.test(teamId) ? { athleteId, teamId } : null;
}

const fromUnix = (s: number | null | undefined) => (typeof s === "number" ? new Date(s * 1000) : null);

/** Only athletes still on the team get billing rows (a removed athlete's late events are recorded, not applied). */
async function onTeam(tx: Transaction, owner: Owner): Promise<boolean> {
  const rows = await tx
    .select({ one: sql`1` })
    .from(memberships)
    .where(and(eq(memberships.teamId, owner.teamId), eq(memberships.userId, owner.athleteId), eq(memberships.role, "athlete")));
  return rows.length > 0;
}

async function lockMembership(tx: Transaction, owner: Owner): Promise<BillingMembership> {
  await tx.insert(billingMemberships).values(owner).onConflictDoNothing();
  const [row] = await tx
    .select()
    .from(billingMemberships)
    .where(and(eq(billingMemberships.athleteId, owner.athleteId), eq(billingMemberships.teamId, owner.teamId)))
    .for("update");
  return row;
}

async function membershipBySubscription(tx: Transaction, subscriptionId: string): Promise<Owner | null> {
  const [row] = await tx
    .select({ athleteId: billingMemberships.athleteId, teamId: billingMemberships.teamId })
    .from(billingMemberships)
    .where(eq(billingMemberships.providerSubscriptionId, subscriptionId));
  return row ?? null;
}

async function applySubscription(tx: Transaction, fromEvent: Stripe.Subscription, eventCreated: Date): Promise<string> {
  let subscription = fromEvent;
  const owner = ownerFrom(subscription.metadata) ?? (await membershipBySubscription(tx, subscription.id));
  if (!owner || !(await onTeam(tx, owner))) return "unmatched";
  const row = await lockMembership(tx, owner);
  const sameSubscription = row.providerSubscriptionId === subscription.id;
  if (row.providerSubscriptionId && !sameSubscription) {
    // A new live subscription replaces one that is not paying (ended, unpaid); otherwise events of another
    // subscription never touch the current one. Its paid invoices still extend `paidThrough` on their own.
    const currentPaying = row.providerStatus === "active" || row.providerStatus === "trialing";
    if (currentPaying || !LIVE_STATUSES.has(subscription.status)) return "stale";
  }
  if (sameSubscription) {
    if (row.providerStatus === "canceled" && subscription.status !== "canceled") return "stale";
    if (row.providerStateAt && eventCreated.getTime() < row.providerStateAt.getTime()) return "stale";
    // Two events of the same second cannot be ordered by their timestamps: ask the provider for the state now.
    if (row.providerStateAt?.getTime() === eventCreated.getTime()) subscription = await retrieveSubscription(subscription.id);
  }
  const providerStatus = subscription.status;
  await tx
    .update(billingMemberships)
    .set({
      providerStatus,
      status: row.status === "comped" ? "comped" : statusFromSubscription(providerStatus, subscription.cancel_at_period_end),
      cancelAtPeriodEnd: subscription.cancel_at_period_end,
      currentPeriodEnd: subscriptionPeriodEnd(subscription),
      providerSubscriptionId: subscription.id,
      providerCustomerId: idOf(subscription.customer) ?? row.providerCustomerId,
      providerStateAt: eventCreated,
    })
    .where(eq(billingMemberships.id, row.id));
  return subscription === fromEvent ? "applied" : "refreshed";
}

async function invoiceOwner(tx: Transaction, invoice: Stripe.Invoice): Promise<Owner | null> {
  const details = invoice.parent?.subscription_details;
  const fromMetadata = ownerFrom(details?.metadata ?? null);
  if (fromMetadata) return fromMetadata;
  const subscriptionId = idOf(details?.subscription ?? null);
  return subscriptionId ? membershipBySubscription(tx, subscriptionId) : null;
}

async function applyInvoice(tx: Transaction, invoice: Stripe.Invoice, paid: boolean): Promise<{ outcome: string; notices: BillingNotice[] }> {
  const owner = await invoiceOwner(tx, invoice);
  if (!owner || !(await onTeam(tx, owner))) return { outcome: "unmatched", notices: [] };
  const line = invoice.lines.data[0];
  const periodStart = fromUnix(line?.period?.start ?? invoice.period_start);
  const periodEnd = fromUnix(line?.period?.end ?? invoice.period_end);
  const paidAt = paid ? (fromUnix(invoice.status_transitions?.paid_at) ?? new Date()) : null;
  const [existing] = await tx
    .select({ id: payments.id, status: payments.status })
    .from(payments)
    .where(eq(payments.providerInvoiceId, invoice.id))
    .for("update");
  const base = {
    ...owner,
    kind: "membership" as const,
    providerInvoiceId: invoice.id,
    amountMinor: paid ? invoice.amount_paid : invoice.amount_due,
    currency: invoice.currency.toUpperCase(),
    periodStart,
    periodEnd,
    hostedInvoiceUrl: invoice.hosted_invoice_url ?? null,
  };
  let paymentId: string;
  let changed: boolean;
  if (!existing) {
    const [inserted] = await tx
      .insert(payments)
      .values({ ...base, status: paid ? "paid" : "failed", paidAt })
      .returning({ id: payments.id });
    paymentId = inserted.id;
    changed = true;
  } else {
    paymentId = existing.id;
    // A paid invoice stays paid whatever arrives later.
    changed = existing.status !== "paid" && (paid || existing.status !== "failed");
    if (changed) await tx.update(payments).set({ ...base, status: paid ? "paid" : "failed", paidAt }).where(eq(payments.id, existing.id));
  }
  if (paid) {
    const row = await lockMembership(tx, owner);
    const subscriptionId = idOf(invoice.parent?.subscription_details?.subscription ?? null);
    const extends_ = periodEnd && (!row.paidThrough || periodEnd.getTime() > row.paidThrough.getTime());
    await tx
      .update(billingMemberships)
      .set({
        ...(extends_ ? { paidThrough: periodEnd } : {}),
        // The invoice may come before the subscription's own events: a first payment makes the membership active.
        ...(row.status === "none" ? { status: "active" as const } : {}),
        providerCustomerId: row.providerCustomerId ?? idOf(invoice.customer ?? null),
        providerSubscriptionId: row.providerSubscriptionId ?? subscriptionId,
      })
      .where(eq(billingMemberships.id, row.id));
  }
  const notices: BillingNotice[] = changed ? [{ kind: paid ? "receipt" : "payment_failed", paymentId }] : [];
  return { outcome: changed ? "applied" : "unchanged", notices };
}

async function applyCheckout(tx: Transaction, session: Stripe.Checkout.Session, eventCreated: Date): Promise<{ outcome: string; notices: BillingNotice[] }> {
  const owner = ownerFrom(session.metadata);
  if (!owner || !(await onTeam(tx, owner))) return { outcome: "unmatched", notices: [] };
  if (session.mode === "subscription") {
    const row = await lockMembership(tx, owner);
    const subscriptionId = idOf(session.subscription);
    const replace = !row.providerSubscriptionId || (row.providerStatus !== null && !LIVE_STATUSES.has(row.providerStatus));
    await tx
      .update(billingMemberships)
      .set({
        providerCustomerId: idOf(session.customer) ?? row.providerCustomerId,
        ...(replace && subscriptionId ? { providerSubscriptionId: subscriptionId } : {}),
      })
      .where(eq(billingMemberships.id, row.id));
    return { outcome: "applied", notices: [] };
  }
  if (session.payment_status !== "paid") return { outcome: "ignored", notices: [] };
  const inserted = await tx
    .insert(payments)
    .values({
      ...owner,
      kind: "single_review",
      providerCheckoutSessionId: session.id,
      providerInvoiceId: idOf(session.invoice),
      amountMinor: session.amount_total ?? 0,
      currency: (session.currency ?? "eur").toUpperCase(),
      status: "paid",
      paidAt: eventCreated,
    })
    .onConflictDoNothing()
    .returning({ id: payments.id });
  return inserted.length === 1 ? { outcome: "applied", notices: [{ kind: "receipt", paymentId: inserted[0].id }] } : { outcome: "unchanged", notices: [] };
}

async function apply(tx: Transaction, event: Stripe.Event, created: Date): Promise<{ outcome: string; notices: BillingNotice[] }> {
  switch (event.type) {
    case "customer.subscription.created":
    case "customer.subscription.updated":
    case "customer.subscription.deleted":
      return { outcome: await applySubscription(tx, event.data.object, created), notices: [] };
    case "invoice.paid":
    case "invoice.payment_succeeded":
      return applyInvoice(tx, event.data.object, true);
    case "invoice.payment_failed":
      return applyInvoice(tx, event.data.object, false);
    case "checkout.session.completed":
      return applyCheckout(tx, event.data.object, created);
    default:
      return { outcome: "ignored", notices: [] };
  }
}

/** Records and applies one verified event; the same event id again is a no-op reported as a duplicate. */
export async function handleProviderEvent(event: Stripe.Event): Promise<EventResult> {
  const created = new Date(event.created * 1000);
  await db
    .insert(webhookEvents)
    .values({ providerEventId: event.id, type: event.type, providerCreatedAt: created, payload: event as unknown as Record<string, unknown> })
    .onConflictDoNothing();
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(webhookEvents).where(eq(webhookEvents.providerEventId, event.id)).for("update");
    if (row.processedAt) return { outcome: row.outcome ?? "applied", duplicate: true, notices: [] };
    const result = await apply(tx, event, created);
    await tx.update(webhookEvents).set({ processedAt: new Date(), outcome: result.outcome }).where(eq(webhookEvents.id, row.id));
    return { ...result, duplicate: false };
  });
}

/** Notes a failure on the event's row (it stays unprocessed, so the provider's retry runs it again). */
export async function recordEventFailure(eventId: string, error: unknown): Promise<void> {
  const message = error instanceof Error ? error.message : String(error);
  await db
    .update(webhookEvents)
    .set({ outcome: `error: ${message.slice(0, 300)}` })
    .where(eq(webhookEvents.providerEventId, eventId));
}

export interface NoticeFacts {
  kind: "membership" | "single_review";
  amountMinor: number;
  currency: string;
  periodEnd: Date | null;
  hostedInvoiceUrl: string | null;
  teamId: string;
  teamName: string;
  athlete: { name: string; email: string };
  coaches: { name: string; email: string }[];
}

/** Who to tell about a payment, and what. */
export async function noticeFacts(paymentId: string): Promise<NoticeFacts | null> {
  const [row] = await db
    .select({ payment: payments, teamName: teams.name, athleteName: user.name, athleteEmail: user.email })
    .from(payments)
    .innerJoin(teams, eq(teams.id, payments.teamId))
    .innerJoin(user, eq(user.id, payments.athleteId))
    .where(eq(payments.id, paymentId));
  if (!row) return null;
  const coaches = await db
    .select({ name: user.name, email: user.email })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .where(and(eq(memberships.teamId, row.payment.teamId), eq(memberships.role, "coach")));
  return {
    kind: row.payment.kind,
    amountMinor: row.payment.amountMinor,
    currency: row.payment.currency,
    periodEnd: row.payment.periodEnd,
    hostedInvoiceUrl: row.payment.hostedInvoiceUrl,
    teamId: row.payment.teamId,
    teamName: row.teamName,
    athlete: { name: row.athleteName, email: row.athleteEmail },
    coaches,
  };
}
