/// <reference types="vite/client" />
import { describe, expect, it } from 'vitest';

// Every calculator's subpath imports its `<id>.working.ts` (for its `run`), and the widget's build
// puts a calc-core module that every engine's subpath reaches into the runtime of every first
// flight. shared-working.ts (the liquid's working, Hazen's step, the gravity assumption) must stay
// out of it: so not every working module may import it, and no core may.

const workings = import.meta.glob<string>('./*.working.ts', {
  eager: true,
  query: '?raw',
  import: 'default',
});
const cores = import.meta.glob<string>(['./*.ts', '!./*.test.ts', '!./*.working.ts', '!./*.texts.ts'], {
  eager: true,
  query: '?raw',
  import: 'default',
});
const importsSharedWorking = (source: string): boolean =>
  /^import [^;]*from '\.\/shared-working\.js';/m.test(source);

describe('the working modules and shared-working.ts', () => {
  it('some working modules do without shared-working.ts, so no first flight carries it', () => {
    const files = Object.keys(workings);
    expect(files.length).toBeGreaterThanOrEqual(10);
    const without = files.filter((f) => !importsSharedWorking(workings[f] as string));
    expect(without.length).toBeGreaterThan(0);
  });

  it('only run.ts among the modules that compute imports shared-working.ts', () => {
    const importers = Object.entries(cores)
      .filter(([, source]) => importsSharedWorking(source))
      .map(([file]) => file);
    expect(importers).toEqual(['./run.ts']);
  });
});
