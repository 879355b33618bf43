import type {
  CalculationResult,
  CalculatorDefinition,
  ComputedResult,
  UnitId,
  UnitSystemId,
} from '@wickstone/calc-core';
import { formatResult, headline, isSecondaryOutput } from '@wickstone/calc-core/answer';
import { outputHelp } from '@wickstone/calc-core/display';
import { outputUnitFor, toDisplay, unitGap, unitSymbol, withUnit } from '../lib/units.js';
import type { ExtrasModule } from '../lazy.js';
import { DISCLAIMER, isHazard, resultCautions, warningId, withheldOutputs } from '../lib/view.js';
import { pure } from './pure.js';

export { DISCLAIMER, isHazard, resultCautions, warningId } from '../lib/view.js';

/**
 * Cautions the standing disclaimer already says (a calculator's "results are estimates"): left out
 * of the notes, so the widget says it once. The record of a run keeps them.
 */
const SAID_BY_DISCLAIMER: ReadonlySet<string> = new Set(['ESTIMATE_ONLY']);

/** The cautions the notes list: the result's and its calculator's, less hazards (shown with the figures) and what the disclaimer says. */
export function noteCautions(
  calculator: Pick<CalculatorDefinition, 'cautions'>,
  result: Pick<CalculationResult, 'cautions'>,
): CalculationResult['cautions'] {
  return resultCautions(calculator, result).filter((c) => !isHazard(c) && !SAID_BY_DISCLAIMER.has(c.code));
}

interface ResultProps {
  readonly calculator: CalculatorDefinition;
  /** The numbers (compute): shown at once. */
  readonly result: ComputedResult;
  /** The same run with its working and input hash, once made (after first paint); null until then. */
  readonly full: CalculationResult | null;
  readonly system: UnitSystemId;
  readonly stale: boolean;
  readonly firmCautions: string;
  readonly runId: string | null;
  readonly report: 'pending' | 'stored' | 'failed' | null;
  /** The widget's name, so its regions are named apart from another widget's on the same page. */
  readonly name: string;
  /** Secondary outputs (capillary length, ratios): folded under the working, or hidden by the firm. */
  readonly secondary: 'folded' | 'hidden';
  /** The working, the worded warnings and the assumptions, once the extras chunk is here (it follows first paint). */
  readonly extras: ExtrasModule | null;
}

function Figure({ value, unit }: { value: number; unit: UnitId }) {
  const text = formatResult(toDisplay(value, unit));
  const gap = unitGap(unit);
  // A symbol set against the number (the degree of an angle) stays in the figure's own type.
  return (
    <span class="figure">
      {gap === '' ? (
        withUnit(text, unit)
      ) : (
        <>
          {text}
          {gap}
          <span class="u">{unitSymbol(unit)}</span>
        </>
      )}
    </span>
  );
}

/** The firm's own cautions: one per paragraph or line, blank lines ignored. */
export function splitCautions(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((l) => l.trim())
    .filter((l) => l !== '');
}

/** One output as a line: its label, its figure in the visitor's unit, its likely range and its help for this value. */
export function Readout({
  output,
  result,
  system,
}: {
  output: CalculatorDefinition['outputs'][number];
  result: Pick<CalculationResult, 'outputs' | 'band'>;
  system: UnitSystemId;
}) {
  const value = result.outputs[output.id] as number;
  const unit = outputUnitFor(output, system, value);
  const range = result.band?.outputs[output.id];
  const help = outputHelp(output, value);
  return (
    <div class="readout" data-output={output.id} data-value={String(value)} data-unit={unit}>
      <dt>{output.label}</dt>
      <dd>
        <Figure value={value} unit={unit} />
        {range && range.low !== range.high && (
          <span class="band" data-band={output.id}>
            likely{' '}
            {withUnit(
              `${formatResult(toDisplay(range.low, unit))} – ${formatResult(toDisplay(range.high, unit))}`,
              unit,
            )}
          </span>
        )}
      </dd>
      {help && <dd class="help">{help}</dd>}
    </div>
  );
}

/** The answer itself, without its stale mark and report state. */
type AnswerProps = Omit<ResultProps, 'stale' | 'runId' | 'report'>;

/**
 * What the answer says: figures, band, hazards, warnings, working and cautions, then the standing
 * disclaimer. Rendered again only when the answer changes (a new one, its full run), not when it
 * goes stale or its run report is answered.
 */
const Answer = pure(function Answer({
  calculator,
  result,
  full,
  system,
  firmCautions,
  name,
  secondary,
  extras,
}: AnswerProps) {
  const answer = headline(calculator, result, system);
  const figures = calculator.outputs.filter((o) => typeof result.outputs[o.id] === 'number');
  const main = figures.filter((o) => !isSecondaryOutput(o));
  // Outputs the method cannot give for these inputs: named, with the reason, never a figure.
  const withheld = withheldOutputs(calculator, result);
  const inputLabel = (id: string): string => calculator.inputs.find((i) => i.id === id)?.label ?? id;
  const hazards = resultCautions(calculator, result).filter(isHazard);
  return (
    <>
      <div class="answer">
        {extras && full && (
          <extras.Picture calculator={calculator} result={full} system={system} output={answer.output} />
        )}
        <div class="answer-text">
          <p
            class={answer.withheld ? 'headline is-withheld' : 'headline'}
            data-wickstone="headline"
            data-headline-output={answer.output ?? undefined}
          >
            {answer.text}
          </p>
          {(main.length > 0 || withheld.length > 0) && (
            <dl class="readouts">
              {main.map((o) => (
                <Readout key={o.id} output={o} result={result} system={system} />
              ))}
              {withheld.map(({ output, warning }) => (
                <div
                  class="readout is-withheld"
                  key={output.id}
                  data-output={output.id}
                  data-withheld={warning.code}
                >
                  <dt>{output.label}</dt>
                  <dd>
                    <span class="figure withheld">no figure</span>
                  </dd>
                </div>
              ))}
            </dl>
          )}
        </div>
      </div>
      {hazards.length > 0 && (
        <div
          class="hazards"
          role="note"
          aria-label={`${name}: hazards of the liquid`}
          data-wickstone="hazards"
        >
          {hazards.map((c) => (
            <p class="hazard" key={c.code} data-caution={c.code} data-hazard={c.code}>
              <strong>Hazard. </strong>
              {c.text}
              {c.source && <span class="note"> Source: {c.source}.</span>}
            </p>
          ))}
        </div>
      )}

      {extras && full ? (
        <extras.Notes
          calculator={calculator}
          result={full}
          system={system}
          name={name}
          firmCautions={firmCautions}
          secondary={secondary}
          inputLabel={inputLabel}
          warningId={warningId}
        />
      ) : (
        // Before the extras and the full run arrive: calc-core's own warning sentences, so no warning is ever missing.
        result.warnings.length > 0 && (
          <div class="warnings" role="group" aria-label={`${name}: warnings`}>
            {result.warnings.map((w) => (
              <p class="warning" key={w.code} id={warningId(w.code)} data-warning={w.code}>
                {w.message}
              </p>
            ))}
          </div>
        )
      )}
      <p class="disclaimer" data-wickstone="disclaimer">
        {DISCLAIMER}
      </p>
    </>
  );
});

/**
 * The result of the last calculation: the answer, marked stale once the inputs change, with its
 * run's id and report state. Rendered again only when its props change, not on every keystroke.
 */
export const Result = pure(function Result({ stale, runId, report, ...answer }: ResultProps) {
  return (
    <section
      class={stale ? 'result is-stale' : 'result'}
      data-wickstone="result"
      data-result=""
      data-stale={stale ? '' : undefined}
      data-run-id={runId ?? undefined}
      data-report={report ?? undefined}
      aria-label={`${answer.name}: answer`}
    >
      {stale && (
        <p class="stale" data-wickstone="stale">
          The inputs have changed since this answer. Work it out again to update it.
        </p>
      )}
      <Answer {...answer} />
    </section>
  );
});
