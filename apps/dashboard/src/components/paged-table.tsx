import type { ReactNode } from 'react';
import { DataTable, type Column } from './table';
import { EmptyState } from './states';
import { Button, Spinner } from './ui';

/*
 * The one way a list is paged: the server sends one page and the total, the URL (or the section's
 * own state) holds the page number, and these draw the page buttons and the past-the-end state.
 */

interface PageNavProps {
  /** The navigation's accessible name, e.g. "Pages of widgets". */
  label: string;
  page: number;
  pageSize: number;
  total: number;
  /** Plural, for "12 widgets". */
  noun: string;
  loading: boolean;
  /** Button texts; a newest-first log says "← Newer" and "Older →". */
  back?: string;
  forward?: string;
  onPage: (page: number) => void;
}

/** Previous / next between pages of a list, with where the reader is; nothing when there is one page. */
export function PageNav({
  label,
  page,
  pageSize,
  total,
  noun,
  loading,
  back = '← Previous',
  forward = 'Next →',
  onPage,
}: PageNavProps) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (pages <= 1) return null;
  return (
    <nav aria-label={label} className="flex flex-wrap items-center justify-between gap-3">
      <p className="flex items-center gap-2 text-sm text-ink-soft" aria-live="polite">
        {loading ? <Spinner /> : null}
        Page {page} of {pages} · {total} {noun}
      </p>
      <div className="flex gap-2">
        <Button size="sm" disabled={page <= 1} onClick={() => onPage(page - 1)}>
          {back}
        </Button>
        <Button size="sm" disabled={page >= pages} onClick={() => onPage(page + 1)}>
          {forward}
        </Button>
      </div>
    </nav>
  );
}

/**
 * A table of one server-side page and the page buttons under it. `onPage(1)` is asked for as
 * well, so the caller can drop the parameter.
 */
export function PagedTable({
  caption,
  columns,
  children,
  ...nav
}: Omit<PageNavProps, 'label'> & {
  caption: string;
  columns: readonly Column[];
  children: ReactNode;
}) {
  return (
    <div className="space-y-3">
      <DataTable caption={caption} busy={nav.loading} columns={columns}>
        {children}
      </DataTable>
      <PageNav label={`Pages of ${nav.noun}`} {...nav} />
    </div>
  );
}

/** Shown when the URL asks for a page past the last (a shared link after deletions, a typed URL). */
export function NoSuchPage({
  page,
  onFirst,
  first = 'Go to the first page',
}: {
  page: number;
  onFirst: () => void;
  first?: string;
}) {
  return (
    <EmptyState title={`There is no page ${page}`}>
      <Button size="sm" onClick={onFirst}>
        {first}
      </Button>
    </EmptyState>
  );
}
