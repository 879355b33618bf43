import { useId, type ReactNode } from 'react';
import type { CalculatorDefinition } from '@wickstone/calc-core';
import type { FieldErrors } from '../lib/form';
import type { WidgetDraft } from '../lib/widget-draft';
import { FieldProblem } from './form';
import { Card } from './ui';

/** What every editor section gets: the draft, a way to change it, the errors, and whether it may. */
export interface SectionProps {
  draft: WidgetDraft;
  onChange: (change: (draft: WidgetDraft) => WidgetDraft) => void;
  errors: FieldErrors;
  readOnly: boolean;
  calc: CalculatorDefinition;
}

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
