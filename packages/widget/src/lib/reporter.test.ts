import { embedRunBodySchema } from '@wickstone/contracts';
import { run } from '@wickstone/calc-core/calculators/tube-rise';
import { describe, expect, it } from 'vitest';
import { createReporter } from './reporter.js';
import type { FetchLike } from './transport.js';

function fakeServer(statuses: (number | 'network')[]) {
  const bodies: string[] = [];
  const fetch: FetchLike = async (_url, init) => {
    bodies.push(init.body ?? '');
    const s = statuses.shift() ?? 201;
    if (s === 'network') throw new TypeError('offline');
    return { status: s, text: async () => '{}' };
  };
  return { fetch, bodies };
}

const noWait = async () => {};
let n = 0;
const makeId = () => `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`;

describe('createReporter', () => {
  it('keeps one id across every retry of a report, and resolves stored once acknowledged', async () => {
    const server = fakeServer(['network', 503, 201]);
    const reporter = createReporter({
      apiBase: 'https://wickstone.example',
      publicKey: 'wk_abcdefghij0123456789',
      href: () => 'https://www.brackenridge-ground.example/',
      send: { fetch: server.fetch, sleep: noWait },
      makeId,
    });
    const report = reporter.report(run({ diameter: 0.002 }), 'si');
    await expect(report.stored).resolves.toBe(true);
    expect(server.bodies).toHaveLength(3);
    const ids = server.bodies.map((b) => embedRunBodySchema.parse(JSON.parse(b)).id);
    expect(new Set(ids)).toEqual(new Set([report.id]));
  });

  it('counts the same calculation pressed twice once, and a changed one again', async () => {
    const server = fakeServer([]);
    const reporter = createReporter({
      apiBase: 'https://wickstone.example',
      publicKey: 'wk_abcdefghij0123456789',
      href: () => 'https://x.example/',
      send: { fetch: server.fetch, sleep: noWait },
      makeId,
    });
    const a = reporter.report(run({ diameter: 0.002 }), 'si');
    const b = reporter.report(run({ diameter: 0.002 }), 'si');
    const c = reporter.report(run({ diameter: 0.003 }), 'si');
    const d = reporter.report(run({ diameter: 0.003 }), 'us');
    await Promise.all([a.stored, c.stored, d.stored]);
    expect(b).toBe(a);
    expect(new Set([a.id, c.id, d.id]).size).toBe(3);
    expect(server.bodies).toHaveLength(3);
  });

  it('treats a refused report as not stored, never retries it, and sends a fresh one next time', async () => {
    const server = fakeServer([400, 201]);
    const reporter = createReporter({
      apiBase: 'https://wickstone.example',
      publicKey: 'wk_abcdefghij0123456789',
      href: () => 'https://x.example/',
      send: { fetch: server.fetch, sleep: noWait },
      makeId,
    });
    const first = reporter.report(run({}), 'si');
    await expect(first.stored).resolves.toBe(false);
    expect(server.bodies).toHaveLength(1);
    const again = reporter.report(run({}), 'si');
    expect(again.id).not.toBe(first.id);
    await expect(again.stored).resolves.toBe(true);
  });
});
