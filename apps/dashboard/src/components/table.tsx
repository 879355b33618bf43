import type { ReactNode } from 'react';
import { Card } from './ui';

/*
 * Table classes shared by the list screens: a table on wide screens; on a phone each row becomes a
 * small card (cells stacked in a grid), so nothing needs sideways scrolling. Cells with a
 * `data-label` name themselves on a phone, where the column headings are hidden.
 */
export const table = {
  table: 'w-full max-sm:block',
  thead: 'bg-paper max-sm:sr-only',
  tbody: 'max-sm:block',
  row: 'border-t border-line max-sm:grid max-sm:grid-cols-[auto_1fr] max-sm:items-center max-sm:gap-x-3 max-sm:gap-y-2 max-sm:px-4 max-sm:py-3 max-sm:first:border-t-0',
  th: 'px-4 py-2.5 text-left text-xs font-semibold tracking-wider text-ink-soft uppercase',
  td: 'px-4 py-3 max-sm:p-0',
  /** A cell that takes the card's full width on a phone. */
  wide: 'max-sm:col-span-2',
  labelled: 'max-sm:before:mr-1 max-sm:before:text-ink-soft max-sm:before:content-[attr(data-label)]',
} as const;

export interface Column {
  label: string;
  /** Named for assistive technology only (an actions column). */
  hiddenLabel?: boolean;
  /** Extra classes for the heading, e.g. to hide a column on narrow screens. */
  className?: string;
}

/** A card holding a table with a caption for assistive technology and the shared column headings. */
export function DataTable({
  caption,
  columns,
  busy = false,
  children,
}: {
  caption: string;
  columns: readonly (Column | null)[];
  busy?: boolean;
  children: ReactNode;
}) {
  return (
    <Card className="overflow-hidden">
      <table className={table.table} aria-busy={busy || undefined}>
        <caption className="sr-only">{caption}</caption>
        <thead className={table.thead}>
          <tr>
            {columns.map((c) =>
              c ? (
                <th key={c.label} scope="col" className={`${table.th} ${c.className ?? ''}`}>
                  {c.hiddenLabel ? <span className="sr-only">{c.label}</span> : c.label}
                </th>
              ) : null,
            )}
          </tr>
        </thead>
        <tbody className={`${table.tbody} ${busy ? 'opacity-60' : ''}`}>{children}</tbody>
      </table>
    </Card>
  );
}
