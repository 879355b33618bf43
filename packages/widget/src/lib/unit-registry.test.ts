import { calculators } from '@wickstone/calc-core';
import { beforeAll, describe, expect, it } from 'vitest';
// @ts-expect-error: the build scripts are plain JavaScript modules without declarations
import { buildChunks, closure, LATER_CHUNKS, unitsOf } from '../../scripts/bundle.mjs';
// @ts-expect-error: as above
import { compareViews, firstViews } from '../../scripts/first-views.mjs';

interface Chunk {
  readonly code: string;
  readonly imports: readonly string[];
}
interface Built {
  readonly files: Map<string, Chunk>;
  readonly engines: Record<string, string>;
}
interface Views {
  readonly records: readonly (readonly [string, string])[];
  readonly errors: readonly string[];
}
type Release = { files: (id: string) => string[]; read: (file: string) => string };

const ids = calculators.map((c) => c.id);
/** A build's first flights as the browser runs them: the runtime, then the engine (its later chunks' table left empty). */
const release = ({ files, engines }: Built): Release => ({
  files: (id) => [...(closure(files, engines[id]) as Set<string>)],
  read: (file) => files.get(file)!.code.replace(LATER_CHUNKS, '{}'),
});

let subsets: Built;
let whole: Built;
beforeAll(async () => {
  subsets = (await buildChunks(ids)) as Built;
  whole = (await buildChunks(ids, { unitSubsets: false })) as Built;
}, 300_000);

describe("each engine's units", () => {
  it('leave calc-core’s whole table out of every first flight', () => {
    // A unit no calculator shows or prints (the inch of water), by its name and its symbol.
    for (const id of ids) {
      const flight = release(subsets).files(id);
      const code = flight.map((f) => subsets.files.get(f)!.code).join('');
      expect(code, id).not.toContain('inch of water');
      expect(code, id).not.toContain('inH₂O');
    }
    const flight = release(whole).files('tube-rise');
    expect(flight.map((f) => whole.files.get(f)!.code).join('')).toContain('inH₂O');
  });

  it('hold the units of the calculator’s kinds in both systems and those its warnings print', () => {
    const tube = unitsOf('tube-rise') as { units: Record<string, unknown>; unitSystems: { us: object } };
    // Bore: m canonical and SI, in for US, mm and ft by size; gravity: m/s² and ft/s²; the contact angle's warning prints degrees.
    for (const unit of ['m', 'mm', 'in', 'ft', 'm/s2', 'ft/s2', 'deg', 'degC', 'degF', 'N/m', 'mN/m'])
      expect(tube.units, unit).toHaveProperty([unit]);
    // No pressure, no time in a tube's rise.
    for (const unit of ['Pa', 'psi', 's', 'day']) expect(tube.units, unit).not.toHaveProperty([unit]);
    expect(tube.unitSystems.us).not.toHaveProperty('pressure');
  });

  it('render every calculator’s first view as calc-core’s whole table does (both systems, defaults and seeded inputs)', () => {
    const a = firstViews(release(subsets), { samples: 3 }) as Views;
    const b = firstViews(release(whole), { samples: 3 }) as Views;
    expect(a.errors).toEqual([]);
    expect(b.errors).toEqual([]);
    // Every calculator gave figures, so the comparison is of answers, not only of forms.
    for (const id of ids)
      expect(
        a.records.some(([label, html]) => label.startsWith(`${id} `) && html.includes('data-output')),
        id,
      ).toBe(true);
    const { compared, differ } = compareViews(a, b) as { compared: number; differ: { label: string }[] };
    expect(compared).toBe(ids.length * 2 * (3 + 2 * 3));
    expect(differ.map((d) => d.label)).toEqual([]);
  }, 300_000);
});
