// Starting a hosted checkout or the customer portal for an athlete on a team: the provider customer is made on
// first use, a price without a provider id (seeded) is created at the provider then, and the athlete is
// returned to the membership page afterwards.
import "server-only";
import { ApiError } from "@/lib/errors";
import { appUrl } from "@/lib/mail";
import { cancelSubscription, createCheckout, createCustomer, createPortal, createPrice, isMissingAtProvider } from "@/lib/payments";
import {
  findBillingMembership,
  getTeamPrices,
  membershipAccess,
  setProviderCustomer,
  setProviderPriceId,
} from "@/db/queries/billing";
import type { PriceKind } from "@/lib/billing/constants";
import type { Team } from "@/db/schema";
import type { Viewer } from "@/db/queries/viewer";

export async function startCheckout(viewer: Viewer, team: Pick<Team, "id" | "name">, kind: PriceKind): Promise<{ url: string }> {
  const prices = await getTeamPrices(team.id);
  const price = kind === "membership" ? prices.membership : prices.singleReview;
  if (!price) throw new ApiError("conflict:price", `${team.name} has no price for ${kind === "membership" ? "a membership" : "a single review"}.`);
  const row = await findBillingMembership(viewer.userId, team.id);
  if (kind === "membership") {
    const { view } = await membershipAccess(viewer.userId, team.id);
    if (view.uploadsAllowed) {
      throw new ApiError("conflict:membership", "Your membership is still running. Manage or resume it from your membership page.");
    }
    // A subscription whose renewal was never paid would keep retrying beside the new one: end it first.
    if (row?.providerSubscriptionId && (row.providerStatus === "past_due" || row.providerStatus === "unpaid")) {
      await cancelSubscription(row.providerSubscriptionId);
    }
  }
  const back = `/app/billing?team=${team.id}`;
  // Ids stored for another provider account (the local fake's, after switching to real keys) are unknown there:
  // the second attempt makes the customer and the price again.
  for (const fresh of [false, true]) {
    let customerId = fresh ? null : (row?.providerCustomerId ?? null);
    if (!customerId) {
      customerId = await createCustomer({ email: viewer.email, name: viewer.name, athleteId: viewer.userId });
      await setProviderCustomer(viewer.userId, team.id, customerId);
    }
    let providerPriceId = fresh ? null : price.providerPriceId;
    if (!providerPriceId) {
      providerPriceId = await createPrice({ teamId: team.id, teamName: team.name, kind, amountMinor: price.amountMinor, currency: price.currency });
      await setProviderPriceId(price.id, providerPriceId);
    }
    try {
      const { url } = await createCheckout({
        kind,
        customerId,
        priceId: providerPriceId,
        athleteId: viewer.userId,
        teamId: team.id,
        successUrl: appUrl(`${back}&checkout=done`),
        cancelUrl: appUrl(`${back}&checkout=cancelled`),
      });
      return { url };
    } catch (error) {
      if (fresh || !isMissingAtProvider(error)) throw error;
    }
  }
  throw new ApiError("unavailable:payments", "The payment provider did not open a checkout. Try again.");
}

export async function startPortal(viewer: Viewer, team: Pick<Team, "id">): Promise<{ url: string }> {
  const customerId = (await findBillingMembership(viewer.userId, team.id))?.providerCustomerId;
  if (!customerId) throw new ApiError("conflict:membership", "You have not paid this team yet, so there is nothing to manage.");
  return { url: await createPortal(customerId, appUrl(`/app/billing?team=${team.id}`)) };
}
