// The local stand-in for the payments provider: the subset of its HTTP API that the server's SDK
// calls (customers, products and prices, checkout sessions, subscriptions, invoices, webhook
// endpoints, test clocks), its own checkout and invoice pages, and webhook delivery signed with the
// provider's scheme (`t=<unix seconds>,v1=<HMAC-SHA256 of "t.body">`). Started by `npm start` and
// `npm test` through scripts/lib/payments.mjs; the server reaches it only through the SDK.
//
// Each secret API key is its own account (so test files running side by side never see each
// other's customers or events). Test cards: 4242 4242 4242 4242 is accepted, 4000 0000 0000 0002 is
// declined. Fake-only controls under /_fake/ stand in for time passing:
//   POST /_fake/subscriptions/:id/advance   the subscription reaches its next billing moment
//                                           (renewal, a retry of a failed payment, or its end)
//   POST /_fake/customers/:id/card          card=<number>: the card on file from now on
//   POST /_fake/events/:id/resend           deliver an event again, freshly signed
//   FAKE_PAYMENTS_PORT (default 12110)  FAKE_PAYMENTS_FILE (state, JSON)
//   FAKE_PAYMENTS_WEBHOOK_URL / FAKE_PAYMENTS_WEBHOOK_SECRET / FAKE_PAYMENTS_KEY: an endpoint set up
//   out of band for that key, as one is in the provider's own console.
import { createServer } from 'node:http';
import { createHmac, randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import qs from 'qs';

const port = Number(process.env.FAKE_PAYMENTS_PORT ?? 12110);
const file = process.env.FAKE_PAYMENTS_FILE;
const publicBase = `http://127.0.0.1:${port}`;
const API_VERSION = '2026-10-28.endive';
const CARD_OK = '4242424242424242';
const CARD_DECLINED = '4000000000000002';
const RETRY_AFTER_S = 3 * 86_400;

/** @type {{ accounts: Record<string, any>, index: Record<string, string>, seq: number }} */
let state = { accounts: {}, index: {}, seq: 0 };
if (file && existsSync(file)) state = JSON.parse(readFileSync(file, 'utf8'));

function save() {
  if (!file) return;
  mkdirSync(path.dirname(file), { recursive: true });
  writeFileSync(`${file}.tmp`, JSON.stringify(state));
  renameSync(`${file}.tmp`, file);
}

function account(key) {
  state.accounts[key] ??= {
    customers: {},
    products: {},
    prices: {},
    sessions: {},
    subscriptions: {},
    invoices: {},
    events: {},
    endpoints: {},
    clocks: {},
    invoiceSeq: 0,
  };
  return state.accounts[key];
}

const newId = (prefix) => `${prefix}_${randomBytes(10).toString('hex')}`;
function track(key, obj) {
  state.index[obj.id] = key;
  return obj;
}

/** The provider's error shape. */
class ApiError extends Error {
  constructor(status, type, message, extra = {}) {
    super(message);
    this.status = status;
    this.body = { error: { type, message, ...extra } };
  }
}
const missing = (what, id) =>
  new ApiError(404, 'invalid_request_error', `No such ${what}: '${id}'`, { code: 'resource_missing' });
const needParam = (param) =>
  new ApiError(400, 'invalid_request_error', `Missing required param: ${param}.`, {
    code: 'parameter_missing',
    param,
  });

function nowFor(acct, customerId) {
  const c = acct.customers[customerId];
  const clock = c?.test_clock ? acct.clocks[c.test_clock] : null;
  return clock ? clock.frozen_time : Math.floor(Date.now() / 1000);
}

/** One calendar month on from `t` (seconds), as the provider bills monthly plans. */
function monthAfter(t) {
  const d = new Date(t * 1000);
  d.setUTCMonth(d.getUTCMonth() + 1);
  return Math.floor(d.getTime() / 1000);
}

const cardOf = (acct, customerId) => acct.customers[customerId]?._card ?? null;
const cardOk = (number) => number === CARD_OK;
const digits = (s) => String(s ?? '').replace(/\D/g, '');

// ---------------------------------------------------------------- events and webhooks

function sign(secret, payload, t = Math.floor(Date.now() / 1000)) {
  const v1 = createHmac('sha256', secret).update(`${t}.${payload}`).digest('hex');
  return `t=${t},v1=${v1}`;
}

async function deliver(acct, event) {
  const payload = JSON.stringify(event, null, 2);
  for (const ep of Object.values(acct.endpoints)) {
    if (!ep.enabled_events.includes('*') && !ep.enabled_events.includes(event.type)) continue;
    let status = 0;
    try {
      const res = await fetch(ep.url, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'stripe-signature': sign(ep.secret, payload) },
        body: payload,
        signal: AbortSignal.timeout(15_000),
      });
      status = res.status;
    } catch {
      status = 0;
    }
    event._deliveries = [...(event._deliveries ?? []), { endpoint: ep.id, status, at: Date.now() }];
  }
}

/** Record events, then deliver them in order before the triggering call answers (so tests need no waiting). */
async function emit(acct, items) {
  const events = items.map(([type, object]) => {
    const e = {
      id: newId('evt'),
      object: 'event',
      api_version: API_VERSION,
      created: Math.floor(Date.now() / 1000),
      livemode: false,
      type,
      data: { object: structuredClone(object) },
      pending_webhooks: Object.keys(acct.endpoints).length,
    };
    acct.events[e.id] = e;
    return e;
  });
  save();
  for (const e of events) await deliver(acct, e);
  save();
}

function publicEvent(e) {
  const { _deliveries, ...rest } = e;
  return rest;
}

// ---------------------------------------------------------------- billing logic

function priceOf(acct, id) {
  const p = acct.prices[id];
  if (!p) throw missing('price', id);
  return p;
}

function makeInvoice(acct, key, sub, lines, reason, at) {
  acct.invoiceSeq += 1;
  const id = newId('in');
  const total = lines.reduce((s, l) => s + l.amount, 0);
  const inv = track(key, {
    id,
    object: 'invoice',
    number: `WKF-${String(acct.invoiceSeq).padStart(4, '0')}`,
    customer: sub.customer,
    subscription: sub.id,
    parent: { type: 'subscription_details', subscription_details: { subscription: sub.id } },
    billing_reason: reason,
    currency: sub.items.data[0].price.currency,
    created: at,
    period_start: Math.min(...lines.map((l) => l.period.start)),
    period_end: Math.max(...lines.map((l) => l.period.end)),
    total,
    subtotal: total,
    amount_due: Math.max(total, 0),
    amount_paid: 0,
    amount_remaining: Math.max(total, 0),
    status: 'open',
    attempt_count: 0,
    next_payment_attempt: null,
    hosted_invoice_url: `${publicBase}/invoices/${id}`,
    invoice_pdf: `${publicBase}/invoices/${id}?format=pdf`,
    lines: {
      object: 'list',
      data: lines.map((l) => ({ id: newId('il'), object: 'line_item', currency: 'gbp', ...l })),
      has_more: false,
    },
    livemode: false,
  });
  acct.invoices[id] = inv;
  return inv;
}

/** Try to take an invoice's amount from the customer's card; a credit needs no card. */
function collect(acct, inv, at) {
  inv.attempt_count += 1;
  if (inv.amount_due <= 0 || cardOk(cardOf(acct, inv.customer))) {
    inv.status = 'paid';
    inv.amount_paid = inv.amount_due;
    inv.amount_remaining = 0;
    inv.next_payment_attempt = null;
    inv.status_transitions = { paid_at: at };
    return true;
  }
  return false;
}

function setPeriod(sub, start, end) {
  sub.current_period_start = start;
  sub.current_period_end = end;
  for (const item of sub.items.data) {
    item.current_period_start = start;
    item.current_period_end = end;
  }
}

function newSubscription(acct, key, customer, price, metadata, at) {
  const sub = track(key, {
    id: newId('sub'),
    object: 'subscription',
    customer,
    status: 'incomplete',
    created: at,
    start_date: at,
    billing_cycle_anchor: at,
    cancel_at_period_end: false,
    canceled_at: null,
    ended_at: null,
    metadata: metadata ?? {},
    latest_invoice: null,
    items: {
      object: 'list',
      data: [{ id: newId('si'), object: 'subscription_item', price, quantity: 1 }],
      has_more: false,
    },
    livemode: false,
  });
  setPeriod(sub, at, monthAfter(at));
  return sub;
}

/** The subscription's next billing moment has come: its end, a renewal, or a retried payment. */
function advance(acct, key, sub) {
  const out = [];
  if (sub.status === 'canceled' || sub.status === 'unpaid' || sub.status === 'incomplete') return out;
  const open = sub.latest_invoice ? acct.invoices[sub.latest_invoice] : null;
  if (sub.status === 'past_due' && open?.status === 'open') {
    const at = open.next_payment_attempt ?? sub.current_period_start;
    if (collect(acct, open, at)) {
      sub.status = 'active';
      out.push(['invoice.paid', open], ['customer.subscription.updated', sub]);
    } else {
      // Retries exhausted: the provider keeps the invoice open and marks the subscription unpaid.
      open.next_payment_attempt = null;
      sub.status = 'unpaid';
      out.push(['invoice.payment_failed', open], ['customer.subscription.updated', sub]);
    }
    return out;
  }
  const at = sub.current_period_end;
  if (sub.cancel_at_period_end) {
    sub.status = 'canceled';
    sub.ended_at = at;
    sub.canceled_at ??= at;
    out.push(['customer.subscription.deleted', sub]);
    return out;
  }
  const end = monthAfter(at);
  const inv = periodInvoice(acct, key, sub, at, end, 'subscription_cycle');
  setPeriod(sub, at, end);
  sub.latest_invoice = inv.id;
  out.push(['invoice.created', inv]);
  if (collect(acct, inv, at)) {
    sub.status = 'active';
    out.push(['invoice.paid', inv]);
  } else {
    sub.status = 'past_due';
    inv.next_payment_attempt = at + RETRY_AFTER_S;
    out.push(['invoice.payment_failed', inv]);
  }
  out.push(['customer.subscription.updated', sub]);
  return out;
}

// ---------------------------------------------------------------- lists

function list(items, url, query) {
  const limit = Math.min(Number(query.limit ?? 10), 100);
  let data = items;
  if (query.starting_after) {
    const i = data.findIndex((x) => x.id === query.starting_after);
    data = i >= 0 ? data.slice(i + 1) : data;
  }
  return { object: 'list', url, data: data.slice(0, limit), has_more: data.length > limit };
}

const newestFirst = (a, b) => b.created - a.created || (b.number ?? b.id).localeCompare(a.number ?? a.id);

// ---------------------------------------------------------------- the API

/** @type {Array<[string, RegExp, (ctx: any) => Promise<any> | any]>} */
const api = [
  [
    'POST',
    /^\/v1\/customers$/,
    ({ acct, key, body }) => {
      if (body.test_clock && !acct.clocks[body.test_clock]) throw missing('test_clock', body.test_clock);
      const c = track(key, {
        id: newId('cus'),
        object: 'customer',
        email: body.email ?? null,
        name: body.name ?? null,
        metadata: body.metadata ?? {},
        balance: 0,
        test_clock: body.test_clock ?? null,
        created: Math.floor(Date.now() / 1000),
        invoice_settings: { default_payment_method: null },
        livemode: false,
      });
      if (body.payment_method) attachTestCard(c, body.payment_method);
      acct.customers[c.id] = c;
      return c;
    },
  ],
  [
    'GET',
    /^\/v1\/customers\/([\w]+)$/,
    ({ acct, m }) => acct.customers[m[1]] ?? Promise.reject(missing('customer', m[1])),
  ],
  [
    'POST',
    /^\/v1\/products$/,
    ({ acct, key, body }) => {
      if (!body.name) throw needParam('name');
      const p = track(key, {
        id: newId('prod'),
        object: 'product',
        name: body.name,
        metadata: body.metadata ?? {},
        active: true,
        created: Math.floor(Date.now() / 1000),
      });
      acct.products[p.id] = p;
      return p;
    },
  ],
  [
    'POST',
    /^\/v1\/prices$/,
    ({ acct, key, body }) => {
      if (!body.product || !acct.products[body.product]) throw needParam('product');
      if (body.unit_amount === undefined) throw needParam('unit_amount');
      if (!body.currency) throw needParam('currency');
      if (body.lookup_key && Object.values(acct.prices).some((p) => p.lookup_key === body.lookup_key))
        throw new ApiError(400, 'invalid_request_error', 'A price with this lookup_key already exists.', {
          param: 'lookup_key',
        });
      const p = track(key, {
        id: newId('price'),
        object: 'price',
        product: body.product,
        unit_amount: Number(body.unit_amount),
        currency: body.currency,
        recurring: { interval: body.recurring?.interval ?? 'month', interval_count: 1 },
        lookup_key: body.lookup_key ?? null,
        metadata: body.metadata ?? {},
        active: true,
        type: 'recurring',
        created: Math.floor(Date.now() / 1000),
      });
      acct.prices[p.id] = p;
      return p;
    },
  ],
  [
    'GET',
    /^\/v1\/prices$/,
    ({ acct, query }) => {
      const keys = [query.lookup_keys ?? []].flat();
      const all = Object.values(acct.prices).filter((p) => !keys.length || keys.includes(p.lookup_key));
      return list(all, '/v1/prices', { ...query, limit: query.limit ?? 100 });
    },
  ],
  [
    'POST',
    /^\/v1\/checkout\/sessions$/,
    ({ acct, key, body }) => {
      if (body.mode !== 'subscription')
        throw new ApiError(400, 'invalid_request_error', 'This fake takes subscription checkouts only.', {
          param: 'mode',
        });
      if (!body.success_url) throw needParam('success_url');
      if (!body.customer || !acct.customers[body.customer]) throw needParam('customer');
      const line = body.line_items?.[0];
      if (!line?.price) throw needParam('line_items[0][price]');
      priceOf(acct, line.price);
      const id = newId('cs_test');
      const s = track(key, {
        id,
        object: 'checkout.session',
        mode: 'subscription',
        status: 'open',
        payment_status: 'unpaid',
        customer: body.customer,
        subscription: null,
        client_reference_id: body.client_reference_id ?? null,
        metadata: body.metadata ?? {},
        success_url: body.success_url,
        cancel_url: body.cancel_url ?? null,
        url: `${publicBase}/checkout/${id}`,
        created: Math.floor(Date.now() / 1000),
        _price: line.price,
        _subscriptionMetadata: body.subscription_data?.metadata ?? {},
        livemode: false,
      });
      acct.sessions[id] = s;
      return checkoutView(s);
    },
  ],
  [
    'GET',
    /^\/v1\/checkout\/sessions\/([\w]+)$/,
    ({ acct, m }) => {
      const s = acct.sessions[m[1]];
      if (!s) throw missing('checkout.session', m[1]);
      return checkoutView(s);
    },
  ],
  [
    'POST',
    /^\/v1\/subscriptions$/,
    async ({ acct, key, body }) => {
      const c = acct.customers[body.customer];
      if (!c) throw needParam('customer');
      if (body.default_payment_method) attachTestCard(c, body.default_payment_method);
      const priceId = body.items?.[0]?.price;
      if (!priceId) throw needParam('items[0][price]');
      const at = nowFor(acct, c.id);
      const sub = newSubscription(acct, key, c.id, priceOf(acct, priceId), body.metadata, at);
      acct.subscriptions[sub.id] = sub;
      const events = firstPayment(acct, key, sub, at);
      if (sub.status !== 'active') {
        await emit(acct, events);
        throw new ApiError(402, 'card_error', 'Your card was declined.', { code: 'card_declined' });
      }
      await emit(acct, events);
      return sub;
    },
  ],
  [
    'GET',
    /^\/v1\/subscriptions\/([\w]+)$/,
    ({ acct, m }) => acct.subscriptions[m[1]] ?? Promise.reject(missing('subscription', m[1])),
  ],
  [
    'POST',
    /^\/v1\/subscriptions\/([\w]+)$/,
    async ({ acct, key, m, body }) => {
      const sub = acct.subscriptions[m[1]];
      if (!sub) throw missing('subscription', m[1]);
      if (sub.status === 'canceled')
        throw new ApiError(400, 'invalid_request_error', 'A canceled subscription can not be updated.');
      const events = [];
      if (body.metadata) sub.metadata = { ...sub.metadata, ...body.metadata };
      if (body.cancel_at_period_end !== undefined) {
        sub.cancel_at_period_end = body.cancel_at_period_end === 'true' || body.cancel_at_period_end === true;
        sub.canceled_at = sub.cancel_at_period_end ? nowFor(acct, sub.customer) : null;
      }
      const item = body.items?.[0];
      if (item?.price) {
        if (item.id && item.id !== sub.items.data[0].id) throw missing('subscription_item', item.id);
        const next = priceOf(acct, item.price);
        const prev = sub.items.data[0].price;
        const at = nowFor(acct, sub.customer);
        if (body.proration_behavior !== 'none' && next.id !== prev.id) {
          // Proration as the provider computes it: unused time on the old price credited, the rest of
          // the period on the new price charged, both by the second.
          const start = sub.current_period_start;
          const end = sub.current_period_end;
          const share = Math.max(0, Math.min(1, (end - at) / (end - start)));
          const name = (p) => acct.products[p.product]?.name ?? 'plan';
          const inv = makeInvoice(
            acct,
            key,
            sub,
            [
              {
                description: `Unused time on ${name(prev)}`,
                amount: -Math.round(prev.unit_amount * share),
                period: { start: at, end },
                proration: true,
              },
              {
                description: `Remaining time on ${name(next)}`,
                amount: Math.round(next.unit_amount * share),
                period: { start: at, end },
                proration: true,
              },
            ],
            'subscription_update',
            at,
          );
          if (!collect(acct, inv, at)) {
            inv.status = 'void';
            throw new ApiError(402, 'card_error', 'Your card was declined.', { code: 'card_declined' });
          }
          if (inv.total < 0) acct.customers[sub.customer].balance += inv.total;
          sub.latest_invoice = inv.id;
          events.push(['invoice.created', inv], ['invoice.paid', inv]);
        }
        sub.items.data[0].price = next;
      }
      events.push(['customer.subscription.updated', sub]);
      await emit(acct, events);
      return sub;
    },
  ],
  [
    'GET',
    /^\/v1\/invoices$/,
    ({ acct, query }) => {
      const all = Object.values(acct.invoices)
        .filter((i) => (!query.customer || i.customer === query.customer) && i.status !== 'void')
        .filter((i) => !query.subscription || i.subscription === query.subscription)
        .sort(newestFirst);
      return list(all, '/v1/invoices', query);
    },
  ],
  [
    'GET',
    /^\/v1\/invoices\/([\w]+)$/,
    ({ acct, m }) => acct.invoices[m[1]] ?? Promise.reject(missing('invoice', m[1])),
  ],
  [
    'GET',
    /^\/v1\/events\/([\w]+)$/,
    ({ acct, m }) =>
      acct.events[m[1]] ? publicEvent(acct.events[m[1]]) : Promise.reject(missing('event', m[1])),
  ],
  [
    'GET',
    /^\/v1\/events$/,
    ({ acct, query }) =>
      list(
        Object.values(acct.events)
          .filter((e) => !query.type || e.type === query.type)
          .reverse()
          .map(publicEvent),
        '/v1/events',
        query,
      ),
  ],
  [
    'POST',
    /^\/v1\/webhook_endpoints$/,
    ({ acct, key, body }) => {
      if (!body.url) throw needParam('url');
      const ep = track(key, {
        id: newId('we'),
        object: 'webhook_endpoint',
        url: body.url,
        enabled_events: [body.enabled_events ?? ['*']].flat(),
        status: 'enabled',
        secret: `whsec_${randomBytes(24).toString('base64url')}`,
        created: Math.floor(Date.now() / 1000),
      });
      acct.endpoints[ep.id] = ep;
      return ep;
    },
  ],
  [
    'POST',
    /^\/v1\/test_helpers\/test_clocks$/,
    ({ acct, key, body }) => {
      if (body.frozen_time === undefined) throw needParam('frozen_time');
      const c = track(key, {
        id: newId('clock'),
        object: 'test_helpers.test_clock',
        frozen_time: Number(body.frozen_time),
        name: body.name ?? null,
        status: 'ready',
        created: Math.floor(Date.now() / 1000),
      });
      acct.clocks[c.id] = c;
      return c;
    },
  ],
  [
    'POST',
    /^\/v1\/test_helpers\/test_clocks\/([\w]+)\/advance$/,
    async ({ acct, key, m, body }) => {
      const clock = acct.clocks[m[1]];
      if (!clock) throw missing('test_clock', m[1]);
      const to = Number(body.frozen_time);
      if (!(to > clock.frozen_time))
        throw new ApiError(400, 'invalid_request_error', 'frozen_time must move forward.', {
          param: 'frozen_time',
        });
      const events = [];
      for (const sub of Object.values(acct.subscriptions)) {
        if (acct.customers[sub.customer]?.test_clock !== clock.id) continue;
        for (let guard = 0; guard < 120; guard++) {
          const due =
            sub.status === 'past_due'
              ? (acct.invoices[sub.latest_invoice]?.next_payment_attempt ?? Infinity)
              : sub.current_period_end;
          if (!['active', 'past_due'].includes(sub.status) || due > to) break;
          clock.frozen_time = due;
          events.push(...advance(acct, key, sub));
        }
      }
      clock.frozen_time = to;
      await emit(acct, events);
      return clock;
    },
  ],
];

function attachTestCard(customer, paymentMethod) {
  // The provider's test payment-method tokens for the two test cards.
  const number = { pm_card_visa: CARD_OK, pm_card_chargeDeclined: CARD_DECLINED }[paymentMethod];
  if (!number) throw new ApiError(400, 'invalid_request_error', `No such PaymentMethod: '${paymentMethod}'`);
  customer._card = number;
  customer.invoice_settings.default_payment_method = paymentMethod;
}

/** The invoice for one month of the subscription's plan. */
function periodInvoice(acct, key, sub, start, end, reason) {
  const price = sub.items.data[0].price;
  const line = {
    description: `1 × ${acct.products[price.product]?.name ?? 'plan'} (monthly)`,
    amount: price.unit_amount,
    period: { start, end },
    proration: false,
  };
  return makeInvoice(acct, key, sub, [line], reason, start);
}

function firstPayment(acct, key, sub, at) {
  const inv = periodInvoice(acct, key, sub, at, sub.current_period_end, 'subscription_create');
  sub.latest_invoice = inv.id;
  if (collect(acct, inv, at)) {
    sub.status = 'active';
    return [
      ['customer.subscription.created', sub],
      ['invoice.paid', inv],
    ];
  }
  inv.status = 'void';
  sub.status = 'incomplete_expired';
  return [];
}

function checkoutView(s) {
  const out = {};
  for (const [k, v] of Object.entries(s)) if (!k.startsWith('_')) out[k] = v;
  return out;
}

// ---------------------------------------------------------------- pages (HTML)

const esc = (s) =>
  String(s).replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c],
  );
const money = (pence, currency) =>
  `${(pence < 0 ? '−' : '') + currency.toUpperCase()} ${(Math.abs(pence) / 100).toFixed(2)}`;
const day = (t) => new Date(t * 1000).toISOString().slice(0, 10);

function page(title, body) {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>${esc(title)}</title>
<style>
body{margin:0;font-family:system-ui,sans-serif;background:#eef1ee;color:#1d2420}
main{max-width:26rem;margin:2rem auto;background:#fff;border:1px solid #c9d0ca;border-radius:6px;padding:1.5rem}
.note{font-size:.8rem;background:#fff6d8;border:1px solid #e2cf8f;padding:.5rem;border-radius:4px}
label{display:block;margin-top:1rem;font-weight:600}input{width:100%;box-sizing:border-box;padding:.6rem;font-size:1rem;margin-top:.3rem;border:1px solid #8a948c;border-radius:4px}
button{margin-top:1.2rem;width:100%;padding:.7rem;font-size:1rem;background:#2c5a3f;color:#fff;border:0;border-radius:4px;cursor:pointer}
.err{color:#9b1c1c;margin-top:.8rem}table{width:100%;border-collapse:collapse}td{padding:.3rem 0;border-bottom:1px solid #e3e7e3}td:last-child{text-align:right}
</style></head><body><main>${body}</main></body></html>`;
}

function checkoutPage(acct, s, error) {
  const price = acct.prices[s._price];
  const product = acct.products[price.product];
  return page(
    `Pay for ${product?.name ?? 'a plan'}`,
    `<p class="note">Local payments fake: no money moves. Card 4242 4242 4242 4242 is accepted, 4000 0000 0000 0002 is declined.</p>
<h1>${esc(product?.name ?? 'Plan')}</h1>
<p><strong data-testid="checkout-amount">${esc(money(price.unit_amount, price.currency))}</strong> a month</p>
<form method="post" action="/checkout/${esc(s.id)}">
<label for="card">Card number</label><input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required>
<label for="expiry">Expiry (MM/YY)</label><input id="expiry" name="expiry" value="12/34" required>
${error ? `<p class="err" role="alert">${esc(error)}</p>` : ''}
<button type="submit">Pay ${esc(money(price.unit_amount, price.currency))}</button>
</form>
${s.cancel_url ? `<p><a href="${esc(s.cancel_url)}">Go back without paying</a></p>` : ''}`,
  );
}

function invoicePage(inv) {
  const rows = inv.lines.data
    .map(
      (l) =>
        `<tr><td>${esc(l.description)}<br><small>${day(l.period.start)} to ${day(l.period.end)}</small></td><td>${esc(money(l.amount, inv.currency))}</td></tr>`,
    )
    .join('');
  return page(
    `Invoice ${inv.number}`,
    `<p class="note">Local payments fake: an invented invoice.</p><h1>Invoice ${esc(inv.number)}</h1>
<p>Issued ${day(inv.created)} · ${esc(inv.status)}</p><table>${rows}<tr><td><strong>Total</strong></td><td><strong>${esc(money(inv.total, inv.currency))}</strong></td></tr></table>`,
  );
}

async function completeCheckout(acct, key, s, card) {
  const c = acct.customers[s.customer];
  c._card = card;
  c.invoice_settings.default_payment_method = `pm_${randomBytes(6).toString('hex')}`;
  const at = nowFor(acct, c.id);
  const sub = newSubscription(acct, key, c.id, priceOf(acct, s._price), s._subscriptionMetadata, at);
  acct.subscriptions[sub.id] = sub;
  const events = firstPayment(acct, key, sub, at);
  s.status = 'complete';
  s.payment_status = 'paid';
  s.subscription = sub.id;
  events.push(['checkout.session.completed', checkoutView(s)]);
  await emit(acct, events);
}

// ---------------------------------------------------------------- HTTP

async function readBody(req) {
  const chunks = [];
  for await (const c of req) chunks.push(c);
  return Buffer.concat(chunks).toString('utf8');
}

function send(res, status, body, type = 'application/json') {
  res.writeHead(status, { 'content-type': type, 'request-id': newId('req') });
  res.end(type === 'application/json' ? JSON.stringify(body) : body);
}

function byId(id) {
  const key = state.index[id];
  return key ? { key, acct: account(key) } : null;
}

const server = createServer((req, res) => {
  handle(req, res).catch((err) => {
    if (err instanceof ApiError) return send(res, err.status, err.body);
    console.error(err);
    send(res, 500, { error: { type: 'api_error', message: 'The fake failed: see its log' } });
  });
});

async function handle(req, res) {
  const url = new URL(req.url ?? '/', publicBase);
  const raw = await readBody(req);
  const method = req.method ?? 'GET';

  // Pages a person's browser opens: no API key, found by the object's id.
  let m = /^\/checkout\/([\w]+)$/.exec(url.pathname);
  if (m) {
    const found = byId(m[1]);
    const s = found?.acct.sessions[m[1]];
    if (!found || !s) return send(res, 404, page('Not found', '<p>No such checkout.</p>'), 'text/html');
    if (s.status !== 'open') {
      res.writeHead(303, { location: s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id) });
      return res.end();
    }
    if (method === 'GET') return send(res, 200, checkoutPage(found.acct, s), 'text/html; charset=utf-8');
    const card = digits(new URLSearchParams(raw).get('card'));
    if (card !== CARD_OK) {
      const msg =
        card === CARD_DECLINED
          ? 'The card was declined. Try another card.'
          : 'This card number is not one the test mode knows.';
      return send(res, 402, checkoutPage(found.acct, s, msg), 'text/html; charset=utf-8');
    }
    await completeCheckout(found.acct, found.key, s, card);
    res.writeHead(303, { location: s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id) });
    return res.end();
  }
  m = /^\/invoices\/([\w]+)$/.exec(url.pathname);
  if (m && method === 'GET') {
    const inv = byId(m[1])?.acct.invoices[m[1]];
    if (!inv) return send(res, 404, page('Not found', '<p>No such invoice.</p>'), 'text/html');
    return send(res, 200, invoicePage(inv), 'text/html; charset=utf-8');
  }
  if (url.pathname === '/_fake/health') return send(res, 200, { ok: true });

  // The API: a secret key names the account.
  const auth = /^Bearer (sk_test_[\w-]+)$/.exec(req.headers.authorization ?? '');
  if (!auth) {
    throw new ApiError(401, 'invalid_request_error', 'You did not provide a valid API key (sk_test_...).');
  }
  const key = auth[1];
  const acct = account(key);
  const body = method === 'GET' ? {} : qs.parse(raw, { depth: 5, arrayLimit: 100 });
  const query = qs.parse(url.search.slice(1), { depth: 5 });

  m = /^\/_fake\/subscriptions\/([\w]+)\/advance$/.exec(url.pathname);
  if (m && method === 'POST') {
    const sub = acct.subscriptions[m[1]];
    if (!sub) throw missing('subscription', m[1]);
    await emit(acct, advance(acct, key, sub));
    return send(res, 200, sub);
  }
  m = /^\/_fake\/customers\/([\w]+)\/card$/.exec(url.pathname);
  if (m && method === 'POST') {
    const c = acct.customers[m[1]];
    if (!c) throw missing('customer', m[1]);
    c._card = digits(body.card);
    save();
    return send(res, 200, { id: c.id, card: c._card.slice(-4) });
  }
  m = /^\/_fake\/events\/([\w]+)\/resend$/.exec(url.pathname);
  if (m && method === 'POST') {
    const e = acct.events[m[1]];
    if (!e) throw missing('event', m[1]);
    await deliver(acct, e);
    save();
    return send(res, 200, { id: e.id, deliveries: e._deliveries });
  }

  for (const [verb, pattern, fn] of api) {
    if (verb !== method) continue;
    const match = pattern.exec(url.pathname);
    if (!match) continue;
    const out = await fn({ acct, key, m: match, body, query });
    save();
    return send(res, 200, out);
  }
  throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${url.pathname}).`);
}

// An endpoint set up out of band for one key (npm start), as one is in the provider's console.
if (process.env.FAKE_PAYMENTS_WEBHOOK_URL && process.env.FAKE_PAYMENTS_KEY) {
  const acct = account(process.env.FAKE_PAYMENTS_KEY);
  const existing = Object.values(acct.endpoints).find((e) => e.url === process.env.FAKE_PAYMENTS_WEBHOOK_URL);
  const secret = process.env.FAKE_PAYMENTS_WEBHOOK_SECRET ?? `whsec_${randomBytes(24).toString('base64url')}`;
  if (existing) existing.secret = secret;
  else {
    const id = newId('we');
    acct.endpoints[id] = track(process.env.FAKE_PAYMENTS_KEY, {
      id,
      object: 'webhook_endpoint',
      url: process.env.FAKE_PAYMENTS_WEBHOOK_URL,
      enabled_events: ['*'],
      status: 'enabled',
      secret,
      created: Math.floor(Date.now() / 1000),
    });
  }
  save();
}

server.listen(port, '127.0.0.1', () => {
  process.stdout.write(`fake payments provider on ${publicBase}\n`);
});
for (const sig of ['SIGINT', 'SIGTERM']) {
  process.on(sig, () => {
    save();
    server.close(() => process.exit(0));
    server.closeAllConnections();
  });
}
