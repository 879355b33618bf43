import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { Button } from './ui';

/*
 * Compact labelled controls for a filter bar. Each one changes the URL at once (selects, dates)
 * or on submit (text search), so the browser's back button walks back through the filters.
 */
const control =
  'block w-full rounded-md border border-line-strong bg-card px-2.5 py-1.5 text-sm text-ink disabled:bg-paper';

export function FilterSelect({
  label,
  value,
  options,
  onChange,
  allLabel = 'All',
}: {
  label: string;
  value: string;
  options: readonly { value: string; label: string }[];
  onChange: (value: string) => void;
  allLabel?: string;
}) {
  const id = useId();
  return (
    <div className="min-w-36 space-y-1">
      <label htmlFor={id} className="block text-xs font-semibold text-ink-soft">
        {label}
      </label>
      <select id={id} value={value} onChange={(e) => onChange(e.target.value)} className={control}>
        <option value="">{allLabel}</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </div>
  );
}

export function FilterDate({
  label,
  value,
  onChange,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
}) {
  const id = useId();
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-xs font-semibold text-ink-soft">
        {label}
      </label>
      <input
        id={id}
        type="date"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        className={control}
      />
    </div>
  );
}

/** A search box that applies on Enter or its button, not on every key (each change is a request). */
export function FilterSearch({
  label,
  value,
  onSearch,
}: {
  label: string;
  value: string;
  onSearch: (value: string) => void;
}) {
  const id = useId();
  const [draft, setDraft] = useState(value);
  const [seen, setSeen] = useState(value);
  if (value !== seen) {
    // The URL changed under us (back button, a cleared filter): show what it now says.
    setSeen(value);
    setDraft(value);
  }
  const submit = (e: FormEvent) => {
    e.preventDefault();
    onSearch(draft.trim());
  };
  return (
    <form role="search" onSubmit={submit} className="min-w-56 flex-1 space-y-1">
      <label htmlFor={id} className="block text-xs font-semibold text-ink-soft">
        {label}
      </label>
      <div className="flex gap-2">
        <input
          id={id}
          type="search"
          value={draft}
          onChange={(e) => setDraft(e.target.value)}
          className={control}
        />
        <Button size="sm" type="submit">
          Search
        </Button>
      </div>
    </form>
  );
}

/** The card the controls sit in. */
export function FilterBar({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div
      role="group"
      aria-label={label}
      className="flex flex-wrap items-end gap-3 rounded-lg border border-line bg-card px-4 py-3"
    >
      {children}
    </div>
  );
}
