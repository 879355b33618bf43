import type { ShownValue } from '@wickstone/contracts';
import { formatInput as formatNumber } from '@wickstone/calc-core/format';
import { Card } from './ui';

/** A table input of a run (a laboratory's readings), every row in the widget's units. */
export function RunInputsTable({ value }: { value: ShownValue }) {
  const table = value.table;
  if (!table) return null;
  return (
    <section data-run-table={value.id}>
      <Card className="p-4">
        <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">{value.label}</h3>
        <p className="mt-1 text-sm text-ink-soft">{value.text}</p>
        <div className="mt-2 max-h-96 overflow-auto">
          <table className="w-full text-sm tabular-nums">
            <caption className="sr-only">{value.label}, as the visitor sent them</caption>
            <thead>
              <tr className="border-b border-line text-left text-ink-soft">
                <th scope="col" className="py-1 pr-4 font-semibold">
                  Row
                </th>
                {table.columns.map((c) => (
                  <th key={c.id} scope="col" className="py-1 pr-4 text-right font-semibold">
                    {c.label} ({c.unit})
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {table.rows.map((row, i) => (
                <tr key={i} className="border-b border-line last:border-b-0">
                  <td className="py-1 pr-4 text-ink-soft">{i + 1}</td>
                  {row.map((v, j) => (
                    <td key={j} className="py-1 pr-4 text-right">
                      {formatNumber(v)}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>
    </section>
  );
}
