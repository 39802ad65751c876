// The payment provider adapter: the official Stripe SDK, configured from the environment. Locally it points at
// dev/fakes/stripe-fake.ts (STRIPE_API_HOST/PORT/PROTOCOL); the real provider needs only real keys and no host.
//   STRIPE_SECRET_KEY      API key (sk_…)
//   STRIPE_WEBHOOK_SECRET  signing secret of the webhook endpoint (whsec_…)
//   STRIPE_API_HOST, STRIPE_API_PORT, STRIPE_API_PROTOCOL  another API base (the local fake); unset for the real one
import Stripe from "stripe";
import { ApiError } from "@/lib/errors";

export type { Stripe };

const clients = new Map<string, Stripe>();

function config() {
  const secretKey = process.env.STRIPE_SECRET_KEY;
  if (!secretKey) throw new ApiError("unavailable:payments", "Payments are not set up on this installation.");
  const protocol = process.env.STRIPE_API_PROTOCOL;
  return {
    secretKey,
    host: process.env.STRIPE_API_HOST || undefined,
    port: process.env.STRIPE_API_PORT || undefined,
    protocol: protocol === "http" || protocol === "https" ? (protocol as Stripe.HttpProtocol) : undefined,
  };
}

/** The SDK client for the current configuration (read at call time, so tests can point it at their own fake). */
export function paymentsClient(): Stripe {
  const { secretKey, host, port, protocol } = config();
  const key = [secretKey, host, port, protocol].join("|");
  let client = clients.get(key);
  if (!client) {
    client = new Stripe(secretKey, { host, port, protocol, maxNetworkRetries: 2, timeout: 20_000, telemetry: false });
    clients.set(key, client);
  }
  return client;
}

/** Checks the `Stripe-Signature` header against the raw body; a bad or missing signature is a 400. */
export function verifyWebhook(rawBody: string, signature: string | null): Stripe.Event {
  const secret = process.env.STRIPE_WEBHOOK_SECRET;
  if (!secret) throw new ApiError("unavailable:payments", "Payments are not set up on this installation.");
  if (!signature) throw new ApiError("bad_request:webhook", "The Stripe-Signature header is missing.");
  try {
    return Stripe.webhooks.constructEvent(rawBody, signature, secret);
  } catch {
    throw new ApiError("bad_request:webhook", "The webhook signature does not match.");
  }
}

/** The provider does not know an id we sent (stored for another account, or the local fake was reset). */
export function isMissingAtProvider(error: unknown): boolean {
  return error instanceof Stripe.errors.StripeInvalidRequestError && error.code === "resource_missing";
}

/** The id of an expandable field, whether the provider sent the id or the object. */
export function idOf(value: string | { id: string } | null | undefined): string | null {
  if (!value) return null;
  return typeof value === "string" ? value : value.id;
}

export async function createCustomer(input: { email: string; name: string; athleteId: string }): Promise<string> {
  const customer = await paymentsClient().customers.create({
    email: input.email,
    name: input.name,
    metadata: { athleteId: input.athleteId },
  });
  return customer.id;
}

export async function createPrice(input: {
  teamId: string;
  teamName: string;
  kind: "membership" | "single_review";
  amountMinor: number;
  currency: string;
}): Promise<string> {
  const price = await paymentsClient().prices.create({
    currency: input.currency.toLowerCase(),
    unit_amount: input.amountMinor,
    ...(input.kind === "membership" ? { recurring: { interval: "month" as const } } : {}),
    product_data: { name: `${input.teamName}: ${input.kind === "membership" ? "coaching membership" : "single set review"}` },
    metadata: { teamId: input.teamId, kind: input.kind },
  });
  return price.id;
}

export async function retirePrice(providerPriceId: string): Promise<void> {
  await paymentsClient().prices.update(providerPriceId, { active: false });
}

export interface CheckoutInput {
  kind: "membership" | "single_review";
  customerId: string;
  priceId: string;
  athleteId: string;
  teamId: string;
  successUrl: string;
  cancelUrl: string;
}

/** A hosted checkout page: a monthly subscription or a one-off payment; returns the page's URL. */
export async function createCheckout(input: CheckoutInput): Promise<{ id: string; url: string }> {
  const metadata = { athleteId: input.athleteId, teamId: input.teamId, kind: input.kind };
  const session = await paymentsClient().checkout.sessions.create({
    mode: input.kind === "membership" ? "subscription" : "payment",
    customer: input.customerId,
    client_reference_id: input.athleteId,
    line_items: [{ price: input.priceId, quantity: 1 }],
    metadata,
    ...(input.kind === "membership" ? { subscription_data: { metadata } } : { invoice_creation: { enabled: true } }),
    success_url: input.successUrl,
    cancel_url: input.cancelUrl,
  });
  if (!session.url) throw new ApiError("unavailable:payments", "The payment provider did not return a checkout page.");
  return { id: session.id, url: session.url };
}

export async function createPortal(customerId: string, returnUrl: string): Promise<string> {
  const session = await paymentsClient().billingPortal.sessions.create({ customer: customerId, return_url: returnUrl });
  return session.url;
}

/** Ends a subscription now (no refund); the provider then sends `customer.subscription.deleted`. */
export async function cancelSubscription(id: string): Promise<void> {
  await paymentsClient().subscriptions.cancel(id);
}

export function retrieveSubscription(id: string): Promise<Stripe.Subscription> {
  return paymentsClient().subscriptions.retrieve(id);
}

/** Where a subscription's current period ends (per item since the 2025 API versions; the earliest item counts). */
export function subscriptionPeriodEnd(subscription: Stripe.Subscription): Date | null {
  const ends = subscription.items.data.map((item) => item.current_period_end).filter((n): n is number => typeof n === "number");
  return ends.length > 0 ? new Date(Math.min(...ends) * 1000) : null;
}
