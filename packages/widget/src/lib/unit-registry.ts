// The units table of a release in the browser. The build puts this module in place of calc-core's
// `unit-table.js` (scripts/bundle.mjs), so calc-core's lookups and conversions in the runtime read
// these objects: empty until an engine adds its calculator's units (its inputs' and outputs'
// kinds in both unit systems, `unitsOf`), and the whole table added by the chunks that follow
// first paint (working, tables, extras), which may print any unit. Several widgets on a page share
// the runtime and so this table: each engine adds its own, and a unit's definition is the same
// whoever adds it. Never imported by the widget's own code, only swapped in by the build.
import type { QuantityKind, UnitDefinition, UnitId, UnitSystemId } from '@wickstone/calc-core';

/**
 * Some of calc-core's units: a first-flight entry carries what converting and printing use (kind,
 * symbol, factor, offset), not the unit's name, which no part of the widget shows.
 */
export interface UnitTable {
  readonly units: Readonly<Partial<Record<UnitId, Omit<UnitDefinition, 'name'>>>>;
  readonly canonicalUnits: Readonly<Partial<Record<QuantityKind, UnitId>>>;
  readonly unitSystems: Readonly<Record<UnitSystemId, Readonly<Partial<Record<QuantityKind, UnitId>>>>>;
  /** Spellings people type (a CSV's header): with the whole table only, the first view reads none. */
  readonly aliases?: Readonly<Record<string, UnitId>>;
}

export const units: Partial<Record<UnitId, Omit<UnitDefinition, 'name'>>> = {};
export const canonicalUnits: Partial<Record<QuantityKind, UnitId>> = {};
export const unitSystems: Record<UnitSystemId, Partial<Record<QuantityKind, UnitId>>> = { si: {}, us: {} };
export const aliases: Record<string, UnitId> = {};

/**
 * One unit of an engine's list: its id alone when its symbol is its id, its factor 1 and its
 * offset 0; else `[id, factor, offset?, symbol?]`, the offset left out when 0 and the symbol when
 * it is the id.
 */
export type UnitEntry = UnitId | readonly [id: UnitId, factor: number, offset?: number, symbol?: string];

/**
 * An engine's units (`scripts/bundle.mjs`, `unitListOf`), by kind: first the kind's canonical, SI and
 * US units (0 for a kind only a warning prints, which has none of its own), then its units.
 */
export type UnitList = Readonly<
  Partial<
    Record<QuantityKind, readonly [systems: readonly [UnitId, UnitId, UnitId] | 0, ...units: UnitEntry[]]>
  >
>;

/** Adds an engine's units to the table: the same objects as calc-core's entries without the name. */
export function addUnitList(list: UnitList): void {
  for (const [kind, [systems, ...entries]] of Object.entries(list) as [
    QuantityKind,
    NonNullable<UnitList[QuantityKind]>,
  ][]) {
    for (const entry of entries) {
      const [id, factor = 1, offset = 0, symbol = id] = typeof entry === 'string' ? [entry] : entry;
      units[id] = { kind, symbol, factor, offset };
    }
    if (systems) [canonicalUnits[kind], unitSystems.si[kind], unitSystems.us[kind]] = systems;
  }
}

/** Adds units to the table (calc-core's whole table). */
export function addUnits(table: UnitTable): void {
  Object.assign(units, table.units);
  Object.assign(canonicalUnits, table.canonicalUnits);
  Object.assign(unitSystems.si, table.unitSystems.si);
  Object.assign(unitSystems.us, table.unitSystems.us);
  Object.assign(aliases, table.aliases);
}
