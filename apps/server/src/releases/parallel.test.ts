import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import * as current from '@wickstone/calc-core';
import { answersOf, type AnswerEngine } from './answers.js';
import { answersSpread, endAnswerWorkers, PARALLEL_MIN_INPUTS } from './parallel.js';

const nodeRequire = createRequire(import.meta.url);
const publishedPath = fileURLToPath(new URL('../../../../releases/0.1.0/engine.mjs', import.meta.url));

/** Enough distinct inputs to be spread, with some the engine refuses and some that withhold a value. */
const texts = Array.from({ length: PARALLEL_MIN_INPUTS + 1_001 }, (_, i) =>
  JSON.stringify(
    i % 997 === 0
      ? { diameter: -1, liquid: 'water' }
      : {
          diameter: 0.0001 + i * 4.1e-7,
          liquid: ['water', 'ethanol', 'glycerol'][i % 3],
          contactAnglePreset: 'custom',
          contactAngleDeg: i % 91,
        },
  ),
);

describe('the candidate engine spread over worker threads', () => {
  afterAll(() => endAnswerWorkers());

  it.each([
    ['this checkout’s calc-core', current as AnswerEngine, nodeRequire.resolve('@wickstone/calc-core')],
    ['the published 0.1.0 engine', nodeRequire(publishedPath) as AnswerEngine, publishedPath],
  ])('gives the same answers as one thread, in order (%s)', async (_name, engine, enginePath) => {
    const one = answersOf(engine, 'tube-rise', texts);
    const spread = await answersSpread(engine, enginePath, 'tube-rise', texts, 2);
    expect(spread).toHaveLength(texts.length);
    expect(spread).toEqual(one);
    // The mix really has refusals and withheld values, both carried across.
    expect(one.filter((a) => a === null).length).toBeGreaterThan(10);
    expect(one.some((a) => a !== null && Object.values(a.outputs).includes(null))).toBe(true);
    expect(one.some((a) => a !== null && a.warnings.length > 0)).toBe(true);
  });

  it('gives the same answers where it stays on one thread (few inputs, no module path)', async () => {
    const few = texts.slice(0, 50);
    expect(await answersSpread(current, nodeRequire.resolve('@wickstone/calc-core'), 'tube-rise', few, 2)).toEqual(
      answersOf(current, 'tube-rise', few),
    );
    expect(await answersSpread(current, null, 'tube-rise', texts, 2)).toEqual(answersOf(current, 'tube-rise', texts));
  });
});
