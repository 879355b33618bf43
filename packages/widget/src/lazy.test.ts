import { embedRunBodySchema } from '@wickstone/contracts';
import { run } from '@wickstone/calc-core/calculators/tube-rise';
import { describe, expect, it } from 'vitest';
import { deferredReporter, loadExtras, type ExtrasModule } from './lazy.js';
import { createReporter } from './lib/reporter.js';
import type { FetchLike } from './lib/transport.js';

describe('deferredReporter', () => {
  it('gives a calculation made before the extras arrive its id at once and sends it under that id when they do', async () => {
    const bodies: string[] = [];
    const fetch: FetchLike = async (_url, init) => {
      bodies.push(init.body ?? '');
      return { status: 201, text: async () => '{}' };
    };
    let n = 0;
    const reporter = deferredReporter(
      (m) =>
        m.createReporter({
          apiBase: 'https://wickstone.example',
          publicKey: 'wk_abcdefghij0123456789',
          href: () => 'https://www.brackenridge-ground.example/',
          send: { fetch },
        }),
      () => `00000000-0000-4000-8000-${String(++n).padStart(12, '0')}`,
    );
    const first = reporter.report(run({ diameter: 0.002 }), 'si');
    // The same inputs pressed again while waiting: one report, not two.
    expect(reporter.report(run({ diameter: 0.002 }), 'si')).toBe(first);
    const second = reporter.report(run({ diameter: 0.003 }), 'si');
    expect(second.id).not.toBe(first.id);
    expect(bodies).toHaveLength(0);

    let arrive!: (m: ExtrasModule) => void;
    void loadExtras(() => new Promise<ExtrasModule>((r) => (arrive = r)));
    arrive({ createReporter } as unknown as ExtrasModule);
    await expect(first.stored).resolves.toBe(true);
    await expect(second.stored).resolves.toBe(true);
    const sent = bodies.map((b) => embedRunBodySchema.parse(JSON.parse(b)));
    expect(sent.map((b) => b.id)).toEqual([first.id, second.id]);
    expect(sent.map((b) => b.inputs.diameter)).toEqual([0.002, 0.003]);

    // Once they are here, reports go straight out.
    const third = reporter.report(run({ diameter: 0.004 }), 'us');
    await expect(third.stored).resolves.toBe(true);
    expect(bodies).toHaveLength(3);
    expect(JSON.parse(bodies[2]!).id).toBe(third.id);
  });
});
