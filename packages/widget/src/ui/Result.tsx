import type { CalculationResult, CalculatorDefinition, UnitId, UnitSystemId } from '@wickstone/calc-core';
import {
  formatValue,
  outputUnitFor,
  toDisplay,
  displayUnitOf,
  unitGap,
  unitSymbol,
  withUnit,
} from '../lib/units.js';
import type { ExtrasModule } from '../lazy.js';

export const DISCLAIMER =
  'Results are estimates. They do not replace a site investigation or the judgement of a licensed professional working to local codes.';

/** A warning's DOM id, so the fields it names can point at it. */
export const warningId = (code: string): string => `wk-warn-${code}`;

interface ResultProps {
  readonly calculator: CalculatorDefinition;
  readonly result: CalculationResult;
  readonly system: UnitSystemId;
  readonly stale: boolean;
  readonly firmCautions: string;
  readonly runId: string | null;
  readonly report: 'pending' | 'stored' | 'failed' | null;
  /** The working and its sources, once the extras chunk is here (it follows first paint). */
  readonly Working: ExtrasModule['Working'] | null;
}

function Figure({ value, unit }: { value: number; unit: UnitId }) {
  const text = formatValue(toDisplay(value, unit));
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

/** The warning that withholds an output, if any: the output is then shown as not defined, with its reason. */
function withholdingWarning(result: CalculationResult, outputId: string) {
  return result.warnings.find((w) => (w.withholds ?? []).includes(outputId));
}

/** The result of the last calculation: figures, band, warnings, working, cautions and the standing disclaimer. */
export function Result({
  calculator,
  result,
  system,
  stale,
  firmCautions,
  runId,
  report,
  Working,
}: ResultProps) {
  const outputs = calculator.outputs.filter((o) => typeof result.outputs[o.id] === 'number');
  // Outputs the method cannot give for these inputs: named, with the reason, never a figure.
  const withheld = calculator.outputs.flatMap((o) => {
    const w = result.outputs[o.id] === null ? withholdingWarning(result, o.id) : undefined;
    return w ? [{ output: o, warning: w }] : [];
  });
  const band = result.band;
  const inputLabel = (id: string): string => calculator.inputs.find((i) => i.id === id)?.label ?? id;
  const stepLabel = (id: string): string | undefined => result.working.find((s) => s.id === id)?.label;
  const firm = splitCautions(firmCautions);
  // The result's own cautions: the chosen liquid's hazard first, then the calculator's.
  const cautions = result.cautions;
  const hazards = cautions.filter((c) => c.code.startsWith('HAZARD_') || c.code === 'OTHER_LIQUID_HAZARD');
  const general = cautions.filter((c) => !hazards.includes(c));
  const assumptions = result.assumptions;
  return (
    <section
      class={stale ? 'result is-stale' : 'result'}
      data-wickstone="result"
      data-result=""
      data-stale={stale ? '' : undefined}
      data-run-id={runId ?? undefined}
      data-report={report ?? undefined}
      aria-labelledby="wk-result-title"
    >
      <h3 class="section-title" id="wk-result-title">
        Result
      </h3>
      {stale && (
        <p class="stale" data-wickstone="stale">
          The inputs have changed since this result. Calculate again to update it.
        </p>
      )}
      <dl class="readouts">
        {outputs.map((o) => {
          const value = result.outputs[o.id] as number;
          const unit = outputUnitFor(o, system, value);
          const range = band?.outputs[o.id];
          return (
            <div class="readout" key={o.id} data-output={o.id} data-value={String(value)} data-unit={unit}>
              <dt>{o.label}</dt>
              <dd>
                <Figure value={value} unit={unit} />
                {range && range.low !== range.high && (
                  <span class="band" data-band={o.id}>
                    Likely range{' '}
                    {withUnit(
                      `${formatValue(toDisplay(range.low, unit))} – ${formatValue(toDisplay(range.high, unit))}`,
                      unit,
                    )}
                  </span>
                )}
                {o.help && <span class="band">{o.help}</span>}
              </dd>
            </div>
          );
        })}
        {withheld.map(({ output, warning }) => (
          <div
            class="readout is-withheld"
            key={output.id}
            data-output={output.id}
            data-withheld={warning.code}
          >
            <dt>{output.label}</dt>
            <dd>
              <span class="figure withheld">Not defined here</span>
              <span class="band">{warning.message}</span>
            </dd>
          </div>
        ))}
      </dl>
      {hazards.length > 0 && (
        <div class="hazards" role="note" aria-label="Hazards of the liquid" data-wickstone="hazards">
          {hazards.map((c) => (
            <p class="hazard" key={c.code} data-caution={c.code} data-hazard={c.code}>
              <strong>Hazard. </strong>
              {c.text}
              {c.source && <span class="note"> Source: {c.source}.</span>}
            </p>
          ))}
        </div>
      )}
      {band && band.basis.length > 0 && (
        <p class="band-basis" data-wickstone="band-basis">
          Likely ranges follow the published spread of{' '}
          {band.basis
            .map((b) => {
              const input = calculator.inputs.find((x) => x.id === b.input);
              const unit =
                input && input.kind !== 'choice' && input.kind !== 'table'
                  ? displayUnitOf(input, system)
                  : null;
              const edges = unit
                ? withUnit(
                    `${formatValue(toDisplay(b.low, unit))} to ${formatValue(toDisplay(b.high, unit))}`,
                    unit,
                  )
                : `${b.low} to ${b.high}`;
              return `${inputLabel(b.input)}, ${edges} (${b.source})`;
            })
            .join('; ')}
          .
        </p>
      )}

      {result.warnings.length > 0 && (
        <div class="warnings" role="group" aria-label="Validity warnings">
          {result.warnings.map((w) => (
            <div class="warning" key={w.code} id={warningId(w.code)} data-warning={w.code}>
              <span class="code">{w.code}</span>
              <span>
                {w.message}
                {w.fields.length > 0 && (
                  <span class="note"> Check: {w.fields.map(inputLabel).join(', ')}.</span>
                )}
                {w.step !== undefined && stepLabel(w.step) !== undefined && (
                  <span class="note" data-warning-step={w.step}>
                    {' '}
                    Qualifies working step “{stepLabel(w.step)}”.
                  </span>
                )}
              </span>
            </div>
          ))}
        </div>
      )}

      {Working && <Working calculator={calculator} result={result} system={system} />}

      {assumptions.length > 0 && (
        <div class="assumptions" data-wickstone="assumptions">
          <h4 class="label">This result assumes</h4>
          <ul>
            {assumptions.map((a, i) => (
              <li key={i} data-assumption={i}>
                {a}
              </li>
            ))}
          </ul>
        </div>
      )}

      <div class="cautions" data-wickstone="cautions">
        <h4 class="label">Before relying on this</h4>
        <ul>
          {general.map((c) => (
            <li key={c.code} data-caution={c.code}>
              {c.text}
              {c.source && <span class="note"> ({c.source})</span>}
            </li>
          ))}
          {firm.map((text, i) => (
            <li key={`firm-${i}`} class="firm" data-caution="firm">
              {text}
            </li>
          ))}
        </ul>
        <p class="disclaimer" data-wickstone="disclaimer">
          {DISCLAIMER}
        </p>
      </div>
      <p class="provenance" data-wickstone="provenance">
        Calculation engine <span data-wickstone="engine-version">{result.version}</span> · input hash{' '}
        <code class="hash" data-wickstone="input-hash">
          {result.inputHash}
        </code>
      </p>
    </section>
  );
}
