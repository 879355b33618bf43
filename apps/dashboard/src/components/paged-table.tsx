import type { ReactNode } from 'react';
import { DataTable, type Column } from './table';
import { EmptyState } from './states';
import { Button } from './ui';
import { PageNav } from './widget-fields';

/**
 * A table of one server-side page and the page buttons under it, as the runs and
 * leads lists show them. `onPage(1)` is asked for as well, so the caller can drop the parameter.
 */
export function PagedTable({
  caption,
  columns,
  noun,
  page,
  pageSize,
  total,
  loading,
  onPage,
  children,
}: {
  caption: string;
  columns: readonly Column[];
  /** Plural, for "12 runs". */
  noun: string;
  page: number;
  pageSize: number;
  total: number;
  loading: boolean;
  onPage: (page: number) => void;
  children: ReactNode;
}) {
  return (
    <div className="space-y-3">
      <DataTable caption={caption} busy={loading} columns={columns}>
        {children}
      </DataTable>
      <PageNav
        label={`Pages of ${noun}`}
        page={page}
        pages={Math.max(1, Math.ceil(total / pageSize))}
        summary={`${total} ${noun}`}
        loading={loading}
        back="← Previous"
        forward="Next →"
        onPage={onPage}
      />
    </div>
  );
}

/** Shown when the URL asks for a page past the last (a shared link after deletions, a typed URL). */
export function NoSuchPage({ page, onFirst }: { page: number; onFirst: () => void }) {
  return (
    <EmptyState title={`There is no page ${page}`}>
      <Button size="sm" onClick={onFirst}>
        Go to the first page
      </Button>
    </EmptyState>
  );
}
