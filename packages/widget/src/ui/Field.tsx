import type { ChoiceInput, ChoiceOption, QuantityInput, UnitSystemId } from '@wickstone/calc-core';
import type { FieldState } from '../lib/form.js';
import type { ResolvedInput } from '../lib/settings.js';
import { displayUnitOf, unitSymbol } from '../lib/units.js';
import { controlId } from '../lib/view.js';
import { pure } from './pure.js';

export interface FieldProps {
  readonly input: ResolvedInput;
  readonly state: FieldState;
  readonly system: UnitSystemId;
  readonly error: string | undefined;
  /** For a choice: the options offered now (the liquid's own presets, the firm's list). */
  readonly options?: readonly ChoiceOption[];
  /** Ids of the warnings that name this input, so the field points at them. */
  readonly warningIds: readonly string[];
  readonly onText: (input: ResolvedInput, text: string) => void;
  readonly onChoice: (input: ResolvedInput, value: string) => void;
}

export { controlId } from '../lib/view.js';

/**
 * One calculator input: label with its unit, the control, help, lock note and error tied to it.
 * Rendered again only when its own props change: typing in another field, or a new answer that
 * warns about other inputs, leaves it as it is.
 */
export const Field = pure(function Field({
  input,
  state,
  system,
  error,
  options,
  warningIds,
  onText,
  onChoice,
}: FieldProps) {
  const def = input.def;
  const id = controlId(def.id);
  const locked = input.mode === 'locked';
  const helpId = `${id}-help`;
  const errorId = `${id}-error`;
  const choice = def.kind === 'choice' ? (def as ChoiceInput) : null;
  const option = choice?.options.find((o) => o.value === state.value);
  const help = choice ? option?.help : def.help;
  const symbol = choice ? '' : unitSymbol(displayUnitOf(def as QuantityInput, system));
  const describedBy = [help ? helpId : '', locked ? `${id}-lock` : '', error ? errorId : '', ...warningIds]
    .filter(Boolean)
    .join(' ');
  const classes = [
    'field',
    locked ? 'locked' : '',
    error ? 'invalid' : '',
    warningIds.length > 0 ? 'warned' : '',
  ]
    .filter(Boolean)
    .join(' ');

  let control;
  if (choice && !locked) {
    control = (
      <select
        id={id}
        data-input={def.id}
        value={String(state.value)}
        aria-describedby={describedBy || undefined}
        aria-invalid={error ? 'true' : undefined}
        onChange={(e) => onChoice(input, e.currentTarget.value)}
      >
        {(options ?? choice.options).map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    );
  } else {
    control = (
      <input
        id={id}
        data-input={def.id}
        type="text"
        inputMode={choice ? undefined : 'decimal'}
        autoComplete="off"
        spellcheck={false}
        readOnly={locked}
        aria-readonly={locked ? 'true' : undefined}
        value={choice ? (option?.label ?? String(state.value)) : state.text}
        aria-describedby={describedBy || undefined}
        aria-invalid={error ? 'true' : undefined}
        onInput={locked ? undefined : (e) => onText(input, e.currentTarget.value)}
      />
    );
  }

  return (
    <div
      class={classes}
      data-field={def.id}
      data-mode={input.mode}
      data-invalid={error ? '' : undefined}
      data-warned={warningIds.length > 0 ? '' : undefined}
    >
      <label class="label" for={id}>
        {def.label}
        {/* The unit sits with the name it qualifies, so the accessible name reads "Bore (inside diameter), mm". */}
        {symbol !== '' && <span class="unit">, {symbol}</span>}
      </label>
      <div class="box">{control}</div>
      {locked && (
        <p class="note lock-note" id={`${id}-lock`}>
          <svg viewBox="0 0 12 14" width="11" height="13" aria-hidden="true">
            <path d="M3 6V4a3 3 0 0 1 6 0v2h1.5v7h-9V6zm1.5 0h3V4a1.5 1.5 0 0 0-3 0z" fill="currentColor" />
          </svg>
          Fixed by the firm for this calculator
        </p>
      )}
      {help && (
        <p class="note" id={helpId}>
          {help}
        </p>
      )}
      {error && (
        <p class="error" id={errorId} data-field-error={def.id}>
          {error}
        </p>
      )}
    </div>
  );
});
