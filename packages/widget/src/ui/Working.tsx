import type { CalculationResult, CalculatorDefinition, UnitSystemId } from '@wickstone/calc-core';
import { formatResult, isSecondaryOutput } from '@wickstone/calc-core/answer';
import { referencesFor } from '@wickstone/calc-core/display';
import { inReaderUnits, readWarning, warningTitle } from '@wickstone/calc-core/wording';
import { displayUnitOf, formatValue, outputUnitFor, toDisplay, unitKind, withUnit } from '../lib/units.js';
import { noteCautions, Readout, splitCautions } from './Result.js';

interface WorkingProps {
  readonly calculator: CalculatorDefinition;
  readonly result: CalculationResult;
  readonly system: UnitSystemId;
}

/** How a result was worked out, step by step, and the published sources the calculator rests on. */
export function Working({ calculator, result, system }: WorkingProps) {
  // Only the sources this result rests on: with water, no other liquid's table.
  const references = referencesFor(calculator.references, result.inputs);
  return (
    <details class="working" data-wickstone="working">
      <summary>How this was worked out</summary>
      <ol class="steps">
        {result.working.map((step, i) => {
          // Working is stated in SI, as the formulas are; the value is repeated in the visitor's units.
          const shown = displayUnitOf({ kind: unitKind(step.unit) }, system);
          const converted = shown !== step.unit;
          return (
            <li class="step" key={i} data-step={i}>
              <p class="step-label">{step.label}</p>
              <code class="math">{step.formula}</code>
              <code class="math">{step.substituted}</code>
              <p class="step-value">
                = {withUnit(formatValue(step.value), step.unit)}
                {converted && (
                  <span class="note"> ({withUnit(formatValue(toDisplay(step.value, shown)), shown)})</span>
                )}
              </p>
              {step.source && <p class="step-source">{step.source}</p>}
              {step.id !== undefined &&
                result.warnings
                  .filter((w) => w.step === step.id)
                  .map((w) => (
                    <p class="step-warning" key={w.code} data-step-warning={w.code}>
                      See the warning “{warningTitle(w.code, calculator)}”.
                    </p>
                  ))}
            </li>
          );
        })}
      </ol>
      {references.length > 0 && (
        <ul class="refs" aria-label="Sources" data-wickstone="references">
          {references.map((r) => (
            <li key={r.id} data-reference={r.id}>
              {r.citation} — {r.usedFor}
            </li>
          ))}
        </ul>
      )}
    </details>
  );
}

// The parts of a result that read best in words and so carry the most text: warnings with their
// titles, in the visitor's units, and the assumptions. They arrive with the extras chunk (this
// module is in it), after first paint; until then the result shows calc-core's warning sentences
// as they are.

interface DetailsProps {
  readonly calculator: CalculatorDefinition;
  readonly result: CalculationResult;
  readonly system: UnitSystemId;
  /** The widget's name, so the group is named apart from another widget's on the same page. */
  readonly name: string;
  readonly inputLabel: (id: string) => string;
  readonly warningId: (code: string) => string;
}

/** Each warning as a title and its sentence in the visitor's units; the code stays in the data. */
export function Warnings({ calculator, result, system, name, inputLabel, warningId }: DetailsProps) {
  if (result.warnings.length === 0) return null;
  return (
    <div class="warnings" role="group" aria-label={`${name}: warnings`} data-wickstone="warnings">
      {result.warnings.map((w) => {
        const read = readWarning(w, system, calculator);
        return (
          <div class="warning" key={w.code} id={warningId(w.code)} data-warning={w.code}>
            <p class="warning-title" data-warning-title={w.code}>
              {read.title}
            </p>
            <p class="warning-text">
              {read.text}
              {w.fields.length > 0 && (
                <span class="note"> Check: {w.fields.map(inputLabel).join(', ')}.</span>
              )}
            </p>
          </div>
        );
      })}
    </div>
  );
}

interface NotesProps extends DetailsProps {
  readonly firmCautions: string;
  readonly secondary: 'folded' | 'hidden';
}

/**
 * Everything under the answer that arrives with the extras: the worded warnings, the spread the
 * likely ranges come from, the working and its sources, the supporting figures (folded, or hidden
 * by the firm), the assumptions, the cautions and the record of the engine and inputs.
 */
export function Notes(props: NotesProps) {
  const { calculator, result, system, firmCautions, secondary, inputLabel } = props;
  const band = result.band;
  const supporting = calculator.outputs.filter(
    (o) => isSecondaryOutput(o) && typeof result.outputs[o.id] === 'number',
  );
  const general = noteCautions(calculator, result);
  return (
    <>
      <Warnings {...props} />
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
                    `${formatResult(toDisplay(b.low, unit))} to ${formatResult(toDisplay(b.high, unit))}`,
                    unit,
                  )
                : `${b.low} to ${b.high}`;
              return `${inputLabel(b.input)}, ${edges} (${b.source})`;
            })
            .join('; ')}
          .
        </p>
      )}
      <Working calculator={calculator} result={result} system={system} />
      {secondary === 'folded' && supporting.length > 0 && (
        <details class="more" data-wickstone="secondary">
          <summary>Supporting figures</summary>
          <dl class="readouts quiet">
            {supporting.map((o) => (
              <Readout key={o.id} output={o} result={result} system={system} />
            ))}
          </dl>
        </details>
      )}
      <Assumptions result={result} system={system} />
      <div class="cautions" data-wickstone="cautions">
        <h4 class="label">Before relying on this</h4>
        <ul>
          {general.map((c) => (
            <li key={c.code} data-caution={c.code}>
              {c.text}
              {c.source && <span class="note"> ({c.source})</span>}
            </li>
          ))}
          {splitCautions(firmCautions).map((text, i) => (
            <li key={`firm-${i}`} class="firm" data-caution="firm">
              {text}
            </li>
          ))}
        </ul>
      </div>
      <p class="provenance" data-wickstone="provenance">
        Calculation engine <span data-wickstone="engine-version">{result.version}</span> · input hash{' '}
        <code class="hash" data-wickstone="input-hash">
          {result.inputHash}
        </code>
      </p>
    </>
  );
}

/** What the answer takes for granted, its values in the visitor's units. */
export function Assumptions({ result, system }: Pick<DetailsProps, 'result' | 'system'>) {
  if (result.assumptions.length === 0) return null;
  return (
    <div class="assumptions" data-wickstone="assumptions">
      <h4 class="label">This answer assumes</h4>
      <ul>
        {result.assumptions.map((a, i) => (
          <li key={i} data-assumption={i}>
            {inReaderUnits(a, system)}
          </li>
        ))}
      </ul>
    </div>
  );
}

// The answer drawn on the calculator's own diagram (here, in the extras chunk, because the first
// flight had no room left for it; it is usually here before the first result): the liquid standing in the tube or slot, the
// capillary fringe under the slab, the drop, the plate, the wetted strip. Drawn to show the
// situation, not to scale: the figure beside it is the headline. Decorative to assistive
// technology (the headline says the same in words), so hidden from it.

interface PictureProps {
  readonly calculator: CalculatorDefinition;
  readonly result: CalculationResult;
  readonly system: UnitSystemId;
  /** The output the headline states, so the drawing labels the same figure. */
  readonly output: string | null;
}

const W = 150;
const H = 150;

function value(result: CalculationResult, id: string): number | null {
  const v = result.outputs[id];
  return typeof v === 'number' ? v : null;
}

function inputNumber(result: CalculationResult, id: string): number | null {
  const v = result.inputs[id];
  return typeof v === 'number' ? v : null;
}

/** An output as the label on the drawing: its figure in the unit the result shows it in. */
function label(
  calculator: CalculatorDefinition,
  result: CalculationResult,
  id: string,
  system: UnitSystemId,
) {
  const o = calculator.outputs.find((x) => x.id === id);
  const v = value(result, id);
  if (o === undefined || v === null) return null;
  const unit = outputUnitFor(o, system, v);
  return withUnit(formatResult(toDisplay(Math.abs(v), unit)), unit);
}

/** A vertical dimension line with end ticks and its label to the right. */
function Dimension({ x, y1, y2, text }: { x: number; y1: number; y2: number; text: string | null }) {
  const mid = (y1 + y2) / 2;
  return (
    <g class="pic-dim">
      <line x1={x} x2={x} y1={y1} y2={y2} />
      <line x1={x - 4} x2={x + 4} y1={y1} y2={y1} />
      <line x1={x - 4} x2={x + 4} y1={y2} y2={y2} />
      {text !== null && (
        <text x={x + 6} y={mid + 4}>
          {text}
        </text>
      )}
    </g>
  );
}

/** Liquid in a tube or between two walls, standing above (or pushed below) the pool outside. */
function Rise({ calculator, result, system, output, slot }: PictureProps & { slot: boolean }) {
  const pool = 112;
  const h = output === null ? null : value(result, output);
  // Indicative height: rises up to 80 px, longer ones approach it (not to scale).
  const px = h === null ? 0 : h >= 0 ? 10 + (72 * h) / (h + 0.03) : -14;
  const top = pool - px;
  const x0 = 44;
  const bore = 14;
  const sag = h === null ? 0 : h >= 0 ? 5 : -5;
  const text = h === null || output === null ? 'no figure' : label(calculator, result, output, system);
  return (
    <>
      <rect class="pic-pool" x="6" y={pool} width={W - 12} height={H - pool - 6} rx="3" />
      <line class="pic-surface" x1="6" x2={W - 6} y1={pool} y2={pool} />
      <path
        class="pic-liquid"
        d={`M${x0} ${top} Q${x0 + bore / 2} ${top + sag} ${x0 + bore} ${top} L${x0 + bore} ${H - 6} L${x0} ${H - 6} Z`}
      />
      {slot ? (
        <>
          <rect class="pic-wall" x={x0 - 8} y="12" width="8" height={H - 30} />
          <rect class="pic-wall" x={x0 + bore} y="12" width="8" height={H - 30} />
        </>
      ) : (
        <rect class="pic-glass" x={x0} y="12" width={bore} height={H - 30} rx="2" />
      )}
      {h !== null && h !== 0 ? (
        <Dimension x={x0 + bore + 18} y1={Math.min(top, pool)} y2={Math.max(top, pool)} text={text} />
      ) : (
        <text class="pic-note" x={x0 + bore + 14} y={pool - 8}>
          {text}
        </text>
      )}
    </>
  );
}

/** The soil under a slab: water table, the capillary fringe above it, the gap (or none) to the slab. */
function Soil({ calculator, result, system }: PictureProps) {
  const slabBottom = 26;
  const table = 126;
  const depth = inputNumber(result, 'waterTableDepth') ?? 1;
  const clearance = value(result, 'slabClearance');
  const layer = inputNumber(result, 'layerThickness');
  const span = table - slabBottom;
  const wet = clearance === null ? null : Math.min(Math.max(depth - clearance, 0), depth);
  const fringeTop = wet === null ? table : table - (span * wet) / Math.max(depth, 1e-9);
  const layerPx = layer === null ? 0 : Math.min(span, (span * layer) / Math.max(depth, 1e-9));
  return (
    <>
      <rect class="pic-soil" x="8" y={slabBottom} width="82" height={H - slabBottom - 6} />
      {layerPx > 0 && <rect class="pic-layer" x="8" y={slabBottom} width="82" height={layerPx} />}
      {wet !== null && <rect class="pic-fringe" x="8" y={fringeTop} width="82" height={table - fringeTop} />}
      <rect class="pic-liquid" x="8" y={table} width="82" height={H - table - 6} />
      <rect class="pic-wall" x="4" y="12" width="90" height={slabBottom - 12} />
      <path class="pic-mark" d={`M96 ${table - 7} l5 7 l5 -7 Z`} />
      {clearance === null ? (
        <text class="pic-note" x="98" y="80">
          no figure
        </text>
      ) : clearance > 0 ? (
        <Dimension
          x={102}
          y1={slabBottom}
          y2={fringeTop}
          text={label(calculator, result, 'slabClearance', system)}
        />
      ) : (
        <text class="pic-note" x="98" y={slabBottom + 12}>
          reaches
        </text>
      )}
    </>
  );
}

/** A drop (or bubble, jet, pore meniscus) with the pressure step across its surface. */
function Drop({ calculator, result, system }: PictureProps) {
  const text = label(calculator, result, 'pressure', system);
  return (
    <>
      <circle class="pic-liquid" cx="58" cy="70" r="36" />
      <text class="pic-in" x="58" y="75" text-anchor="middle">
        Δp
      </text>
      {text !== null && (
        <text class="pic-note" x="58" y="128" text-anchor="middle">
          {text}
        </text>
      )}
    </>
  );
}

/** A plate hung from the balance, its lower edge in the liquid, pulled down by the meniscus. */
function Plate({ calculator, result, system }: PictureProps) {
  const method = result.inputs.method;
  const id = method === 'plate-force' || method === 'rod-force' ? 'force' : 'surfaceTension';
  const text = label(calculator, result, id, system);
  return (
    <>
      <line class="pic-thread" x1="56" x2="56" y1="6" y2="30" />
      <rect class="pic-pool" x="6" y="92" width={W - 12} height={H - 98} rx="3" />
      <rect class="pic-wall" x="48" y="30" width="16" height="72" />
      <path
        class="pic-liquid"
        d="M6 92 Q44 92 48 82 L48 102 L64 102 L64 82 Q68 92 144 92 L144 144 L6 144 Z"
      />
      <path class="pic-mark" d="M74 42 l0 24 m-5 -6 l5 6 l5 -6" />
      {text !== null && (
        <text class="pic-note" x="84" y="58">
          {text}
        </text>
      )}
    </>
  );
}

/** A strip wetted from its foot (or end) up to the distance asked, with the time it takes. */
function Strip({ result }: PictureProps) {
  const up = result.inputs.direction !== 'horizontal';
  const limit = value(result, 'jurinLimit');
  const length = inputNumber(result, 'length') ?? 0;
  const reach = up && limit !== null && length >= limit ? 0.6 : 1;
  return up ? (
    <>
      <rect class="pic-pool" x="6" y="120" width={W - 12} height="24" rx="3" />
      <rect class="pic-glass" x="46" y="14" width="20" height="120" />
      <rect class="pic-fringe" x="46" y={120 - 84 * reach} width="20" height={84 * reach + 14} />
      <line class="pic-front" x1="40" x2="72" y1={120 - 84 * reach} y2={120 - 84 * reach} />
    </>
  ) : (
    <>
      <rect class="pic-glass" x="10" y="62" width="120" height="20" />
      <rect class="pic-fringe" x="10" y="62" width={92 * reach} height="20" />
      <line class="pic-front" x1="102" x2="102" y1="56" y2="88" />
    </>
  );
}

/** The picture for a calculator, or nothing for one it does not know. */
export function Picture({ calculator, result, system, output }: PictureProps) {
  let body;
  switch (calculator.id) {
    case 'tube-rise':
    case 'slot-rise':
      body = (
        <Rise
          calculator={calculator}
          result={result}
          system={system}
          output={output}
          slot={calculator.id === 'slot-rise'}
        />
      );
      break;
    case 'soil-capillary-rise':
      body = <Soil calculator={calculator} result={result} system={system} output={output} />;
      break;
    case 'interface-pressure':
      body = <Drop calculator={calculator} result={result} system={system} output={output} />;
      break;
    case 'wetting-force':
      body = <Plate calculator={calculator} result={result} system={system} output={output} />;
      break;
    case 'wicking-time':
      body = <Strip calculator={calculator} result={result} system={system} output={output} />;
      break;
    default:
      return null;
  }
  return (
    <svg
      class="picture"
      viewBox={`0 0 ${W} ${H}`}
      width={W}
      height={H}
      aria-hidden="true"
      focusable="false"
      data-wickstone="picture"
    >
      {body}
    </svg>
  );
}
