import type { CalculationResult, TableInput, TableRow, UnitSystemId } from '@wickstone/calc-core';
import { useEffect, useRef } from 'preact/hooks';
import { useTables, type TablesModule } from '../lazy-tables.js';
import { adoptStyles } from '../lib/sheets.js';

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

export function TableSlot(props: {
  readonly input: TableInput;
  readonly rows: readonly TableRow[] | null;
  readonly system: UnitSystemId;
  readonly onRows: (rows: readonly Readonly<Record<string, number | null>>[]) => void;
}) {
  const ref = useRef<HTMLDivElement>(null);
  const tables = useTablesIn(ref);
  return (
    <div ref={ref} class="table-slot" style={{ gridColumn: '1 / -1' }}>
      {tables ? (
        <tables.TableField {...props} />
      ) : (
        <div class="field" data-field={props.input.id} data-wickstone="table-loading">
          <p class="label">{props.input.label}</p>
          <p class="note">Loading the table of readings…</p>
        </div>
      )}
    </div>
  );
}

export function ChartSlot({ result }: { result: CalculationResult }) {
  const ref = useRef<HTMLDivElement>(null);
  const tables = useTablesIn(ref);
  return <div ref={ref}>{tables && <tables.ReadingsChart result={result} />}</div>;
}
