// Memberships and payments against the local payment fake (real SDK over HTTP, signed webhooks into the real
// route handler) and the real PostgreSQL: prices, hosted checkout, webhook activation, replayed, forged and
// late events, a failed renewal lapsing the membership at the end of the paid period, upload gating with
// reading left open, comping, single-review credits, receipts and failure notices by mail.
import { readFileSync } from "node:fs";
import { and, count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb, db } from "@/db";
import { billingMemberships, payments, webhookEvents } from "@/db/schema-billing";
import { membershipAccess, useReviewCredit } from "@/db/queries/billing";
import { requireReviewAllowed, type Viewer } from "@/lib/access";
import { addMonthsUtc } from "@/lib/billing/period";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import * as setsRoute from "@/app/api/sets/route";
import * as setRoute from "@/app/api/sets/[setId]/route";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import * as pricesRoute from "@/app/api/teams/[teamId]/prices/route";
import * as compRoute from "@/app/api/teams/[teamId]/members/[userId]/comp/route";
import * as checkoutRoute from "@/app/api/billing/checkout/route";
import * as portalRoute from "@/app/api/billing/portal/route";
import * as invoicesRoute from "@/app/api/billing/invoices/route";
import { buildWorld, call, json, mailTo, startTestMail, type TestPerson, type World } from "./helpers";
import { createTestSet, startTestStorage, startUpload, uploadWhole, type TestStorage } from "./clip-helpers";
import { payCheckout, postEvent, startTestPayments, type TestPayments } from "./payment-helpers";

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

const DAY_S = 86_400;
let mail: MailFake;
let storage: TestStorage;
let pay: TestPayments;
let world: World;
let lapsedSetId: string;

const squat = { sessionDate: "2026-03-02", lift: "squat", loadKg: 140, reps: 5, cameraView: "side" };
const postSet = (person: TestPerson, teamId: string | null) =>
  call(setsRoute.POST, "/api/sets", { method: "POST", cookie: person.cookie, body: { ...squat, teamId } });
const putPrices = (person: TestPerson, body: unknown) =>
  call(pricesRoute.PUT, "", { method: "PUT", cookie: person.cookie, params: { teamId: world.teamA.id }, body });
const comp = (person: TestPerson, athlete: TestPerson, comped: boolean) =>
  call(compRoute.PUT, "", { method: "PUT", cookie: person.cookie, params: { teamId: world.teamA.id, userId: athlete.id }, body: { comped } });

async function checkoutUrl(person: TestPerson, kind = "membership"): Promise<string> {
  const response = await call(checkoutRoute.POST, "", { method: "POST", cookie: person.cookie, body: { teamId: world.teamA.id, kind } });
  expect(response.status).toBe(201);
  return (await json<{ checkout: { url: string } }>(response)).checkout.url;
}

async function billingRow(person: TestPerson) {
  const [row] = await db
    .select()
    .from(billingMemberships)
    .where(and(eq(billingMemberships.athleteId, person.id), eq(billingMemberships.teamId, world.teamA.id)));
  return row;
}

const paymentsOf = (person: TestPerson) => db.select().from(payments).where(eq(payments.athleteId, person.id)).orderBy(payments.createdAt);
const viewerOf = (person: TestPerson): Viewer => ({ userId: person.id, name: person.name, email: person.email, role: "user", emailVerified: true });

async function expectPaymentRequired(response: Response): Promise<void> {
  expect(response.status).toBe(402);
  expect((await json<ErrorBody>(response)).error.code).toBe("payment_required:membership");
}

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  // The fake's clock starts 40 days back, so the first athlete's paid month is over by the real clock the app uses.
  pay = await startTestPayments({ clockStartS: Math.floor(Date.now() / 1000) - 40 * DAY_S });
  world = await buildWorld("payments");
  // While team A is still free, athlete A2 records a set with a clip and an analysis.
  lapsedSetId = await createTestSet(world.athleteA2, { teamId: world.teamA.id });
  const clip = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
  expect((await uploadWhole(world.athleteA2, lapsedSetId, clip)).status).toBe(200);
  const { track } = generateSyntheticSet({ lift: "squat", seed: 7, reps: 3, view: "side" });
  const result = analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 });
  const saved = await call(analysisRoute.POST, "", {
    method: "POST",
    cookie: world.athleteA2.cookie,
    params: { setId: lapsedSetId },
    body: { model: { id: "movenet-lightning", version: "test" }, settings: {}, calibration: track.calibration, result, track },
  });
  expect(saved.status).toBe(201);
});

afterAll(async () => {
  await pay?.stop();
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

describe("team prices", () => {
  it("a team without a price is free for its athletes", async () => {
    expect((await postSet(world.athleteB1, world.teamB.id)).status).toBe(201);
    expect((await postSet(world.athleteA1, world.teamA.id)).status).toBe(201);
  });

  it("only the coach sets prices; amounts are checked per field", async () => {
    const refused = await putPrices(world.athleteA1, { currency: "EUR", membership: "49.00" });
    expect(refused.status).toBe(403);
    const bad = await putPrices(world.coachA, { currency: "EUR", membership: "49.999", singleReview: "0.10" });
    expect(bad.status).toBe(400);
    expect(Object.keys((await json<ErrorBody>(bad)).error.fields ?? {}).sort()).toEqual(["membership", "singleReview"]);
    const ok = await putPrices(world.coachA, { currency: "EUR", membership: "49.00", singleReview: "15" });
    expect(ok.status).toBe(200);
    expect(await json(ok)).toEqual({
      prices: { membership: { amountMinor: 4900, currency: "EUR" }, singleReview: { amountMinor: 1500, currency: "EUR" } },
    });
    const read = await call(pricesRoute.GET, "", { cookie: world.athleteA1.cookie, params: { teamId: world.teamA.id } });
    expect(read.status).toBe(200);
    expect((await call(pricesRoute.GET, "", { cookie: world.coachB.cookie, params: { teamId: world.teamA.id } })).status).toBe(403);
  });

  it("an athlete who has not paid cannot file a set under the team, but can keep a personal one", async () => {
    await expectPaymentRequired(await postSet(world.athleteA1, world.teamA.id));
    expect((await postSet(world.athleteA1, null)).status).toBe(201);
    // The other, free team is unaffected.
    expect((await postSet(world.athleteB1, world.teamB.id)).status).toBe(201);
  });
});

describe("a failed renewal", () => {
  it("lapses the membership at the end of the paid period and tells the athlete and the coach", async () => {
    const paidAt = pay.fake.nowS();
    expect((await payCheckout(await checkoutUrl(world.athleteA2))).status).toBe(303);
    const paid = await billingRow(world.athleteA2);
    expect(paid.status).toBe("active");
    const periodEnd = addMonthsUtc(new Date(paidAt * 1000), 1).getTime();
    expect(Math.abs(paid.paidThrough!.getTime() - periodEnd)).toBeLessThan(5_000);

    pay.fake.failNextRenewal();
    await pay.fake.advance(40 * DAY_S);
    const failed = await billingRow(world.athleteA2);
    expect(failed.status).toBe("past_due");
    expect(failed.paidThrough).toEqual(paid.paidThrough);
    const rows = await paymentsOf(world.athleteA2);
    expect(rows.map((r) => r.status)).toEqual(["paid", "failed"]);

    const justBefore = new Date(paid.paidThrough!.getTime() - 3_600_000);
    expect((await membershipAccess(world.athleteA2.id, world.teamA.id, justBefore)).view.uploadsAllowed).toBe(true);
    const now = await membershipAccess(world.athleteA2.id, world.teamA.id);
    expect(now.view).toMatchObject({ status: "lapsed", uploadsAllowed: false });

    expect(mailTo(mail, world.athleteA2.email).some((m) => /did not go through/.test(m.subject))).toBe(true);
    expect(mailTo(mail, world.coachA.email).some((m) => m.subject.includes(`${world.athleteA2.name}'s payment of €49.00 failed`))).toBe(true);
  });

  it("blocks new sets and clips but leaves every read open", async () => {
    await expectPaymentRequired(await postSet(world.athleteA2, world.teamA.id));
    await expectPaymentRequired(await startUpload(world.athleteA2, lapsedSetId, 1_000_000));
    const list = await call(setsRoute.GET, "/api/sets", { cookie: world.athleteA2.cookie });
    expect(list.status).toBe(200);
    expect((await json<{ sets: { id: string }[] }>(list)).sets.map((s) => s.id)).toContain(lapsedSetId);
    expect((await call(setRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId: lapsedSetId } })).status).toBe(200);
    const analysis = await call(analysisRoute.GET, "", { cookie: world.athleteA2.cookie, params: { setId: lapsedSetId } });
    expect(analysis.status).toBe(200);
    expect((await json<{ analysis: { reps: unknown[] } }>(analysis)).analysis.reps).toHaveLength(3);
  });

  it("a comp from the coach lets the athlete upload again, until it is withdrawn", async () => {
    expect((await comp(world.athleteA1, world.athleteA2, true)).status).toBe(403);
    expect((await comp(world.coachB, world.athleteA2, true)).status).toBe(403);
    expect((await comp(world.coachA, world.athleteB1, true)).status).toBe(404);
    const comped = await comp(world.coachA, world.athleteA2, true);
    expect(comped.status).toBe(200);
    expect((await json<{ membership: { status: string } }>(comped)).membership.status).toBe("comped");
    expect((await postSet(world.athleteA2, world.teamA.id)).status).toBe(201);
    const withdrawn = await comp(world.coachA, world.athleteA2, false);
    expect((await json<{ membership: { status: string } }>(withdrawn)).membership.status).toBe("lapsed");
    await expectPaymentRequired(await postSet(world.athleteA2, world.teamA.id));
  });
});

describe("checkout and webhooks", () => {
  it("a declined card changes nothing; paying activates the membership through the webhook", async () => {
    const url = await checkoutUrl(world.athleteA1);
    expect(url.startsWith(pay.fake.url)).toBe(true);
    expect((await payCheckout(url, "decline")).status).toBe(402);
    expect((await billingRow(world.athleteA1))?.status ?? "none").toBe("none");

    const done = await payCheckout(url);
    expect(done.status).toBe(303);
    expect(new URL(done.headers.get("location")!).pathname).toBe("/app/billing");
    const row = await billingRow(world.athleteA1);
    expect(row).toMatchObject({ status: "active", providerStatus: "active", cancelAtPeriodEnd: false });
    const access = await membershipAccess(world.athleteA1.id, world.teamA.id);
    expect(access.view.uploadsAllowed).toBe(true);
    expect(access.view.renewsOn!.getTime()).toBeGreaterThan(Date.now() + 27 * DAY_S * 1000);
    const [receipt] = await paymentsOf(world.athleteA1);
    expect(receipt).toMatchObject({ kind: "membership", amountMinor: 4900, currency: "EUR", status: "paid" });

    expect(mailTo(mail, world.athleteA1.email).some((m) => m.subject === `Receipt: €49.00 for your coaching membership of ${world.teamA.name}`)).toBe(true);
    expect(mailTo(mail, world.coachA.email).some((m) => m.subject === `${world.athleteA1.name} paid €49.00`)).toBe(true);

    const setId = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
    expect((await startUpload(world.athleteA1, setId, 1_000_000)).status).toBe(201);
    const again = await call(checkoutRoute.POST, "", { method: "POST", cookie: world.athleteA1.cookie, body: { teamId: world.teamA.id } });
    expect(again.status).toBe(409);
  });

  it("a replayed event is acknowledged and changes nothing", async () => {
    const sent = pay.fake.events().filter((e) => e.event.type === "invoice.paid");
    const original = sent[sent.length - 1];
    const before = { row: await billingRow(world.athleteA1), payments: await paymentsOf(world.athleteA1), mails: mail.messages().length };
    const replay = await postEvent(original.payload);
    expect(replay.status).toBe(200);
    expect(await json(replay)).toMatchObject({ received: true, duplicate: true });
    expect(await billingRow(world.athleteA1)).toEqual(before.row);
    expect(await paymentsOf(world.athleteA1)).toEqual(before.payments);
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(mail.messages().length).toBe(before.mails);
  });

  it("a forged or tampered event is refused with 400 and not recorded", async () => {
    const [{ n: eventsBefore }] = await db.select({ n: count() }).from(webhookEvents);
    const original = pay.fake.events().find((e) => e.event.type === "invoice.paid")!;
    const forged = JSON.stringify({ ...original.event, id: "evt_forged_1" });
    const wrongSecret = await postEvent(forged, "whsec_not_the_secret");
    expect(wrongSecret.status).toBe(400);
    expect((await json<ErrorBody>(wrongSecret)).error.code).toBe("bad_request:webhook");
    // A valid signature over other bytes does not cover the changed body.
    const header = (await import("stripe")).default.webhooks.generateTestHeaderString({ payload: original.payload, secret: process.env.STRIPE_WEBHOOK_SECRET! });
    const tampered = await import("@/app/api/payments/webhook/route").then((route) =>
      route.POST(new Request("http://127.0.0.1/api/payments/webhook", { method: "POST", headers: { "stripe-signature": header }, body: forged })),
    );
    expect(tampered.status).toBe(400);
    const unsigned = await import("@/app/api/payments/webhook/route").then((route) =>
      route.POST(new Request("http://127.0.0.1/api/payments/webhook", { method: "POST", body: forged })),
    );
    expect(unsigned.status).toBe(400);
    const [{ n: eventsAfter }] = await db.select({ n: count() }).from(webhookEvents);
    expect(eventsAfter).toBe(eventsBefore);
  });

  it("an older event delivered late does not undo a newer state", async () => {
    await pay.fake.advance(120);
    const portal = await call(portalRoute.POST, "", { method: "POST", cookie: world.athleteA1.cookie, body: { teamId: world.teamA.id } });
    expect(portal.status).toBe(201);
    const portalUrl = (await json<{ portal: { url: string } }>(portal)).portal.url;
    const subscriptionId = (await billingRow(world.athleteA1)).providerSubscriptionId!;
    const cancelled = await fetch(`${portalUrl}/cancel`, {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ subscription: subscriptionId }).toString(),
      redirect: "manual",
    });
    expect(cancelled.status).toBe(303);
    const lapsing = await billingRow(world.athleteA1);
    expect(lapsing).toMatchObject({ status: "lapsing", cancelAtPeriodEnd: true });

    // The subscription's first state, as an update the provider sent before the cancellation but delivered after it.
    const created = pay.fake.events().find((e) => e.event.type === "customer.subscription.created" && (e.event.data as { object: { id: string } }).object.id === subscriptionId)!;
    const late = JSON.stringify({ ...created.event, id: "evt_late_update_1", type: "customer.subscription.updated" });
    const response = await postEvent(late);
    expect(response.status).toBe(200);
    expect((await json<{ outcome: string }>(response)).outcome).toBe("stale");
    expect(await billingRow(world.athleteA1)).toMatchObject({ status: "lapsing", cancelAtPeriodEnd: true });

    // A late event from the same second as the cancellation cannot be ordered by time: the provider's current state wins.
    const cancelEvent = pay.fake.events().filter((e) => e.event.type === "customer.subscription.updated").pop()!;
    const sameSecond = JSON.stringify({ ...created.event, id: "evt_late_update_2", type: "customer.subscription.updated", created: cancelEvent.event.created });
    const tie = await postEvent(sameSecond);
    expect((await json<{ outcome: string }>(tie)).outcome).toBe("refreshed");
    expect(await billingRow(world.athleteA1)).toMatchObject({ status: "lapsing", cancelAtPeriodEnd: true });

    // A late failure notice for the invoice already paid leaves it paid and sends no mail.
    const paidInvoice = pay.fake.events().find((e) => e.event.type === "invoice.paid" && (e.event.data as { object: { customer: string } }).object.customer === lapsing.providerCustomerId)!;
    const mailsBefore = mail.messages().length;
    const lateFailure = JSON.stringify({ ...paidInvoice.event, id: "evt_late_failure_1", type: "invoice.payment_failed" });
    expect((await postEvent(lateFailure)).status).toBe(200);
    expect((await paymentsOf(world.athleteA1)).map((p) => p.status)).toEqual(["paid"]);
    expect(mail.messages().length).toBe(mailsBefore);

    // Still paid until the period end, and the page says when it ends.
    const access = await membershipAccess(world.athleteA1.id, world.teamA.id);
    expect(access.view).toMatchObject({ status: "lapsing", uploadsAllowed: true, renewsOn: null });
    expect(access.view.endsOn).toEqual(lapsing.paidThrough);
  });
});

describe("single reviews and invoice lists", () => {
  it("a paid single review is a credit for one review request, even with a lapsed membership", async () => {
    await expect(requireReviewAllowed(viewerOf(world.athleteA2), { athleteId: world.athleteA2.id, teamId: world.teamA.id })).rejects.toMatchObject({
      code: "payment_required:membership",
    });
    expect((await payCheckout(await checkoutUrl(world.athleteA2, "single_review"))).status).toBe(303);
    const single = (await paymentsOf(world.athleteA2)).find((p) => p.kind === "single_review");
    expect(single).toMatchObject({ amountMinor: 1500, currency: "EUR", status: "paid", usedForSetId: null });
    expect(await requireReviewAllowed(viewerOf(world.athleteA2), { athleteId: world.athleteA2.id, teamId: world.teamA.id })).toBe("credit");
    expect(await useReviewCredit(world.athleteA2.id, world.teamA.id, lapsedSetId)).toBe(true);
    expect(await useReviewCredit(world.athleteA2.id, world.teamA.id, lapsedSetId)).toBe(false);
    // A credit is for reviews only: uploads stay paused.
    await expectPaymentRequired(await postSet(world.athleteA2, world.teamA.id));
  });

  it("the coach lists every athlete's invoices with monthly totals; an athlete only their own", async () => {
    const coachView = await call(invoicesRoute.GET, `/api/billing/invoices?teamId=${world.teamA.id}`, { cookie: world.coachA.cookie });
    expect(coachView.status).toBe(200);
    const body = await json<{ invoices: { athleteId: string; status: string; amountMinor: number }[]; monthlyTotals: { amountMinor: number; currency: string }[] }>(coachView);
    expect(new Set(body.invoices.map((i) => i.athleteId))).toEqual(new Set([world.athleteA1.id, world.athleteA2.id]));
    const paidSum = body.invoices.filter((i) => i.status === "paid").reduce((sum, i) => sum + i.amountMinor, 0);
    // Two memberships at 49.00 and one single review at 15.00, all paid.
    expect(paidSum).toBe(4900 + 4900 + 1500);
    expect(body.monthlyTotals.reduce((sum, m) => sum + m.amountMinor, 0)).toBe(paidSum);

    const own = await call(invoicesRoute.GET, `/api/billing/invoices?teamId=${world.teamA.id}`, { cookie: world.athleteA1.cookie });
    const ownBody = await json<{ invoices: { athleteId: string }[] }>(own);
    expect(ownBody.invoices.length).toBeGreaterThan(0);
    expect(ownBody.invoices.every((i) => i.athleteId === world.athleteA1.id)).toBe(true);
    expect((await call(invoicesRoute.GET, `/api/billing/invoices?teamId=${world.teamA.id}`, { cookie: world.coachB.cookie })).status).toBe(403);
    expect((await call(invoicesRoute.GET, "/api/billing/invoices?teamId=nope", { cookie: world.coachA.cookie })).status).toBe(400);
  });

  it("a lapsed athlete who pays again can upload again; the unpaid subscription is ended first", async () => {
    const unpaid = (await billingRow(world.athleteA2)).providerSubscriptionId!;
    expect(pay.fake.get(unpaid)?.status).toBe("past_due");
    expect((await payCheckout(await checkoutUrl(world.athleteA2))).status).toBe(303);
    expect(pay.fake.get(unpaid)?.status).toBe("canceled");
    const row = await billingRow(world.athleteA2);
    expect(row.providerSubscriptionId).not.toBe(unpaid);
    expect(row).toMatchObject({ status: "active", providerStatus: "active" });
    expect((await postSet(world.athleteA2, world.teamA.id)).status).toBe(201);
  });
});

describe("switching provider accounts", () => {
  it("makes the customer and the price again when the provider does not know the stored ids", async () => {
    const other = await startTestPayments();
    try {
      const url = await checkoutUrl(world.athleteA1, "single_review");
      expect(url.startsWith(`${other.fake.url}/checkout/`)).toBe(true);
      expect((await payCheckout(url)).status).toBe(303);
      const customerId = (await billingRow(world.athleteA1)).providerCustomerId!;
      expect(other.fake.get(customerId)).toMatchObject({ object: "customer", email: world.athleteA1.email });
      expect((await paymentsOf(world.athleteA1)).filter((p) => p.kind === "single_review")).toHaveLength(1);
    } finally {
      await other.stop();
      Object.assign(process.env, pay.fake.env);
    }
  });
});
