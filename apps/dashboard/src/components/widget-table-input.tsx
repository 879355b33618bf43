import { displayUnitOf, unitSymbol, type TableInput } from '@wickstone/calc-core';
import { setTableDefaultText } from '../lib/widget-draft';
import { FieldProblem } from './form';
import { smallControlClass, type SectionProps } from './widget-fields';

/**
 * A table input in the editor: always the visitor's own (it cannot be locked or hidden), with
 * optional starting rows typed or pasted as lines of cells in the widget's units.
 */
export function TableInputRow({ input, ...props }: SectionProps & { input: TableInput }) {
  const { draft, onChange, errors, readOnly } = props;
  const base = `input-${input.id}`;
  const error = errors[`settings.inputs.${input.id}.default`] ?? errors[`settings.inputs.${input.id}.mode`];
  const system = draft.settings.units.system;
  const columns = input.columns.map(
    (c) => `${c.label.toLowerCase()} (${unitSymbol(displayUnitOf(c, system))})`,
  );
  return (
    <li
      data-input-row={input.id}
      data-applies="yes"
      className="grid gap-x-4 gap-y-2 border-t border-line py-3 first:border-t-0 @md:grid-cols-2 @3xl:grid-cols-[minmax(0,1fr)_26rem_0]"
    >
      <div className="min-w-0 space-y-0.5">
        <p id={`${base}-label`} className="font-semibold">
          {input.label}
        </p>
        <p className="text-sm text-ink-soft">
          table of {columns.join(', ')}, {input.minRows} to {input.maxRows} rows
        </p>
        <p className="text-sm">Always shown: these are the visitor&rsquo;s own readings.</p>
      </div>
      <div className="space-y-1">
        <label
          htmlFor={`${base}-default`}
          className="text-xs font-semibold tracking-wider text-ink-soft uppercase"
        >
          Starting rows (optional)
        </label>
        <textarea
          id={`${base}-default`}
          rows={6}
          spellCheck={false}
          value={draft.defaultTexts[input.id] ?? ''}
          placeholder={`One row a line: ${columns.join(', ')}. Empty: the calculator's example readings.`}
          disabled={readOnly}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${base}-hint${error ? ` ${base}-error` : ''}`}
          onChange={(e) => {
            const text = e.target.value;
            onChange((d) => setTableDefaultText(d, input, text));
          }}
          className={`${smallControlClass} w-full font-mono tabular-nums`}
        />
        <p id={`${base}-hint`} className="text-xs text-ink-soft">
          Cells apart by spaces, tabs or semicolons; paste straight from a spreadsheet.
        </p>
        <FieldProblem id={`${base}-error`} message={error} />
      </div>
    </li>
  );
}
