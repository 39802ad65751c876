// Prices, memberships and payments: what a team charges, what each athlete's membership allows now,
// comping, and the invoice lists. Provider calls (lib/payments.ts) happen outside transactions.
import "server-only";
import { and, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Executor } from "@/db";
import { memberships, teams, user, type Team } from "@/db/schema";
import { billingMemberships, payments, teamPrices, type BillingMembership, type Payment, type TeamPrice } from "@/db/schema-billing";
import type { PriceKind } from "@/lib/billing/constants";
import { membershipView, statusFromSubscription, type MembershipView } from "@/lib/billing/period";
import { monthlyTotals, type MonthTotal } from "@/lib/billing/money";
import { createPrice, retirePrice } from "@/lib/payments";
import { findInvitationByToken } from "./invitations";
import type { PriceInput } from "@/lib/validation/billing";

export interface TeamPrices {
  membership: TeamPrice | null;
  singleReview: TeamPrice | null;
}

export async function getTeamPrices(teamId: string, executor: Executor = db): Promise<TeamPrices> {
  const rows = await executor
    .select()
    .from(teamPrices)
    .where(and(eq(teamPrices.teamId, teamId), eq(teamPrices.active, true)));
  return {
    membership: rows.find((r) => r.kind === "membership") ?? null,
    singleReview: rows.find((r) => r.kind === "single_review") ?? null,
  };
}

function samePrice(current: TeamPrice | null, wanted: PriceInput | null): boolean {
  if (!current || !wanted) return current === wanted;
  return current.amountMinor === wanted.amountMinor && current.currency === wanted.currency;
}

/**
 * Sets (or removes, with null) the team's monthly and single-review prices. A changed price is created at the
 * provider first, then swapped in one transaction; existing subscriptions keep the price they started on.
 */
export async function setTeamPrices(
  team: Pick<Team, "id" | "name">,
  coachId: string,
  wanted: { membership: PriceInput | null; singleReview: PriceInput | null },
): Promise<TeamPrices> {
  const current = await getTeamPrices(team.id);
  const changes: { kind: PriceKind; old: TeamPrice | null; next: PriceInput | null; providerPriceId: string | null }[] = [];
  for (const [kind, old, next] of [
    ["membership", current.membership, wanted.membership],
    ["single_review", current.singleReview, wanted.singleReview],
  ] as const) {
    if (samePrice(old, next)) continue;
    const providerPriceId = next ? await createPrice({ teamId: team.id, teamName: team.name, kind, ...next }) : null;
    changes.push({ kind, old, next, providerPriceId });
  }
  await db.transaction(async (tx) => {
    for (const change of changes) {
      if (change.old) await tx.update(teamPrices).set({ active: false }).where(eq(teamPrices.id, change.old.id));
      if (change.next) {
        await tx.insert(teamPrices).values({
          teamId: team.id,
          kind: change.kind,
          amountMinor: change.next.amountMinor,
          currency: change.next.currency,
          providerPriceId: change.providerPriceId,
          createdBy: coachId,
        });
      }
    }
  });
  // Retiring old prices at the provider only stops new checkouts with them; a failure here changes nothing for us.
  for (const change of changes) {
    if (change.old?.providerPriceId) await retirePrice(change.old.providerPriceId).catch((error: unknown) => console.error("[plumbline] retire price:", error));
  }
  return getTeamPrices(team.id);
}

/** Stores the provider's id for a price created lazily (seeded prices have none until their first checkout). */
export async function setProviderPriceId(priceId: string, providerPriceId: string): Promise<void> {
  await db.update(teamPrices).set({ providerPriceId }).where(eq(teamPrices.id, priceId));
}

export async function findBillingMembership(athleteId: string, teamId: string, executor: Executor = db): Promise<BillingMembership | null> {
  const [row] = await executor
    .select()
    .from(billingMemberships)
    .where(and(eq(billingMemberships.athleteId, athleteId), eq(billingMemberships.teamId, teamId)));
  return row ?? null;
}

export interface MembershipAccess {
  /** False when the team charges nothing: then everything is free. */
  priced: boolean;
  view: MembershipView;
}

/** What the athlete's membership on the team allows at `now`. */
export async function membershipAccess(athleteId: string, teamId: string, now = new Date()): Promise<MembershipAccess> {
  const [prices, row] = await Promise.all([getTeamPrices(teamId), findBillingMembership(athleteId, teamId)]);
  return { priced: prices.membership !== null, view: membershipView(row, now) };
}

/** Remembers the provider customer made for this athlete on this team (first checkout). */
export async function setProviderCustomer(athleteId: string, teamId: string, customerId: string): Promise<void> {
  await db
    .insert(billingMemberships)
    .values({ athleteId, teamId, providerCustomerId: customerId })
    .onConflictDoUpdate({ target: [billingMemberships.athleteId, billingMemberships.teamId], set: { providerCustomerId: customerId } });
}

/** Comps the athlete (free uploads until un-comped) or returns them to what their payments say. */
export async function setComped(teamId: string, athleteId: string, coachId: string, comped: boolean): Promise<MembershipView> {
  return db.transaction(async (tx) => {
    const roles = await tx
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.teamId, teamId), eq(memberships.userId, athleteId), eq(memberships.role, "athlete")));
    if (roles.length === 0) return membershipView(null, new Date());
    const existing = await findBillingMembership(athleteId, teamId, tx);
    const restored = existing?.providerStatus ? statusFromSubscription(existing.providerStatus, existing.cancelAtPeriodEnd) : existing?.paidThrough ? "lapsed" : "none";
    const values = comped
      ? { status: "comped" as const, compedBy: coachId, compedAt: new Date() }
      : { status: restored, compedBy: null, compedAt: null };
    const [row] = await tx
      .insert(billingMemberships)
      .values({ athleteId, teamId, ...values })
      .onConflictDoUpdate({ target: [billingMemberships.athleteId, billingMemberships.teamId], set: values })
      .returning();
    return membershipView(row, new Date());
  });
}

export interface RosterBillingRow {
  athleteId: string;
  name: string;
  email: string;
  comped: boolean;
  view: MembershipView;
}

/** Every athlete on the team with their membership as it stands now. */
export async function rosterBilling(teamId: string, now = new Date()): Promise<RosterBillingRow[]> {
  const rows = await db
    .select({ athleteId: user.id, name: user.name, email: user.email, billing: billingMemberships })
    .from(memberships)
    .innerJoin(user, eq(user.id, memberships.userId))
    .leftJoin(billingMemberships, and(eq(billingMemberships.athleteId, memberships.userId), eq(billingMemberships.teamId, memberships.teamId)))
    .where(and(eq(memberships.teamId, teamId), eq(memberships.role, "athlete")))
    .orderBy(user.name);
  return rows.map((r) => ({
    athleteId: r.athleteId,
    name: r.name,
    email: r.email,
    comped: r.billing?.status === "comped",
    view: membershipView(r.billing, now),
  }));
}

export interface InvoiceRow {
  id: string;
  athleteId: string;
  athleteName: string;
  teamId: string;
  teamName: string;
  kind: PriceKind;
  amountMinor: number;
  currency: string;
  status: Payment["status"];
  periodStart: Date | null;
  periodEnd: Date | null;
  paidAt: Date | null;
  hostedInvoiceUrl: string | null;
  createdAt: Date;
}

export interface InvoiceList {
  invoices: InvoiceRow[];
  monthlyTotals: MonthTotal[];
}

/** Invoices of one team (all athletes: the coach's view) or of one athlete on their teams (their own). */
export async function listInvoices(filter: { teamIds: string[]; athleteId?: string }, limit = 200): Promise<InvoiceList> {
  if (filter.teamIds.length === 0) return { invoices: [], monthlyTotals: [] };
  const invoices = await db
    .select({
      id: payments.id,
      athleteId: payments.athleteId,
      athleteName: user.name,
      teamId: payments.teamId,
      teamName: teams.name,
      kind: payments.kind,
      amountMinor: payments.amountMinor,
      currency: payments.currency,
      status: payments.status,
      periodStart: payments.periodStart,
      periodEnd: payments.periodEnd,
      paidAt: payments.paidAt,
      hostedInvoiceUrl: payments.hostedInvoiceUrl,
      createdAt: payments.createdAt,
    })
    .from(payments)
    .innerJoin(user, eq(user.id, payments.athleteId))
    .innerJoin(teams, eq(teams.id, payments.teamId))
    .where(and(inArray(payments.teamId, filter.teamIds), filter.athleteId ? eq(payments.athleteId, filter.athleteId) : undefined))
    .orderBy(desc(sql`coalesce(${payments.paidAt}, ${payments.createdAt})`))
    .limit(limit);
  return { invoices, monthlyTotals: monthlyTotals(invoices) };
}

/** An unused paid single review of the athlete on the team, if any. */
export async function findReviewCredit(athleteId: string, teamId: string, executor: Executor = db): Promise<Payment | null> {
  const [row] = await executor
    .select()
    .from(payments)
    .where(
      and(
        eq(payments.athleteId, athleteId),
        eq(payments.teamId, teamId),
        eq(payments.kind, "single_review"),
        eq(payments.status, "paid"),
        isNull(payments.usedForSetId),
      ),
    )
    .orderBy(payments.paidAt)
    .limit(1);
  return row ?? null;
}

/** Spends a single-review credit on a set (inside the review request's transaction); false when none is left. */
export async function useReviewCredit(athleteId: string, teamId: string, setId: string, executor: Executor = db): Promise<boolean> {
  const credit = await findReviewCredit(athleteId, teamId, executor);
  if (!credit) return false;
  const updated = await executor
    .update(payments)
    .set({ usedForSetId: setId })
    .where(and(eq(payments.id, credit.id), isNull(payments.usedForSetId)))
    .returning({ id: payments.id });
  return updated.length === 1;
}

/** Where someone goes after joining a team by invitation: to pay first when the team charges, else home. */
export async function pathAfterJoining(token: string): Promise<string> {
  const found = await findInvitationByToken(token);
  if (!found) return "/app/home";
  const prices = await getTeamPrices(found.invitation.teamId);
  return prices.membership ? `/app/billing?team=${found.invitation.teamId}` : "/app/home";
}
