import type { Counters, CounterState } from '../http/counters.js';

/**
 * Sign-in throttling without lockouts. What it follows:
 * - OWASP ASVS 5.0 V6.1.1 / V6.3.1: documented controls against credential stuffing and brute force
 *   that "prevent malicious account lockout" (README, "Sign-in throttling"); V6.3.4: users are
 *   notified of suspicious authentication attempts (the burst mail).
 * - OWASP "Slow Down Online Guessing Attacks with Device Cookies": a client that signed in to this
 *   account before carries a signed device cookie and is judged on its own failures only, so a
 *   stranger's failures never slow the owner on their own device; untrusted clients share limits.
 * - OWASP Credential Stuffing Prevention Cheat Sheet: per-user failures kept apart from per-client
 *   (IP) limits, and blocks on a client are temporary.
 *
 * The limits, all over one window (RATE_LIMIT_WINDOW_MINUTES):
 * - per (account, client address) pair: `pairFree` failures free, then growing delays
 *   (1 s, 2 s, 4 s, ... up to `maxDelayS`) measured from the last failure;
 * - per account, from every untrusted client together: the same, after `accountFree` failures,
 *   so a spread-out guess at one account is slowed too (a trusted device is not);
 * - per client address: a generous ceiling of `perClient` failures across all accounts (a spray),
 *   after which that client waits for the window to end. A trusted device passes it.
 * - per trusted device: `pairFree` failures, then the device is treated as untrusted for the window.
 */
export interface ThrottleSettings {
  windowMs: number;
  pairFree: number;
  accountFree: number;
  perClient: number;
  maxDelayS: number;
  /** Failures of one account within the window that send its holder one warning mail. */
  burstNotify: number;
}

export type SlowedBy = 'account_and_client' | 'account' | 'client';

export interface ThrottleVerdict {
  /** Seconds to wait before the next attempt is looked at; 0 when it may go ahead. */
  waitS: number;
  slowedBy: SlowedBy | null;
  /** Whether the device cookie counts (valid for this account and not used up by failures). */
  trusted: boolean;
}

export interface LoginThrottle {
  check(p: { email: string; ip: string; deviceId: string | null }): Promise<ThrottleVerdict>;
  /** Count a failure; answers whether this failure is the one that should warn the account holder. */
  failed(p: { email: string; ip: string; deviceId: string | null; trusted: boolean }): Promise<{
    notify: boolean;
    accountFailures: number;
  }>;
  succeeded(p: { email: string; ip: string; deviceId: string | null }): Promise<void>;
}

/** Seconds to wait after `failures` failures when `free` of them are free: 1, 2, 4, ... capped. */
export function delayAfter(failures: number, free: number, maxDelayS: number): number {
  if (failures <= free) return 0;
  return Math.min(maxDelayS, 2 ** Math.min(30, failures - free - 1));
}

const keys = (email: string, ip: string, deviceId: string | null) => ({
  pair: `login-pair:${email}|${ip}`,
  account: `login-account:${email}`,
  client: `login-client:${ip}`,
  device: deviceId ? `login-device:${deviceId}` : null,
});

export function createLoginThrottle(counters: Counters, s: ThrottleSettings): LoginThrottle {
  const remainingS = (state: CounterState | null, free: number): number => {
    if (!state) return 0;
    const delayMs = delayAfter(state.hits, free, s.maxDelayS) * 1000;
    // Never past the window's end: then the count starts again.
    return Math.ceil(Math.max(0, Math.min(delayMs - state.sinceLastMs, state.resetInMs)) / 1000);
  };

  return {
    async check({ email, ip, deviceId }) {
      const k = keys(email, ip, deviceId);
      if (k.device) {
        const device = await counters.peek(k.device);
        if (!device || device.hits < s.pairFree) return { waitS: 0, slowedBy: null, trusted: true };
      }
      const [pair, account, client] = await Promise.all([
        counters.peek(k.pair),
        counters.peek(k.account),
        counters.peek(k.client),
      ]);
      const waits: [number, SlowedBy][] = [
        [remainingS(pair, s.pairFree), 'account_and_client'],
        [remainingS(account, s.accountFree), 'account'],
        [client && client.hits >= s.perClient ? Math.ceil(client.resetInMs / 1000) : 0, 'client'],
      ];
      const [waitS, slowedBy] = waits.reduce((a, b) => (b[0] > a[0] ? b : a));
      return { waitS, slowedBy: waitS > 0 ? slowedBy : null, trusted: false };
    },

    async failed({ email, ip, deviceId, trusted }) {
      const k = keys(email, ip, deviceId);
      // A trusted device's failures count against that device alone (and towards the warning mail).
      const hits = trusted && k.device ? [k.device] : [k.pair, k.client];
      await Promise.all(hits.map((key) => counters.hit(key, s.windowMs)));
      const account = await counters.hit(k.account, s.windowMs);
      // Exactly one failure reaches the threshold, whichever process counts it: one mail per window.
      return { notify: account.hits === s.burstNotify, accountFailures: account.hits };
    },

    async succeeded({ email, ip, deviceId }) {
      const k = keys(email, ip, deviceId);
      await Promise.all([counters.reset(k.pair), ...(k.device ? [counters.reset(k.device)] : [])]);
    },
  };
}
