import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import type Stripe from 'stripe';
import { createApp } from '../src/app.js';
import { createPaymentsClient } from '../src/billing/provider.js';
import { createLogger } from '../src/logger.js';
import { createTestDatabase, type TestDatabase } from './db.js';

/** The two test cards the payments fake knows. */
export const CARD_OK = '4242 4242 4242 4242';
export const CARD_DECLINED = '4000 0000 0000 0002';

/** The fake's controls that stand in for time passing and for a person on its checkout page. */
export class FakePayments {
  constructor(
    readonly apiUrl: string,
    readonly key: string,
  ) {}

  private async call(path: string, body: Record<string, string> = {}): Promise<Record<string, unknown>> {
    const res = await fetch(`${this.apiUrl}${path}`, {
      method: 'POST',
      headers: { authorization: `Bearer ${this.key}`, 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams(body).toString(),
    });
    if (!res.ok) throw new Error(`fake ${path} answered ${res.status}: ${await res.text()}`);
    return (await res.json()) as Record<string, unknown>;
  }

  /** The subscription reaches its next billing moment (renewal, a retried payment, or its end). */
  advance(subscriptionId: string) {
    return this.call(`/_fake/subscriptions/${subscriptionId}/advance`);
  }
  setCard(customerId: string, card: string) {
    return this.call(`/_fake/customers/${customerId}/card`, { card });
  }
  resend(eventId: string) {
    return this.call(`/_fake/events/${eventId}/resend`);
  }

  /** Submit the checkout page's form as a person would: the status and where it sends the browser. */
  async pay(
    checkoutUrl: string,
    card: string,
  ): Promise<{ status: number; location: string | null; text: string }> {
    const res = await fetch(checkoutUrl, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ card, expiry: '12/34' }).toString(),
      redirect: 'manual',
    });
    return { status: res.status, location: res.headers.get('location'), text: await res.text() };
  }
}

export interface BillingTestApp {
  url: string;
  app: Express;
  db: TestDatabase;
  /** The SDK on this test's own account at the fake. */
  sdk: Stripe;
  fake: FakePayments;
  webhookSecret: string;
  stop(): Promise<void>;
}

function listen(server: Server): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve((server.address() as AddressInfo).port));
  });
}

/**
 * The app listening on a loopback port (the fake delivers webhooks to it), with an account of its
 * own at the payments fake: a fresh secret key, and a webhook endpoint registered through the SDK
 * as one would be at the provider. Needs PAYMENTS_API_URL (npm test sets it).
 */
export async function startBillingApp(env: NodeJS.ProcessEnv = {}): Promise<BillingTestApp> {
  const apiUrl = process.env.PAYMENTS_API_URL;
  if (!apiUrl) throw new Error('PAYMENTS_API_URL is not set: start the payments fake (npm test does)');
  const key = `sk_test_${randomBytes(12).toString('hex')}`;
  const server = createServer();
  const port = await listen(server);
  const url = `http://127.0.0.1:${port}`;
  const sdk = createPaymentsClient({ apiUrl, secretKey: key, webhookSecret: undefined });
  if (!sdk) throw new Error('no payments client');
  const endpoint = await sdk.webhookEndpoints.create({
    url: `${url}/api/v1/billing/webhook`,
    enabled_events: ['*'],
  });
  const webhookSecret = endpoint.secret ?? '';
  const db = await createTestDatabase({
    BCRYPT_COST: '4',
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: url,
    PAYMENTS_API_URL: apiUrl,
    PAYMENTS_SECRET_KEY: key,
    PAYMENTS_WEBHOOK_SECRET: webhookSecret,
    ...env,
  });
  const app = createApp({ config: db.config, sequelize: db.sequelize, logger: createLogger(db.config) });
  server.on('request', app);
  return {
    url,
    app,
    db,
    sdk,
    fake: new FakePayments(apiUrl, key),
    webhookSecret,
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.drop();
    },
  };
}
