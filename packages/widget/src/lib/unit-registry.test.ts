import { calculators } from '@wickstone/calc-core';
import { beforeAll, describe, expect, it } from 'vitest';
import { addUnitList, canonicalUnits, unitSystems, units, type UnitList } from './unit-registry.js';
// @ts-expect-error: the build scripts are plain JavaScript modules without declarations
import { buildChunks, closure, unitListOf, unitsOf } from '../../scripts/bundle.mjs';
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
/** A build's first flights as the browser runs them: the runtime, then the engine. */
const release = ({ files, engines }: Built): Release => ({
  files: (id) => [...(closure(files, engines[id]) as Set<string>)],
  read: (file) => files.get(file)!.code,
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

  it('travel in a shorter list that adds the very same entries (same doubles, symbols, kinds) and systems', () => {
    type Entry = { kind: string; symbol: string; factor: number; offset: number };
    type Subset = {
      units: Record<string, Entry>;
      canonicalUnits: Record<string, string>;
      unitSystems: { si: Record<string, string>; us: Record<string, string> };
    };
    let shortened = 0;
    for (const id of ids) {
      const subset = unitsOf(id) as Subset;
      const list = unitListOf(id) as UnitList;
      // Shorter than the entries it stands for, as JSON (what the engine carries).
      expect(JSON.stringify(list).length, id).toBeLessThan(JSON.stringify(subset).length);
      // The table is shared, as on a page: an entry another calculator added first must agree.
      addUnitList(list);
      for (const [unit, entry] of Object.entries(subset.units)) {
        const added = (units as Record<string, Entry>)[unit]!;
        expect(Object.keys(added), `${id} ${unit}`).toEqual(['kind', 'symbol', 'factor', 'offset']);
        expect(added.kind, `${id} ${unit}`).toBe(entry.kind);
        expect(added.symbol, `${id} ${unit}`).toBe(entry.symbol);
        // Object.is: the same double, and 0 is not -0.
        expect(Object.is(added.factor, entry.factor), `${id} ${unit} factor`).toBe(true);
        expect(Object.is(added.offset, entry.offset), `${id} ${unit} offset`).toBe(true);
        shortened++;
      }
      for (const [kind, unit] of Object.entries(subset.canonicalUnits))
        expect((canonicalUnits as Record<string, string>)[kind], `${id} ${kind}`).toBe(unit);
      for (const system of ['si', 'us'] as const)
        for (const [kind, unit] of Object.entries(subset.unitSystems[system]))
          expect((unitSystems[system] as Record<string, string>)[kind], `${id} ${system} ${kind}`).toBe(unit);
    }
    expect(shortened).toBeGreaterThan(ids.length * 5);
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
