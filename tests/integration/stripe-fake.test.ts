// The payment fake speaks the provider's API to the official SDK: objects come back in the real shapes, errors
// as the SDK's typed errors, the wrong key is refused, and development state survives a restart.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import Stripe from "stripe";
import { afterAll, describe, expect, it } from "vitest";
import { startStripeFake, FAKE_SECRET_KEY, type StripeFake } from "@/dev/fakes/stripe-fake";

const directory = mkdtempSync(path.join(tmpdir(), "plumbline-stripe-fake-"));
const stateFile = path.join(directory, "state.json");
const running: StripeFake[] = [];

function client(fake: StripeFake, key = FAKE_SECRET_KEY): Stripe {
  return new Stripe(key, { host: "127.0.0.1", port: fake.port, protocol: "http", maxNetworkRetries: 0 });
}

afterAll(async () => {
  await Promise.all(running.map((f) => f.stop()));
  rmSync(directory, { recursive: true, force: true });
});

describe("the payment fake through the SDK", () => {
  it("creates prices, customers and checkout sessions in the provider's shapes and keeps them across a restart", async () => {
    const first = await startStripeFake({ stateFile });
    running.push(first);
    const stripe = client(first);
    const price = await stripe.prices.create({ currency: "eur", unit_amount: 4900, recurring: { interval: "month" }, product_data: { name: "Membership" } });
    expect(price).toMatchObject({ object: "price", unit_amount: 4900, currency: "eur", type: "recurring", recurring: { interval: "month" }, active: true });
    const customer = await stripe.customers.create({ email: "lifter@test.example", metadata: { athleteId: "a1" } });
    const session = await stripe.checkout.sessions.create({
      mode: "subscription",
      customer: customer.id,
      line_items: [{ price: price.id, quantity: 1 }],
      success_url: "http://127.0.0.1/app/billing?session={CHECKOUT_SESSION_ID}",
    });
    expect(session).toMatchObject({ object: "checkout.session", mode: "subscription", status: "open", payment_status: "unpaid", amount_total: 4900 });
    expect(session.url).toBe(`${first.url}/checkout/${session.id}`);
    await first.stop();
    running.pop();

    const second = await startStripeFake({ stateFile });
    running.push(second);
    expect((await client(second).customers.retrieve(customer.id)) as Stripe.Customer).toMatchObject({ id: customer.id, email: "lifter@test.example" });
  });

  it("answers unknown objects, bad parameters and a wrong key with the SDK's typed errors", async () => {
    const fake = running[0];
    await expect(client(fake).subscriptions.retrieve("sub_missing")).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    const oneOff = await client(fake).prices.create({ currency: "eur", unit_amount: 1500, product_data: { name: "Review" } });
    await expect(
      client(fake).checkout.sessions.create({ mode: "subscription", line_items: [{ price: oneOff.id, quantity: 1 }], success_url: "http://127.0.0.1/" }),
    ).rejects.toMatchObject({ statusCode: 400 });
    await expect(client(fake, "sk_test_wrong").customers.create({})).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
  });
});
