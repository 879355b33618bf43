import type { CalculationResult, TableInput, TableRow, UnitSystemId } from '@wickstone/calc-core';
import { useCallback, useEffect, useRef } from 'preact/hooks';
import { useTables, type TablesModule } from '../lazy-tables.js';
import { adoptStyles } from '../lib/sheets.js';
import { pure } from './pure.js';

// Where a table input and its chart sit in the form and under the result: a placeholder until the
// tables chunk is here (the first flight stays the same for every calculator), then its parts.

/** The chunk, with its styles adopted once into the shadow root `ref` is in (as the main styles are). */
function useTablesIn(ref: { current: HTMLElement | null }): TablesModule | null {
  const tables = useTables();
  useEffect(() => {
    const root = ref.current?.getRootNode();
    if (tables && root instanceof ShadowRoot) adoptStyles(root, tables.css, 'tables');
  }, [tables, ref]);
  return tables;
}

type Rows = readonly Readonly<Record<string, number | null>>[];

/**
 * A table input's place in the form. Like a field, rendered again only when its own props change;
 * `onRows` is the form's one handler for every table (stable across renders), told which input.
 */
export const TableSlot = pure(function TableSlot({
  onRows,
  ...props
}: {
  readonly input: TableInput;
  readonly rows: readonly TableRow[] | null;
  readonly system: UnitSystemId;
  readonly onRows: (input: TableInput, rows: Rows) => void;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const tables = useTablesIn(ref);
  const { input } = props;
  const onOwnRows = useCallback((rows: Rows) => onRows(input, rows), [onRows, input]);
  return (
    <div ref={ref} class="table-slot" style={{ gridColumn: '1 / -1' }}>
      {tables ? (
        <tables.TableField {...props} onRows={onOwnRows} />
      ) : (
        <div class="field" data-field={input.id} data-wickstone="table-loading">
          <p class="label">{input.label}</p>
          <p class="note">Loading the table of readings…</p>
        </div>
      )}
    </div>
  );
});

/** The readings' chart under the result, once the full run is here: rendered again only for a new run. */
export const ChartSlot = pure(function ChartSlot({ result }: { result: CalculationResult }) {
  const ref = useRef<HTMLDivElement>(null);
  const tables = useTablesIn(ref);
  return <div ref={ref}>{tables && <tables.ReadingsChart result={result} />}</div>;
});
