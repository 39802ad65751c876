// Demo billing for the Ironbark Barbell Club: a monthly price and a single-review price, and memberships that
// show each state — Tobin comped by the coach, Noor and Oskar paying (active), Bea lapsed after a failed
// renewal — with their invoices. The demo prices have no provider id: the first checkout creates them at the
// provider (the local fake). Fixed ids, so seeding again changes nothing.
import type { Transaction } from "@/db";
import { billingMemberships, payments, teamPrices } from "@/db/schema-billing";
import { addMonthsUtc } from "@/lib/billing/period";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_TEAM_ID } from "./seed";

const id = (n: number) => `5e1d0c0a-7c3b-4a51-9a8e-0000000b${n.toString(16).padStart(4, "0")}`;
const DAY_MS = 24 * 3600 * 1000;
export const DEMO_MEMBERSHIP_PRICE = { amountMinor: 4900, currency: "EUR" };
const SINGLE_REVIEW_PRICE = { amountMinor: 1500, currency: "EUR" };

export async function seedBilling(tx: Transaction, now: Date): Promise<void> {
  const [tobin, noor, bea, oskar] = DEMO_ATHLETES;
  await tx
    .insert(teamPrices)
    .values([
      { id: id(1), teamId: DEMO_TEAM_ID, kind: "membership", ...DEMO_MEMBERSHIP_PRICE, createdBy: DEMO_COACH.id },
      { id: id(2), teamId: DEMO_TEAM_ID, kind: "single_review", ...SINGLE_REVIEW_PRICE, createdBy: DEMO_COACH.id },
    ])
    .onConflictDoNothing();

  const ago = (days: number) => new Date(now.getTime() - days * DAY_MS);
  // Paying athletes: started two periods ago, renewed once; the current period ends in the future.
  const paying = [
    { athlete: noor, n: 10, started: ago(40) },
    { athlete: oskar, n: 20, started: ago(35) },
  ];
  for (const { athlete, n, started } of paying) {
    const renewed = addMonthsUtc(started, 1);
    const periodEnd = addMonthsUtc(started, 2);
    await tx
      .insert(billingMemberships)
      .values({ id: id(n), athleteId: athlete.id, teamId: DEMO_TEAM_ID, status: "active", providerStatus: "active", currentPeriodEnd: periodEnd, paidThrough: periodEnd })
      .onConflictDoNothing();
    await tx
      .insert(payments)
      .values([
        { id: id(n + 1), athleteId: athlete.id, teamId: DEMO_TEAM_ID, kind: "membership", ...DEMO_MEMBERSHIP_PRICE, status: "paid", periodStart: started, periodEnd: renewed, paidAt: started },
        { id: id(n + 2), athleteId: athlete.id, teamId: DEMO_TEAM_ID, kind: "membership", ...DEMO_MEMBERSHIP_PRICE, status: "paid", periodStart: renewed, periodEnd, paidAt: renewed },
      ])
      .onConflictDoNothing();
  }

  await tx
    .insert(billingMemberships)
    .values({ id: id(30), athleteId: tobin.id, teamId: DEMO_TEAM_ID, status: "comped", compedBy: DEMO_COACH.id, compedAt: ago(60) })
    .onConflictDoNothing();

  // Bea paid one month, the renewal failed and was never paid: lapsed, her sets still readable.
  const beaStarted = ago(45);
  const beaEnd = addMonthsUtc(beaStarted, 1);
  await tx
    .insert(billingMemberships)
    .values({ id: id(40), athleteId: bea.id, teamId: DEMO_TEAM_ID, status: "lapsed", providerStatus: "canceled", currentPeriodEnd: beaEnd, paidThrough: beaEnd })
    .onConflictDoNothing();
  await tx
    .insert(payments)
    .values([
      { id: id(41), athleteId: bea.id, teamId: DEMO_TEAM_ID, kind: "membership", ...DEMO_MEMBERSHIP_PRICE, status: "paid", periodStart: beaStarted, periodEnd: beaEnd, paidAt: beaStarted },
      { id: id(42), athleteId: bea.id, teamId: DEMO_TEAM_ID, kind: "membership", ...DEMO_MEMBERSHIP_PRICE, status: "failed", periodStart: beaEnd, periodEnd: addMonthsUtc(beaEnd, 1), createdAt: beaEnd },
    ])
    .onConflictDoNothing();
}
