// Time one bcryptjs hash at each cost around the chosen one, so BCRYPT_COST can be set to the cost
// that takes about a quarter second on this machine (issue 4). Run: npx tsx apps/server/bench/bcrypt.ts
import bcrypt from 'bcryptjs';
import { DEFAULT_BCRYPT_COST } from '../src/config.js';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 5);
const password = 'correct horse battery staple';
const chosen = DEFAULT_BCRYPT_COST;

console.log(`bcryptjs ${ROUNDS} hashes per cost, node ${process.version}; default BCRYPT_COST = ${chosen}`);
for (let cost = chosen - 2; cost <= chosen + 1; cost++) {
  await bcrypt.hash(password, cost); // warm the JIT
  const times: number[] = [];
  for (let i = 0; i < ROUNDS; i++) {
    const t0 = performance.now();
    await bcrypt.hash(password, cost);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)] ?? 0;
  console.log(
    `cost ${String(cost).padStart(2)}: median ${(median / 1000).toFixed(3)} s per hash (min ${((times[0] ?? 0) / 1000).toFixed(3)} s)${cost === chosen ? '  <- default' : ''}`,
  );
}
