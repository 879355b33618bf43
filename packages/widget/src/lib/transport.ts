/** The part of `fetch` the widget uses, so tests can inject one. */
export type FetchLike = (
  url: string,
  init: {
    method: string;
    headers?: Record<string, string>;
    body?: string;
    credentials: 'omit';
    mode: 'cors';
  },
) => Promise<{
  readonly status: number;
  text(): Promise<string>;
  readonly headers?: { get(name: string): string | null };
}>;

export type Sleep = (ms: number) => Promise<void>;

/** Waits between attempts after a network failure or a 5xx: 1 s, 2 s, 4 s, 8 s, 16 s, then gives up (six attempts in about half a minute). */
export const RETRY_DELAYS_MS: readonly number[] = [1000, 2000, 4000, 8000, 16000];

/** The longest wait a `Retry-After` can ask for: a visitor's page does not wait minutes. */
export const MAX_RETRY_AFTER_MS = 60_000;

/**
 * `Retry-After` in milliseconds when it is a number of seconds (what the API sends while its
 * database is unavailable), capped at `MAX_RETRY_AFTER_MS`; undefined when absent or unreadable.
 */
export function retryAfterMs(value: string | null | undefined): number | undefined {
  if (!value || !/^\d+$/.test(value.trim())) return undefined;
  return Math.min(Number(value.trim()) * 1000, MAX_RETRY_AFTER_MS);
}

/** An answer from the API. `status` 0 means no answer at all (every attempt failed on the network). */
export interface Reply {
  readonly status: number;
  /** The parsed JSON body, or null when there was none or it was not JSON. */
  readonly body: unknown;
  /** How many requests were made. */
  readonly attempts: number;
  /** What the server's `Retry-After` asked for, in milliseconds. */
  readonly retryAfterMs?: number;
}

export interface SendOptions {
  readonly fetch?: FetchLike;
  readonly sleep?: Sleep;
  readonly delays?: readonly number[];
}

const realSleep: Sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));
const realFetch: FetchLike = (url, init) => fetch(url, init);

function parse(text: string): unknown {
  if (text === '') return null;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return null;
  }
}

/** Whether an answer is worth asking again for: no answer, or the server's own failure. A 4xx never is: the same request would be refused again. */
export function shouldRetry(status: number): boolean {
  return status === 0 || status >= 500;
}

/**
 * One request, repeated unchanged after a network failure or a 5xx with the waits in `delays`, or
 * longer when the server's `Retry-After` asks for longer (never sooner than it asks).
 * The body is sent byte-for-byte the same each time, so a report keeps its run id and the server
 * stores it once however many attempts reach it.
 * @param body JSON sent as `text/plain;charset=UTF-8`: a CORS-simple request, so no preflight
 *   round trip precedes it; GET when absent. No cookies are sent (the embed API takes none).
 */
export async function request(url: string, body: unknown, options: SendOptions = {}): Promise<Reply> {
  const doFetch = options.fetch ?? realFetch;
  const sleep = options.sleep ?? realSleep;
  const delays = options.delays ?? RETRY_DELAYS_MS;
  const init =
    body === undefined
      ? { method: 'GET', credentials: 'omit' as const, mode: 'cors' as const }
      : {
          method: 'POST',
          headers: { 'Content-Type': 'text/plain;charset=UTF-8' },
          body: JSON.stringify(body),
          credentials: 'omit' as const,
          mode: 'cors' as const,
        };
  for (let attempt = 1; ; attempt++) {
    let reply: Reply;
    try {
      const res = await doFetch(url, init);
      const after = retryAfterMs(res.headers?.get('retry-after'));
      reply = {
        status: res.status,
        body: parse(await res.text().catch(() => '')),
        attempts: attempt,
        ...(after === undefined ? {} : { retryAfterMs: after }),
      };
    } catch {
      reply = { status: 0, body: null, attempts: attempt };
    }
    const wait = delays[attempt - 1];
    if (!shouldRetry(reply.status) || wait === undefined) return reply;
    await sleep(Math.max(wait, reply.retryAfterMs ?? 0));
  }
}

/** `details.fields` of the API's error shape, keyed by field path with `prefix` removed (`body.fields.email` → `email`). */
export function fieldErrors(body: unknown, prefix: string): Record<string, string> {
  const out: Record<string, string> = {};
  const details = (body as { error?: { details?: { fields?: unknown } } } | null)?.error?.details;
  const fields = details?.fields;
  if (!Array.isArray(fields)) return out;
  for (const f of fields as unknown[]) {
    const { field, message } = (f ?? {}) as { field?: unknown; message?: unknown };
    if (typeof field !== 'string' || typeof message !== 'string') continue;
    const key = field.startsWith(prefix) ? field.slice(prefix.length) : field;
    out[key] ??= message;
  }
  return out;
}

/** The API error's message, if the body is the API's error shape. */
export function errorMessage(body: unknown): string | null {
  const message = (body as { error?: { message?: unknown } } | null)?.error?.message;
  return typeof message === 'string' ? message : null;
}
