// Start and stop the local payments-provider fake (scripts/fake-payments.mjs) for `npm start` and
// `npm test`, and the environment that points the app's SDK at it.
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { root, startChild, stopPid, waitForHttp } from './proc.mjs';

/**
 * Start the fake on `port`. With `webhookUrl` (npm start), an account for a fixed development key
 * gets a webhook endpoint at that URL, signed with a secret made for this run; tests make their
 * own accounts and endpoints through the SDK instead.
 * @param {{ port: number, stateFile?: string, webhookUrl?: string }} opts
 */
export async function startFakePayments({ port, stateFile, webhookUrl }) {
  const key = 'sk_test_wickstone_local_development';
  const webhookSecret = `whsec_${randomBytes(24).toString('base64url')}`;
  const child = startChild('payments', 'node', [path.join(root, 'scripts', 'fake-payments.mjs')], {
    env: {
      ...process.env,
      FAKE_PAYMENTS_PORT: String(port),
      ...(stateFile ? { FAKE_PAYMENTS_FILE: stateFile } : {}),
      ...(webhookUrl
        ? {
            FAKE_PAYMENTS_WEBHOOK_URL: webhookUrl,
            FAKE_PAYMENTS_WEBHOOK_SECRET: webhookSecret,
            FAKE_PAYMENTS_KEY: key,
          }
        : {}),
    },
  });
  await waitForHttp(`http://127.0.0.1:${port}/_fake/health`);
  /** What the app's config reads: the SDK's host, port and protocol come from PAYMENTS_API_URL. */
  const env = {
    PAYMENTS_API_URL: `http://127.0.0.1:${port}`,
    ...(webhookUrl ? { PAYMENTS_SECRET_KEY: key, PAYMENTS_WEBHOOK_SECRET: webhookSecret } : {}),
  };
  return { child, env, stop: () => stopPid(child.pid, 5_000) };
}
