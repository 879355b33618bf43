// How much a shared (MariaDB) rate-limit counter costs per hit, against the in-process memory
// store it replaced, measured in the same run: `npx tsx apps/server/bench/counters.ts` with the
// test database's DB_* variables exported. Prints figures; asserts nothing.
import { MemoryStore } from 'express-rate-limit';
import { createTestDatabase } from '../testing/db.js';
import { createCounters, SharedCounterStore } from '../src/http/counters.js';

const N = 2000;
const db = await createTestDatabase();
try {
  const counters = createCounters(db.sequelize);
  const shared = new SharedCounterStore(counters, 'bench:');
  const memory = new MemoryStore();
  const options = { windowMs: 60_000 } as Parameters<MemoryStore['init']>[0];
  shared.init(options);
  memory.init(options);

  async function measure(label: string, hit: (i: number) => Promise<unknown>, concurrency: number) {
    const t0 = process.hrtime.bigint();
    let next = 0;
    await Promise.all(
      Array.from({ length: concurrency }, async () => {
        while (next < N) await hit(next++ % 50);
      }),
    );
    const ms = Number(process.hrtime.bigint() - t0) / 1e6;
    console.log(
      `${label.padEnd(34)} ${N} hits in ${ms.toFixed(0)} ms: ${((ms * 1000) / N).toFixed(1)} µs/hit, ${((N / ms) * 1000).toFixed(0)} hits/s`,
    );
    return ms;
  }
  const mem = await measure(
    'memory store (one process only)',
    (k) => Promise.resolve(memory.increment(`k${k}`)),
    1,
  );
  const one = await measure('MariaDB counters, 1 at a time', (k) => shared.increment(`k${k}`), 1);
  const ten = await measure('MariaDB counters, 10 concurrent', (k) => shared.increment(`k${k}`), 10);
  console.log(
    `ratio shared/memory (1 at a time): ${(one / mem).toFixed(0)}x; 10 concurrent: ${(ten / mem).toFixed(0)}x`,
  );
  const total = await shared.get('k0');
  console.log(
    `check: key k0 counted ${total?.totalHits} hits (expected ${(2 * N) / 50}: two runs over 50 keys)`,
  );
  memory.shutdown();
} finally {
  await db.drop();
}
