import { useId, type ReactNode, type TextareaHTMLAttributes } from 'react';
import type { CalculatorDefinition } from '@wickstone/calc-core';
import type { FieldErrors } from '../lib/form';
import type { WidgetDraft } from '../lib/widget-draft';
import { Button, Card, Spinner } from './ui';

/** What every editor section gets: the draft, a way to change it, the errors, and whether it may. */
export interface SectionProps {
  draft: WidgetDraft;
  onChange: (change: (draft: WidgetDraft) => WidgetDraft) => void;
  errors: FieldErrors;
  readOnly: boolean;
  calc: CalculatorDefinition;
}

export const controlClass =
  'block w-full rounded-md border border-line-strong bg-card px-3 py-2 text-ink placeholder:text-ink-faint ' +
  'aria-invalid:border-bad aria-invalid:bg-bad-tint/40 disabled:bg-paper disabled:text-ink-soft';

export const smallControlClass =
  'rounded-md border border-line-strong bg-card px-2 py-1.5 text-sm text-ink ' +
  'aria-invalid:border-bad aria-invalid:bg-bad-tint/40 disabled:bg-paper disabled:text-ink-soft';

/** One titled part of the editor, reachable from the page's section list by its id. */
export function EditorSection({
  id,
  title,
  lead,
  children,
}: {
  id: string;
  title: string;
  lead?: ReactNode;
  children: ReactNode;
}) {
  return (
    <Card className="scroll-mt-6 p-5">
      <section id={id} aria-labelledby={`${id}-title`} className="@container space-y-4">
        <div className="space-y-1">
          <h2 id={`${id}-title`} className="text-lg font-bold tracking-tight">
            {title}
          </h2>
          {lead ? <p className="text-sm text-ink-soft">{lead}</p> : null}
        </div>
        {children}
      </section>
    </Card>
  );
}

/** A field's own problem, beside it, referenced by the control's aria-describedby. */
export function FieldProblem({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="flex items-start gap-1.5 text-sm font-semibold text-bad">
      <span aria-hidden="true">!</span>
      <span>{message}</span>
    </p>
  );
}

export function TextAreaField({
  label,
  error,
  hint,
  ...area
}: Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & {
  label: string;
  error?: string | undefined;
  hint?: ReactNode;
}) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : '', hint ? `${id}-hint` : ''].filter(Boolean).join(' ');
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      <textarea
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy || undefined}
        className={controlClass}
        {...area}
      />
      <FieldProblem id={`${id}-error`} message={error} />
      {hint ? (
        <div id={`${id}-hint`} className="text-sm text-ink-soft">
          {hint}
        </div>
      ) : null}
    </div>
  );
}

/** A set of radio choices drawn as cards, each with a line saying what it means. */
export function ChoiceCards<T extends string>({
  legend,
  name,
  value,
  options,
  onChange,
  disabled,
  error,
  columns = '@md:grid-cols-3',
}: {
  legend: string;
  name: string;
  value: T;
  options: readonly {
    value: T;
    label: string;
    labelClassName?: string;
    detail?: ReactNode;
    sample?: ReactNode;
  }[];
  onChange: (value: T) => void;
  disabled: boolean;
  error?: string | undefined;
  columns?: string;
}) {
  const id = useId();
  return (
    <fieldset className="space-y-2" aria-describedby={error ? `${id}-error` : undefined}>
      <legend className="mb-2 text-sm font-semibold">{legend}</legend>
      <div className={`grid gap-2 ${columns}`}>
        {options.map((o) => {
          const checked = o.value === value;
          return (
            <label
              key={o.value}
              className={`flex cursor-pointer gap-3 rounded-md border px-3 py-2.5 has-focus-visible:outline-2 has-focus-visible:outline-offset-2 has-focus-visible:outline-accent has-disabled:cursor-default ${
                checked ? 'border-brand bg-brand-tint/60' : 'border-line-strong bg-card hover:bg-paper'
              }`}
            >
              <input
                type="radio"
                name={name}
                value={o.value}
                checked={checked}
                disabled={disabled}
                onChange={() => onChange(o.value)}
                className="mt-1 accent-brand"
              />
              <span className="min-w-0 space-y-0.5">
                <span className={`flex items-center gap-2 font-semibold ${o.labelClassName ?? ''}`}>
                  {o.sample}
                  {o.label}
                </span>
                {o.detail ? <span className="block text-sm text-ink-soft">{o.detail}</span> : null}
              </span>
            </label>
          );
        })}
      </div>
      <FieldProblem id={`${id}-error`} message={error} />
    </fieldset>
  );
}

export function CheckField({
  label,
  detail,
  checked,
  onChange,
  disabled,
}: {
  label: string;
  detail?: ReactNode;
  checked: boolean;
  onChange: (checked: boolean) => void;
  disabled: boolean;
}) {
  return (
    <label className="flex cursor-pointer items-start gap-3 has-disabled:cursor-default">
      <input
        type="checkbox"
        checked={checked}
        disabled={disabled}
        onChange={(e) => onChange(e.target.checked)}
        className="mt-1 h-4 w-4 accent-brand"
      />
      <span className="space-y-0.5">
        <span className="block font-semibold">{label}</span>
        {detail ? <span className="block text-sm text-ink-soft">{detail}</span> : null}
      </span>
    </label>
  );
}

/** Previous / next between pages of a list, with where the reader is; nothing when there is one page. */
export function PageNav({
  label,
  page,
  pages,
  summary,
  loading,
  back,
  forward,
  onPage,
}: {
  label: string;
  page: number;
  pages: number;
  /** e.g. "12 widgets" */
  summary: string;
  loading: boolean;
  back: string;
  forward: string;
  onPage: (page: number) => void;
}) {
  if (pages <= 1) return null;
  return (
    <nav aria-label={label} className="flex flex-wrap items-center justify-between gap-3">
      <p className="flex items-center gap-2 text-sm text-ink-soft" aria-live="polite">
        {loading ? <Spinner /> : null}
        Page {page} of {pages} · {summary}
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
