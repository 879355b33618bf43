import { describe, expect, it } from 'vitest';
import {
  errorMessage,
  fieldErrors,
  MAX_RETRY_AFTER_MS,
  request,
  RETRY_DELAYS_MS,
  type FetchLike,
} from './transport.js';

type Step = number | 'network';

/** A fetch that answers each call from `steps` in turn and records what it was sent. */
function scripted(steps: readonly Step[], body = '{"ok":true}') {
  const calls: { url: string; init: Parameters<FetchLike>[1] }[] = [];
  const fetch: FetchLike = async (url, init) => {
    calls.push({ url, init });
    const step = steps[calls.length - 1] ?? 200;
    if (step === 'network') throw new TypeError('Failed to fetch');
    return { status: step, text: async () => body };
  };
  const waits: number[] = [];
  const sleep = async (ms: number) => {
    waits.push(ms);
  };
  return { fetch, sleep, calls, waits };
}

describe('request', () => {
  it('retries network failures and 5xx with waits of 1, 2, 4, 8 and 16 s, sending the same bytes each time', async () => {
    const t = scripted(['network', 503, 500, 'network', 502, 201]);
    const reply = await request('https://wickstone.example/api/v1/embed/runs', { id: 'r-1', n: 1 }, t);
    expect(reply).toEqual({ status: 201, body: { ok: true }, attempts: 6 });
    expect(t.waits).toEqual([1000, 2000, 4000, 8000, 16000]);
    expect(RETRY_DELAYS_MS).toEqual([1000, 2000, 4000, 8000, 16000]);
    expect(new Set(t.calls.map((c) => c.init.body))).toEqual(new Set(['{"id":"r-1","n":1}']));
    for (const c of t.calls) {
      expect(c.init).toMatchObject({
        method: 'POST',
        headers: { 'Content-Type': 'text/plain;charset=UTF-8' },
        credentials: 'omit',
        mode: 'cors',
      });
    }
  });

  it('waits as long as Retry-After asks when that is longer than its own wait, never sooner, and at most a minute', async () => {
    const answers: [number, string | null][] = [
      [503, '5'],
      [503, '1'],
      [503, 'soon'],
      [503, '3600'],
      [201, null],
    ];
    const waits: number[] = [];
    let i = 0;
    const fetch: FetchLike = async () => {
      const [status, after] = answers[i++]!;
      return {
        status,
        text: async () => '{}',
        headers: { get: (h: string) => (h === 'retry-after' ? after : null) },
      };
    };
    const reply = await request(
      'https://wickstone.example/api/v1/embed/runs',
      { id: 'r-2' },
      {
        fetch,
        sleep: async (ms) => {
          waits.push(ms);
        },
      },
    );
    expect(reply.status).toBe(201);
    // 5 s asked beside 1 s of its own; 1 s asked beside 2 s; unreadable; an hour asked, capped.
    expect(waits).toEqual([5000, 2000, 4000, MAX_RETRY_AFTER_MS]);
  });

  it('gives up after the last wait, reporting what it last saw', async () => {
    const t = scripted(['network', 'network', 'network', 'network', 'network', 'network', 200]);
    const reply = await request('https://wickstone.example/x', { a: 1 }, t);
    expect(reply.status).toBe(0);
    expect(reply.attempts).toBe(6);
    expect(t.calls).toHaveLength(6);
    const five = scripted([500, 500, 500, 500, 500, 500, 500]);
    expect((await request('https://wickstone.example/x', { a: 1 }, five)).status).toBe(500);
    expect(five.calls).toHaveLength(6);
  });

  it.each([400, 403, 404, 409, 429])('never retries a %i', async (status) => {
    const t = scripted([status, 201]);
    const reply = await request('https://wickstone.example/x', { a: 1 }, t);
    expect(reply.status).toBe(status);
    expect(t.calls).toHaveLength(1);
    expect(t.waits).toEqual([]);
  });

  it('GETs without a body or cookies, and survives a body that is not JSON', async () => {
    const t = scripted([200], '<html>proxy error</html>');
    const reply = await request('https://wickstone.example/api/v1/embed/widgets/wk_x', undefined, t);
    expect(reply).toEqual({ status: 200, body: null, attempts: 1 });
    expect(t.calls[0]?.init).toEqual({ method: 'GET', credentials: 'omit', mode: 'cors' });
  });

  it('uses the waits it is given', async () => {
    const t = scripted([503, 503, 503]);
    const reply = await request('https://wickstone.example/x', {}, { ...t, delays: [5, 10] });
    expect(reply.status).toBe(503);
    expect(t.waits).toEqual([5, 10]);
  });
});

describe('fieldErrors and errorMessage', () => {
  const body = {
    error: {
      code: 'validation_failed',
      message: 'Invalid request: check body.fields.email',
      details: {
        fields: [
          { field: 'body.fields.email', message: 'Enter a valid e-mail address' },
          { field: 'body.fields.email', message: 'second message for the same field' },
          { field: 'body.consent', message: 'Consent is required' },
          { field: 42, message: 'ignored' },
        ],
      },
    },
  };
  it('keys the API’s field errors by field, prefix removed, first message kept', () => {
    expect(fieldErrors(body, 'body.fields.')).toEqual({
      email: 'Enter a valid e-mail address',
      'body.consent': 'Consent is required',
    });
    expect(fieldErrors(null, 'body.')).toEqual({});
    expect(fieldErrors({ error: { details: {} } }, 'body.')).toEqual({});
  });
  it('reads the message of the error shape', () => {
    expect(errorMessage(body)).toBe('Invalid request: check body.fields.email');
    expect(errorMessage('nope')).toBeNull();
  });
});
