// A local fake of the payment provider's HTTP API, for development and tests: the parts Plumbline uses
// (customers, products, prices, checkout sessions, subscriptions, invoices, billing portal sessions) with the
// real API's request and response shapes, hosted checkout and portal pages of its own, a clock that tests can
// advance (renewals, failed renewals, cancellations at period end) and events signed with the SDK's test header
// helper and posted to the app's webhook URL. `tsx dev/fakes/stripe-fake.ts` runs it on 12111.
import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { pathToFileURL } from "node:url";
import Stripe from "stripe";
import { addMonthsUtc } from "@/lib/billing/period";
import { formatMoney } from "@/lib/billing/money";

const HOST = "127.0.0.1";
export const FAKE_SECRET_KEY = "sk_test_plumbline_local_fake";
export const FAKE_WEBHOOK_SECRET = "whsec_plumbline_local_fake";
const API_VERSION = Stripe.API_VERSION;

type Obj = Record<string, unknown> & { id: string };

interface FakeState {
  clockOffsetS: number;
  failNextRenewal: boolean;
  objects: Record<string, Obj>;
}

export interface SentEvent {
  event: Obj;
  payload: string;
  /** HTTP status of the last delivery attempt (0: not delivered). */
  status: number;
}

export interface StripeFake {
  port: number;
  /** The API base (`http://127.0.0.1:<port>`), also where the hosted pages live. */
  url: string;
  env: Record<string, string>;
  /** Where events go: the app's `/api/payments/webhook`. */
  setWebhookUrl(url: string | null): void;
  /** Moves the fake's clock forward, renewing, failing or ending subscriptions whose period ends on the way. */
  advance(seconds: number): Promise<void>;
  failNextRenewal(): void;
  nowS(): number;
  events(): SentEvent[];
  get(id: string): Obj | undefined;
  stop(): Promise<void>;
}

// ---- form bodies: the SDK sends `a[b][0][c]=v` (application/x-www-form-urlencoded) ----

type FormValue = string | FormValue[] | { [key: string]: FormValue };

export function parseForm(body: string): Record<string, FormValue> {
  const root: Record<string, FormValue> = {};
  for (const [rawKey, value] of new URLSearchParams(body)) {
    const head = /^[^[]*/.exec(rawKey)![0];
    const parts = [head, ...[...rawKey.slice(head.length).matchAll(/\[([^\]]*)\]/g)].map((m) => m[1])];
    let node: Record<string, FormValue> = root;
    parts.forEach((part, i) => {
      // `key[]` appends to an array; `key[0]` and `key[name]` address an element.
      const key = part === "" && Array.isArray(node) ? String(node.length) : part;
      if (i === parts.length - 1) {
        node[key] = value;
        return;
      }
      node[key] ??= /^\d*$/.test(parts[i + 1]) ? [] : {};
      node = node[key] as Record<string, FormValue>;
    });
  }
  return root;
}

const str = (v: FormValue | undefined): string | undefined => (typeof v === "string" ? v : undefined);
const rec = (v: FormValue | undefined): Record<string, string> => {
  if (!v || typeof v === "string") return {};
  return Object.fromEntries(Object.entries(v).filter(([, x]) => typeof x === "string")) as Record<string, string>;
};

class FakeError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly type = "invalid_request_error",
    readonly code?: string,
  ) {
    super(message);
  }
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${escapeHtml(title)}</title><style>body{font-family:system-ui,sans-serif;max-width:420px;margin:40px auto;padding:0 16px;line-height:1.5}
button{font-size:16px;padding:10px 16px;margin:4px 0;width:100%;cursor:pointer}.note{color:#555;font-size:14px}.box{border:1px solid #ccc;border-radius:8px;padding:16px;margin:16px 0}</style>
</head><body><p class="note">Local payment fake (test mode, no money moves)</p><h1>${escapeHtml(title)}</h1>${body}</body></html>`;
}

export interface StripeFakeOptions {
  port?: number;
  webhookUrl?: string | null;
  /** Keep the fake's objects in this JSON file across restarts (development); in memory only when unset. */
  stateFile?: string;
  /** Start the fake's clock at this Unix time (tests that need a paid period already over); the real time by default. */
  clockStartS?: number;
}

export async function startStripeFake(options: StripeFakeOptions = {}): Promise<StripeFake> {
  const offset = options.clockStartS === undefined ? 0 : options.clockStartS - Math.floor(Date.now() / 1000);
  let state: FakeState = { clockOffsetS: offset, failNextRenewal: false, objects: {} };
  if (options.stateFile && existsSync(options.stateFile)) state = JSON.parse(readFileSync(options.stateFile, "utf8")) as FakeState;
  let webhookUrl = options.webhookUrl ?? null;
  const sent: SentEvent[] = [];
  let baseUrl = "";
  let delivery: Promise<void> = Promise.resolve();

  const save = () => {
    if (!options.stateFile) return;
    mkdirSync(path.dirname(options.stateFile), { recursive: true });
    writeFileSync(options.stateFile, JSON.stringify(state));
  };
  const nowS = () => Math.floor(Date.now() / 1000) + state.clockOffsetS;
  const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString("base64url").replace(/[-_]/g, "x")}`;
  const put = (obj: Obj) => {
    state.objects[obj.id] = obj;
    return obj;
  };
  const find = (id: string, object: string): Obj => {
    const found = state.objects[id];
    if (!found || found.object !== object) throw new FakeError(404, `No such ${object.replace(/^.*\./, "")}: '${id}'`, "invalid_request_error", "resource_missing");
    return found;
  };

  // Events are delivered one after another, in the order they happen; each waits for the app's answer.
  function emit(type: string, object: Obj, previousAttributes?: Record<string, unknown>): Promise<void> {
    const event: Obj = {
      id: newId("evt"),
      object: "event",
      api_version: API_VERSION,
      created: nowS(),
      data: { object: structuredClone(object), ...(previousAttributes ? { previous_attributes: previousAttributes } : {}) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    const payload = JSON.stringify(event, null, 2);
    const record: SentEvent = { event, payload, status: 0 };
    sent.push(record);
    delivery = delivery.then(() => deliver(record));
    return delivery;
  }

  async function deliver(record: SentEvent): Promise<void> {
    if (!webhookUrl) return;
    for (let attempt = 0; attempt < 3; attempt += 1) {
      // Signed at the moment of sending with the real clock, as the provider does; the event's `created` uses the fake clock.
      const header = Stripe.webhooks.generateTestHeaderString({ payload: record.payload, secret: FAKE_WEBHOOK_SECRET });
      try {
        const response = await fetch(webhookUrl, {
          method: "POST",
          headers: { "content-type": "application/json", "stripe-signature": header },
          body: record.payload,
        });
        record.status = response.status;
        await response.arrayBuffer();
        if (response.ok) return;
      } catch {
        record.status = 0;
      }
      await new Promise((resolve) => setTimeout(resolve, 300 * (attempt + 1)));
    }
  }

  function priceObject(params: Record<string, FormValue>): Obj {
    let product = str(params.product);
    if (!product) {
      const data = rec(params.product_data);
      product = put({ id: newId("prod"), object: "product", active: true, name: data.name ?? "Product", created: nowS(), metadata: {}, livemode: false }).id;
    } else find(product, "product");
    const unitAmount = Number(str(params.unit_amount));
    if (!Number.isSafeInteger(unitAmount) || unitAmount < 0) throw new FakeError(400, "Invalid integer: unit_amount");
    const currency = str(params.currency);
    if (!currency) throw new FakeError(400, "Missing required param: currency.");
    const recurring = rec(params.recurring);
    return put({
      id: newId("price"),
      object: "price",
      active: true,
      currency,
      unit_amount: unitAmount,
      unit_amount_decimal: String(unitAmount),
      product,
      recurring: recurring.interval ? { interval: recurring.interval, interval_count: Number(recurring.interval_count ?? 1), usage_type: "licensed" } : null,
      type: recurring.interval ? "recurring" : "one_time",
      metadata: rec(params.metadata),
      created: nowS(),
      livemode: false,
    });
  }

  function invoiceFor(input: {
    customer: string;
    price: Obj;
    subscription: Obj | null;
    periodStart: number;
    periodEnd: number;
    paid: boolean;
    billingReason: string;
  }): Obj {
    const amount = input.price.unit_amount as number;
    const id = newId("in");
    const now = nowS();
    return put({
      id,
      object: "invoice",
      customer: input.customer,
      status: input.paid ? "paid" : "open",
      currency: input.price.currency,
      amount_due: amount,
      amount_paid: input.paid ? amount : 0,
      amount_remaining: input.paid ? 0 : amount,
      total: amount,
      subtotal: amount,
      attempted: true,
      attempt_count: 1,
      billing_reason: input.billingReason,
      created: now,
      period_start: input.periodStart,
      period_end: input.periodEnd,
      hosted_invoice_url: `${baseUrl}/invoice/${id}`,
      invoice_pdf: null,
      number: `PLB-${String(Object.values(state.objects).filter((o) => o.object === "invoice").length + 1).padStart(4, "0")}`,
      lines: {
        object: "list",
        data: [
          {
            id: newId("il"),
            object: "line_item",
            amount,
            currency: input.price.currency,
            description: "1 × membership",
            period: { start: input.periodStart, end: input.periodEnd },
            pricing: { type: "price_details", price_details: { price: input.price.id, product: input.price.product } },
            quantity: 1,
          },
        ],
        has_more: false,
        url: `/v1/invoices/${id}/lines`,
      },
      parent: input.subscription
        ? {
            type: "subscription_details",
            quote_details: null,
            subscription_details: { subscription: input.subscription.id, metadata: input.subscription.metadata },
          }
        : null,
      status_transitions: { finalized_at: now, paid_at: input.paid ? now : null, marked_uncollectible_at: null, voided_at: null },
      metadata: {},
      livemode: false,
    });
  }

  function subscriptionPeriodEnd(sub: Obj): number {
    const items = sub.items as { data: { current_period_end: number }[] };
    return items.data[0].current_period_end;
  }

  function setPeriod(sub: Obj, start: number, end: number): void {
    const items = sub.items as { data: { current_period_start: number; current_period_end: number }[] };
    items.data[0].current_period_start = start;
    items.data[0].current_period_end = end;
  }

  const monthAfter = (s: number) => Math.floor(addMonthsUtc(new Date(s * 1000), 1).getTime() / 1000);

  async function completeCheckout(session: Obj): Promise<void> {
    if (session.status !== "open") return;
    const price = find(((session.line_items as { data: { price: Obj }[] }).data[0].price).id, "price");
    const customer = session.customer as string;
    const now = nowS();
    if (session.mode === "subscription") {
      const subscriptionId = newId("sub");
      const sub = put({
        id: subscriptionId,
        object: "subscription",
        customer,
        status: "active",
        cancel_at_period_end: false,
        cancel_at: null,
        canceled_at: null,
        ended_at: null,
        created: now,
        start_date: now,
        currency: price.currency,
        metadata: session.subscription_metadata ?? {},
        latest_invoice: null,
        items: {
          object: "list",
          data: [{ id: newId("si"), object: "subscription_item", price, quantity: 1, subscription: subscriptionId, current_period_start: now, current_period_end: monthAfter(now), created: now }],
          has_more: false,
          url: `/v1/subscription_items?subscription=${subscriptionId}`,
        },
        livemode: false,
      });
      const invoice = invoiceFor({ customer, price, subscription: sub, periodStart: now, periodEnd: monthAfter(now), paid: true, billingReason: "subscription_create" });
      sub.latest_invoice = invoice.id;
      Object.assign(session, { status: "complete", payment_status: "paid", subscription: sub.id, invoice: invoice.id });
      save();
      void emit("customer.subscription.created", sub);
      void emit("invoice.paid", invoice);
      await emit("checkout.session.completed", session);
      return;
    }
    const invoice = invoiceFor({ customer, price, subscription: null, periodStart: now, periodEnd: now, paid: true, billingReason: "manual" });
    Object.assign(session, { status: "complete", payment_status: "paid", payment_intent: newId("pi"), invoice: invoice.id });
    save();
    await emit("checkout.session.completed", session);
  }

  /** Renews, fails or ends every live subscription whose period has ended by the fake's clock. */
  async function runRenewals(): Promise<void> {
    let pending: Promise<void> = Promise.resolve();
    for (;;) {
      const now = nowS();
      const due = Object.values(state.objects).find(
        (o) => o.object === "subscription" && (o.status === "active" || o.status === "past_due") && subscriptionPeriodEnd(o) <= now,
      );
      if (!due) break;
      const end = subscriptionPeriodEnd(due);
      if (due.cancel_at_period_end || due.status === "past_due") {
        // Cancelled at the period end, or the failed renewal was never paid (the provider's retries are collapsed into one).
        Object.assign(due, { status: "canceled", ended_at: end, canceled_at: due.canceled_at ?? end });
        pending = emit("customer.subscription.deleted", due);
        continue;
      }
      const price = (due.items as { data: { price: Obj }[] }).data[0].price;
      const fail = state.failNextRenewal;
      state.failNextRenewal = false;
      const invoice = invoiceFor({ customer: due.customer as string, price, subscription: due, periodStart: end, periodEnd: monthAfter(end), paid: !fail, billingReason: "subscription_cycle" });
      const previous = { status: due.status, items: structuredClone(due.items), latest_invoice: due.latest_invoice };
      setPeriod(due, end, monthAfter(end));
      Object.assign(due, { latest_invoice: invoice.id, status: fail ? "past_due" : "active" });
      void emit(fail ? "invoice.payment_failed" : "invoice.paid", invoice);
      pending = emit("customer.subscription.updated", due, previous);
    }
    save();
    await pending;
  }

  async function setCancelAtPeriodEnd(sub: Obj, cancel: boolean): Promise<void> {
    if (sub.status === "canceled") throw new FakeError(400, "A canceled subscription can only update its cancellation_details and metadata.");
    const previous = { cancel_at_period_end: sub.cancel_at_period_end, cancel_at: sub.cancel_at };
    Object.assign(sub, { cancel_at_period_end: cancel, cancel_at: cancel ? subscriptionPeriodEnd(sub) : null, canceled_at: cancel ? nowS() : null });
    save();
    await emit("customer.subscription.updated", sub, previous);
  }

  // ---- the API ----

  async function api(method: string, pathname: string, params: Record<string, FormValue>, query: URLSearchParams): Promise<unknown> {
    const segments = pathname.split("/").filter(Boolean).slice(1);
    // Namespaced resources (`checkout/sessions`, `billing_portal/sessions`) count as one name.
    if (segments[0] === "checkout" || segments[0] === "billing_portal") segments.splice(0, 2, `${segments[0]}/${segments[1]}`);
    const [resource, id, sub] = segments;
    const route = `${method} ${resource}${id ? "/:id" : ""}${sub ? `/${sub}` : ""}`;
    switch (route) {
      case "POST customers": {
        return put({ id: newId("cus"), object: "customer", email: str(params.email) ?? null, name: str(params.name) ?? null, metadata: rec(params.metadata), created: nowS(), livemode: false });
      }
      case "GET customers/:id":
        return find(id, "customer");
      case "POST customers/:id": {
        const customer = find(id, "customer");
        return Object.assign(customer, { ...(str(params.email) ? { email: str(params.email) } : {}), ...(str(params.name) ? { name: str(params.name) } : {}) });
      }
      case "POST products":
        return put({ id: newId("prod"), object: "product", active: true, name: str(params.name) ?? "Product", metadata: rec(params.metadata), created: nowS(), livemode: false });
      case "POST prices":
        return priceObject(params);
      case "GET prices/:id":
        return find(id, "price");
      case "POST prices/:id": {
        const price = find(id, "price");
        if (str(params.active)) price.active = str(params.active) === "true";
        return price;
      }
      case "POST checkout/sessions":
      case "GET checkout/sessions/:id":
        return checkoutApi(method, id, params);
      case "GET subscriptions/:id":
        return find(id, "subscription");
      case "POST subscriptions/:id": {
        const subscription = find(id, "subscription");
        if (str(params.cancel_at_period_end)) await setCancelAtPeriodEnd(subscription, str(params.cancel_at_period_end) === "true");
        return subscription;
      }
      case "DELETE subscriptions/:id": {
        const subscription = find(id, "subscription");
        Object.assign(subscription, { status: "canceled", ended_at: nowS(), canceled_at: nowS() });
        save();
        await emit("customer.subscription.deleted", subscription);
        return subscription;
      }
      case "GET invoices/:id":
        return find(id, "invoice");
      case "GET invoices": {
        const customer = query.get("customer");
        const data = Object.values(state.objects)
          .filter((o) => o.object === "invoice" && (!customer || o.customer === customer))
          .sort((a, b) => (b.created as number) - (a.created as number));
        return { object: "list", data, has_more: false, url: "/v1/invoices" };
      }
      case "POST billing_portal/sessions": {
        const customer = str(params.customer);
        if (!customer) throw new FakeError(400, "Missing required param: customer.");
        find(customer, "customer");
        const portalId = newId("bps");
        return put({ id: portalId, object: "billing_portal.session", customer, return_url: str(params.return_url) ?? null, url: `${baseUrl}/portal/${portalId}`, created: nowS(), livemode: false });
      }
      default:
        throw new FakeError(404, `Unrecognized request URL (${method}: ${pathname}).`);
    }
  }

  function checkoutApi(method: string, id: string | undefined, params: Record<string, FormValue>): Obj {
    if (method === "GET" && id) {
      const session = find(id, "checkout.session");
      const { subscription_metadata: _hidden, line_items: _lines, ...visible } = session;
      return visible as Obj;
    }
    const mode = str(params.mode);
    if (mode !== "subscription" && mode !== "payment") throw new FakeError(400, "Invalid mode: must be one of payment, setup or subscription");
    const lines = Array.isArray(params.line_items) ? params.line_items : [];
    const first = lines[0] && typeof lines[0] === "object" && !Array.isArray(lines[0]) ? (lines[0] as Record<string, FormValue>) : undefined;
    const price = find(str(first?.price) ?? "", "price");
    if (!price.active) throw new FakeError(400, `The price specified is inactive. This field only accepts active prices.`);
    if ((mode === "subscription") !== (price.type === "recurring")) {
      throw new FakeError(400, mode === "subscription" ? "You must provide at least one recurring price in `subscription` mode when using prices." : "You specified `payment` mode but passed a recurring price.");
    }
    const customer = str(params.customer);
    if (customer) find(customer, "customer");
    const successUrl = str(params.success_url);
    if (!successUrl) throw new FakeError(400, "Missing required param: success_url.");
    const sessionId = newId("cs_test");
    const subscriptionData = params.subscription_data && typeof params.subscription_data === "object" && !Array.isArray(params.subscription_data) ? params.subscription_data : {};
    const session = put({
      id: sessionId,
      object: "checkout.session",
      mode,
      status: "open",
      payment_status: "unpaid",
      customer: customer ?? null,
      client_reference_id: str(params.client_reference_id) ?? null,
      metadata: rec(params.metadata),
      subscription: null,
      payment_intent: null,
      invoice: null,
      amount_total: price.unit_amount,
      amount_subtotal: price.unit_amount,
      currency: price.currency,
      success_url: successUrl,
      cancel_url: str(params.cancel_url) ?? null,
      url: `${baseUrl}/checkout/${sessionId}`,
      created: nowS(),
      expires_at: nowS() + 24 * 3600,
      livemode: false,
      subscription_metadata: rec((subscriptionData as Record<string, FormValue>).metadata),
      line_items: { data: [{ price, quantity: 1 }] },
    });
    save();
    return checkoutApi("GET", session.id, {});
  }

  // ---- hosted pages ----

  function checkoutPage(session: Obj, message?: string): string {
    const amount = formatMoney(session.amount_total as number, (session.currency as string).toUpperCase(), "en-GB");
    const per = session.mode === "subscription" ? " per month" : "";
    if (session.status !== "open") return page("This checkout is finished", `<p>Nothing more to pay here.</p>`);
    const customer = session.customer ? (state.objects[session.customer as string] as Obj | undefined) : undefined;
    return page(
      "Checkout",
      `${message ? `<p role="alert" style="color:#a00">${escapeHtml(message)}</p>` : ""}
<div class="box"><p>Amount: <strong>${escapeHtml(amount)}${per}</strong></p>
<p class="note">Paying as ${escapeHtml(String(customer?.email ?? "guest"))}. Test card 4242 4242 4242 4242.</p></div>
<form method="post" action="/checkout/${session.id}/pay"><input type="hidden" name="outcome" value="pay"><button type="submit">Pay ${escapeHtml(amount)}</button></form>
<form method="post" action="/checkout/${session.id}/pay"><input type="hidden" name="outcome" value="decline"><button type="submit">Pay with a card that is declined</button></form>
${session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url as string)}">Cancel and go back</a></p>` : ""}`,
    );
  }

  function portalPage(portal: Obj): string {
    const subs = Object.values(state.objects).filter((o) => o.object === "subscription" && o.customer === portal.customer && o.status !== "canceled");
    const rows = subs
      .map((sub) => {
        const end = new Date(subscriptionPeriodEnd(sub) * 1000).toUTCString();
        const price = (sub.items as { data: { price: Obj }[] }).data[0].price;
        const amount = formatMoney(price.unit_amount as number, (price.currency as string).toUpperCase(), "en-GB");
        const action = sub.cancel_at_period_end
          ? `<p>Ends on ${escapeHtml(end)}.</p><form method="post" action="/portal/${portal.id}/resume"><input type="hidden" name="subscription" value="${sub.id}"><button type="submit">Keep the membership</button></form>`
          : `<p>Renews on ${escapeHtml(end)}.</p><form method="post" action="/portal/${portal.id}/cancel"><input type="hidden" name="subscription" value="${sub.id}"><button type="submit">Cancel the membership</button></form>`;
        return `<div class="box"><p><strong>${escapeHtml(amount)} per month</strong> (${escapeHtml(String(sub.status))})</p>${action}</div>`;
      })
      .join("");
    const back = portal.return_url ? `<p><a href="${escapeHtml(portal.return_url as string)}">Return to Plumbline</a></p>` : "";
    return page("Your memberships", rows || "<p>No live memberships.</p>") + back;
  }

  async function pages(method: string, url: URL, form: Record<string, FormValue>, res: http.ServerResponse): Promise<boolean> {
    const html = (status: number, body: string) => {
      res.writeHead(status, { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" });
      res.end(body);
    };
    const redirect = (location: string) => {
      res.writeHead(303, { location });
      res.end();
    };
    let match = /^\/checkout\/([\w]+)(\/pay)?$/.exec(url.pathname);
    if (match) {
      const session = state.objects[match[1]];
      if (!session || session.object !== "checkout.session") return (html(404, page("Not found", "<p>No such checkout.</p>")), true);
      if (method === "GET" && !match[2]) return (html(200, checkoutPage(session)), true);
      if (method === "POST" && match[2]) {
        if (str(form.outcome) === "decline") return (html(402, checkoutPage(session, "Your card was declined. Try another card.")), true);
        await completeCheckout(session);
        return (redirect((session.success_url as string).replace("{CHECKOUT_SESSION_ID}", session.id)), true);
      }
    }
    match = /^\/portal\/([\w]+)(?:\/(cancel|resume))?$/.exec(url.pathname);
    if (match) {
      const portal = state.objects[match[1]];
      if (!portal || portal.object !== "billing_portal.session") return (html(404, page("Not found", "<p>No such portal session.</p>")), true);
      if (method === "POST" && match[2]) {
        const sub = find(str(form.subscription) ?? "", "subscription");
        if (sub.customer !== portal.customer) return (html(403, page("Not allowed", "<p>Not your subscription.</p>")), true);
        await setCancelAtPeriodEnd(sub, match[2] === "cancel");
        return (redirect(`/portal/${portal.id}`), true);
      }
      return (html(200, portalPage(portal)), true);
    }
    match = /^\/invoice\/([\w]+)$/.exec(url.pathname);
    if (match && state.objects[match[1]]?.object === "invoice") {
      const invoice = state.objects[match[1]];
      const amount = formatMoney(invoice.amount_due as number, (invoice.currency as string).toUpperCase(), "en-GB");
      return (html(200, page(`Invoice ${String(invoice.number)}`, `<p>${escapeHtml(amount)}: ${escapeHtml(String(invoice.status))}</p>`)), true);
    }
    return false;
  }

  // ---- control endpoint for tests ----

  async function control(method: string, url: URL, body: string): Promise<unknown> {
    const input = body ? (JSON.parse(body) as Record<string, unknown>) : {};
    if (method === "POST" && url.pathname === "/_control/advance") {
      await fake.advance(Number(input.seconds ?? 0) + Number(input.days ?? 0) * 86_400);
      return { now: nowS() };
    }
    if (method === "POST" && url.pathname === "/_control/fail-next-renewal") {
      fake.failNextRenewal();
      return { failNextRenewal: true };
    }
    if (method === "POST" && url.pathname === "/_control/webhook-url") {
      fake.setWebhookUrl(typeof input.url === "string" ? input.url : null);
      return { webhookUrl };
    }
    if (method === "GET" && url.pathname === "/_control/events") return { events: sent.map((s) => ({ ...s.event, delivery_status: s.status })) };
    throw new FakeError(404, "Unknown control call.");
  }

  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      const body = Buffer.concat(chunks).toString("utf8");
      const url = new URL(req.url ?? "/", `http://${HOST}`);
      const method = req.method ?? "GET";
      const sendJson = (status: number, value: unknown) => {
        res.writeHead(status, { "content-type": "application/json", "request-id": newId("req"), "stripe-version": API_VERSION });
        res.end(JSON.stringify(value));
      };
      const handle = async () => {
        if (url.pathname.startsWith("/v1/")) {
          if (req.headers.authorization !== `Bearer ${FAKE_SECRET_KEY}`) {
            throw new FakeError(401, "Invalid API Key provided.", "invalid_request_error");
          }
          const params = method === "GET" || method === "DELETE" ? parseForm(url.searchParams.toString()) : parseForm(body);
          return sendJson(200, await api(method, url.pathname, params, url.searchParams));
        }
        if (url.pathname.startsWith("/_control/")) return sendJson(200, await control(method, url, body));
        if (await pages(method, url, method === "POST" ? parseForm(body) : {}, res)) return;
        throw new FakeError(404, "Not found");
      };
      handle().catch((error: unknown) => {
        if (res.headersSent) return;
        if (error instanceof FakeError) return sendJson(error.status, { error: { type: error.type, message: error.message, ...(error.code ? { code: error.code } : {}) } });
        sendJson(500, { error: { type: "api_error", message: error instanceof Error ? error.message : String(error) } });
      });
    });
  });

  await new Promise<void>((resolve) => server.listen(options.port ?? 0, HOST, resolve));
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://${HOST}:${port}`;

  const fake: StripeFake = {
    port,
    url: baseUrl,
    env: {
      STRIPE_SECRET_KEY: FAKE_SECRET_KEY,
      STRIPE_WEBHOOK_SECRET: FAKE_WEBHOOK_SECRET,
      STRIPE_API_HOST: HOST,
      STRIPE_API_PORT: String(port),
      STRIPE_API_PROTOCOL: "http",
    },
    setWebhookUrl: (url) => {
      webhookUrl = url;
    },
    advance: async (seconds) => {
      state.clockOffsetS += Math.max(0, Math.round(seconds));
      await runRenewals();
    },
    failNextRenewal: () => {
      state.failNextRenewal = true;
      save();
    },
    nowS,
    events: () => sent.slice(),
    get: (id) => state.objects[id],
    stop: async () => {
      await delivery;
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
  return fake;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const fake = await startStripeFake({
    port: Number(process.env.STRIPE_FAKE_PORT ?? 12111),
    webhookUrl: process.env.STRIPE_FAKE_WEBHOOK_URL ?? "http://127.0.0.1:3000/api/payments/webhook",
  });
  console.log(`[plumbline] payment fake: API ${fake.url}`);
}
