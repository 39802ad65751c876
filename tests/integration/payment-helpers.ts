// Helpers for the payment tests: the payment fake on a free port, and a loopback HTTP server in front of the
// real webhook route handler so the fake posts its signed events to it exactly as it would to the app.
import http from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { startStripeFake, FAKE_WEBHOOK_SECRET, type StripeFake, type StripeFakeOptions } from "@/dev/fakes/stripe-fake";
import * as webhookRoute from "@/app/api/payments/webhook/route";
import { BASE_URL } from "./helpers";

export interface TestPayments {
  fake: StripeFake;
  webhookUrl: string;
  stop: () => Promise<void>;
}

/** Starts the fake, points lib/payments at it (env) and its webhooks at the route handler. */
export async function startTestPayments(options: StripeFakeOptions = {}): Promise<TestPayments> {
  const fake = await startStripeFake({ port: 0, ...options });
  Object.assign(process.env, fake.env);
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      const headers = new Headers();
      for (const [name, value] of Object.entries(req.headers)) if (typeof value === "string") headers.set(name, value);
      const request = new Request(new URL(req.url ?? "/", BASE_URL), { method: req.method, headers, body: Buffer.concat(chunks) });
      webhookRoute
        .POST(request)
        .then(async (response) => {
          res.writeHead(response.status, { "content-type": response.headers.get("content-type") ?? "application/json" });
          res.end(await response.text());
        })
        .catch((error: unknown) => {
          res.writeHead(500);
          res.end(String(error));
        });
    });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const webhookUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/payments/webhook`;
  fake.setWebhookUrl(webhookUrl);
  return {
    fake,
    webhookUrl,
    stop: async () => {
      await fake.stop();
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/** Posts a payload to the webhook route as the provider would, signed with `secret` (the fake's by default). */
export async function postEvent(payload: string, secret = FAKE_WEBHOOK_SECRET): Promise<Response> {
  const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret });
  const request = new Request(new URL("/api/payments/webhook", BASE_URL), {
    method: "POST",
    headers: { "content-type": "application/json", "stripe-signature": signature },
    body: payload,
  });
  return webhookRoute.POST(request);
}

/** Pays a hosted checkout page as the payer would (the form's Pay button); returns where the page sends them. */
export async function payCheckout(checkoutUrl: string, outcome: "pay" | "decline" = "pay"): Promise<Response> {
  const page = await fetch(checkoutUrl);
  if (page.status !== 200) throw new Error(`checkout page answered ${page.status}`);
  return fetch(`${checkoutUrl}/pay`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ outcome }).toString(),
    redirect: "manual",
  });
}
