// Billing periods and what a membership allows at a given moment: pure functions, shared by the
// webhook handling, the upload gate, the pages, the local payment fake and the tests.
import type { BillingStatus } from "./constants";

/**
 * One calendar month later, keeping the day of the month where it exists and otherwise taking the month's
 * last day (Jan 31 -> Feb 28/29), as the payment provider anchors monthly renewals (Stripe docs, "billing cycle").
 */
export function addMonthsUtc(date: Date, months: number): Date {
  const y = date.getUTCFullYear();
  const m = date.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(y, m + 1, 0)).getUTCDate();
  const day = Math.min(date.getUTCDate(), lastDay);
  return new Date(Date.UTC(y, m, day, date.getUTCHours(), date.getUTCMinutes(), date.getUTCSeconds(), date.getUTCMilliseconds()));
}

/** The provider's subscription status mapped to ours; cancel-at-period-end on a live subscription is "lapsing". */
export function statusFromSubscription(providerStatus: string, cancelAtPeriodEnd: boolean): BillingStatus {
  switch (providerStatus) {
    case "active":
    case "trialing":
      return cancelAtPeriodEnd ? "lapsing" : "active";
    case "past_due":
    case "unpaid":
      return "past_due";
    case "incomplete":
      return "none";
    default:
      // canceled, incomplete_expired, paused
      return "lapsed";
  }
}

export interface MembershipFacts {
  status: BillingStatus;
  paidThrough: Date | null;
  currentPeriodEnd: Date | null;
  cancelAtPeriodEnd: boolean;
}

export interface MembershipView {
  status: BillingStatus;
  /** New uploads and review requests are allowed (reading and export always are). */
  uploadsAllowed: boolean;
  paidThrough: Date | null;
  /** The next renewal, while the membership renews by itself. */
  renewsOn: Date | null;
  /** When uploads stop, for a membership that will not renew (cancelled or its renewal failed). */
  endsOn: Date | null;
}

/**
 * What a membership allows at `now`. Uploads are allowed when comped or while the paid period lasts: a failed
 * renewal or a cancellation lapses the membership at the end of what was paid, not before.
 */
export function membershipView(facts: MembershipFacts | null, now: Date): MembershipView {
  if (!facts) return { status: "none", uploadsAllowed: false, paidThrough: null, renewsOn: null, endsOn: null };
  const { paidThrough } = facts;
  if (facts.status === "comped") return { status: "comped", uploadsAllowed: true, paidThrough, renewsOn: null, endsOn: null };
  const paid = paidThrough !== null && paidThrough.getTime() > now.getTime();
  if (!paid) {
    const status: BillingStatus = facts.status === "none" && paidThrough === null ? "none" : "lapsed";
    return { status, uploadsAllowed: false, paidThrough, renewsOn: null, endsOn: null };
  }
  const status: BillingStatus = facts.status === "active" || facts.status === "past_due" ? facts.status : "lapsing";
  const renews = status === "active" && !facts.cancelAtPeriodEnd;
  return {
    status,
    uploadsAllowed: true,
    paidThrough,
    renewsOn: renews ? (facts.currentPeriodEnd ?? paidThrough) : null,
    endsOn: renews ? null : paidThrough,
  };
}
