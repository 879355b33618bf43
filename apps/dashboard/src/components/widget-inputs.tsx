import {
  displayUnitOf,
  inputApplies,
  units,
  unitSymbol,
  type InputDefinition,
  type TableInput,
} from '@wickstone/calc-core';
import { inputModes, type InputMode } from '@wickstone/contracts';
import {
  calculatorDefaultNumber,
  calculatorDefaultText,
  conditionText,
  setChoiceDefault,
  setDefaultText,
  setInputMode,
  setOptionOffered,
  startingChoices,
} from '../lib/widget-draft';
import { FieldProblem } from './form';
import { TableInputRow } from './widget-table-input';
import { EditorSection, smallControlClass, type SectionProps } from './widget-fields';

export const inputModeLabel: Record<InputMode, string> = {
  editable: 'Shown, visitor may change it',
  locked: 'Shown, locked to the default',
  hidden: 'Hidden, the default is used',
};

const kindLabel: Record<string, string> = {
  choice: 'choice',
  length: 'length',
  area: 'area',
  force: 'force',
  pressure: 'pressure',
  surfaceTension: 'surface tension',
  density: 'density',
  temperature: 'temperature',
  angle: 'angle',
  viscosity: 'viscosity',
  time: 'time',
  acceleration: 'acceleration',
  sorptivity: 'sorptivity',
  evaporationRate: 'evaporation rate',
  volumePerLength: 'volume per length',
  flowPerLength: 'flow per length',
  dimensionless: 'number',
};

function InputRow({
  input,
  applies,
  ...props
}: SectionProps & { input: Exclude<InputDefinition, TableInput>; applies: boolean }) {
  const { draft, onChange, errors, readOnly, calc } = props;
  const setting = draft.settings.inputs[input.id];
  const mode = setting?.mode ?? 'editable';
  const base = `input-${input.id}`;
  const defaultKey = `settings.inputs.${input.id}.default`;
  const error =
    errors[defaultKey] ?? errors[`settings.inputs.${input.id}`] ?? errors[`settings.inputs.${input.id}.mode`];
  const condition = conditionText(input, calc);
  const system = draft.settings.units.system;
  const unit = input.kind === 'choice' ? null : displayUnitOf(input, system);

  return (
    <li
      data-input-row={input.id}
      data-applies={applies ? 'yes' : 'no'}
      className="grid gap-x-4 gap-y-2 border-t border-line py-3 first:border-t-0 @md:grid-cols-2 @3xl:grid-cols-[minmax(0,1fr)_13rem_13rem]"
    >
      <div className="min-w-0 space-y-0.5 @md:col-span-2 @3xl:col-span-1">
        <p id={`${base}-label`} className={`font-semibold ${applies ? '' : 'text-ink-soft'}`}>
          {input.label}
        </p>
        <p className="text-sm text-ink-soft">
          {kindLabel[input.kind] ?? input.kind}
          {unit && unitSymbol(unit) ? ` · in ${unitSymbol(unit)}` : ''}
        </p>
        {condition ? (
          <p className="text-sm">
            <span className={applies ? 'font-semibold text-ok' : 'font-semibold text-ink-soft'}>
              {applies ? 'Used with these defaults' : 'Not used with these defaults'}
            </span>
            <span className="text-ink-soft">: only when {condition}.</span>
          </p>
        ) : null}
      </div>
      <div className="space-y-1">
        <label
          htmlFor={`${base}-mode`}
          className="text-xs font-semibold tracking-wider text-ink-soft uppercase @3xl:sr-only"
        >
          For visitors
          <span className="sr-only">: {input.label}</span>
        </label>
        <select
          id={`${base}-mode`}
          value={mode}
          disabled={readOnly}
          onChange={(e) => onChange((d) => setInputMode(d, input.id, e.target.value as InputMode))}
          className={`${smallControlClass} w-full`}
        >
          {inputModes.map((m) => (
            <option key={m} value={m}>
              {inputModeLabel[m]}
            </option>
          ))}
        </select>
      </div>
      <div className="space-y-1">
        <label
          htmlFor={`${base}-default`}
          className="text-xs font-semibold tracking-wider text-ink-soft uppercase @3xl:sr-only"
        >
          Default
          <span className="sr-only">
            {' '}
            of {input.label}
            {unit && unitSymbol(unit) ? `, unit: ${units[unit].name}` : ''}
          </span>
        </label>
        {input.kind === 'choice' ? (
          <select
            id={`${base}-default`}
            value={typeof setting?.default === 'string' ? setting.default : input.default}
            disabled={readOnly}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${base}-error` : undefined}
            onChange={(e) => onChange((d) => setChoiceDefault(d, input, e.target.value))}
            className={`${smallControlClass} w-full`}
          >
            {input.options.map((o) => (
              <option key={o.value} value={o.value}>
                {o.label}
                {o.value === input.default ? ' (calculator default)' : ''}
              </option>
            ))}
          </select>
        ) : (
          <div className="flex items-center gap-2">
            <input
              id={`${base}-default`}
              type="text"
              inputMode="decimal"
              autoComplete="off"
              spellCheck={false}
              value={draft.defaultTexts[input.id] ?? ''}
              placeholder={calculatorDefaultNumber(input, system)}
              disabled={readOnly}
              aria-invalid={error ? true : undefined}
              aria-describedby={`${base}-hint${error ? ` ${base}-error` : ''}`}
              onChange={(e) => {
                const text = e.target.value;
                onChange((d) => setDefaultText(d, input, text));
              }}
              className={`${smallControlClass} w-full min-w-0 tabular-nums`}
            />
            {unit && unitSymbol(unit) ? (
              <span aria-hidden="true" className="shrink-0 text-sm font-semibold text-ink-soft">
                {unitSymbol(unit)}
              </span>
            ) : null}
          </div>
        )}
        {input.kind !== 'choice' ? (
          <p id={`${base}-hint`} className="text-xs text-ink-soft">
            Empty: the calculator&rsquo;s {calculatorDefaultText(input, system)}
          </p>
        ) : null}
        <FieldProblem id={`${base}-error`} message={error} />
      </div>
      {input.kind === 'choice' && input.options.length > 1 ? (
        <fieldset className="space-y-1 @md:col-span-2 @3xl:col-span-3" data-offered-options={input.id}>
          <legend className="text-sm font-semibold">Options offered to visitors: {input.label}</legend>
          <div className="flex flex-wrap gap-x-5 gap-y-1">
            {input.options.map((o) => (
              <label key={o.value} className="inline-flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  data-option={o.value}
                  checked={(setting?.options ?? input.options.map((x) => x.value)).includes(o.value)}
                  disabled={readOnly}
                  onChange={(e) => {
                    const offered = e.target.checked;
                    onChange((d) => setOptionOffered(d, input, o.value, offered));
                  }}
                />
                {o.label}
              </label>
            ))}
          </div>
          <FieldProblem
            id={`${base}-options-error`}
            message={
              errors[`settings.inputs.${input.id}.options`] ??
              Object.entries(errors).find(([k]) => k.startsWith(`settings.inputs.${input.id}.options.`))?.[1]
            }
          />
        </fieldset>
      ) : null}
    </li>
  );
}

export function InputsSection(props: SectionProps) {
  const { draft, calc } = props;
  const choices = startingChoices(calc, draft.settings);
  const system = draft.settings.units.system === 'us' ? 'US customary' : 'metric (SI)';
  return (
    <EditorSection
      id="widget-inputs"
      title="Inputs"
      lead={`What visitors see of each input, and the value it starts from, typed in the widget's ${system} units. Hidden and locked inputs always use the default; a visitor's report that changes them is refused.`}
    >
      <div className="@container">
        <div
          aria-hidden="true"
          className="hidden grid-cols-[minmax(0,1fr)_13rem_13rem] gap-x-4 border-b border-line pb-2 text-xs font-semibold tracking-wider text-ink-soft uppercase @3xl:grid"
        >
          <span>Input</span>
          <span>For visitors</span>
          <span>Default</span>
        </div>
        <ul className="-mt-2">
          {calc.inputs.map((input) =>
            input.kind === 'table' ? (
              <TableInputRow key={input.id} input={input} {...props} />
            ) : (
              <InputRow
                key={input.id}
                input={input}
                applies={inputApplies(input, calc.inputs, choices)}
                {...props}
              />
            ),
          )}
        </ul>
      </div>
    </EditorSection>
  );
}
