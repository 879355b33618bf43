import type { CalculationResult, CalculatorDefinition, UnitSystemId } from '@wickstone/calc-core';
import { displayUnitOf, formatValue, toDisplay, unitKind, withUnit } from '../lib/units.js';

interface WorkingProps {
  readonly calculator: CalculatorDefinition;
  readonly result: CalculationResult;
  readonly system: UnitSystemId;
}

/** How a result was worked out, step by step, and the published sources the calculator rests on. */
export function Working({ calculator, result, system }: WorkingProps) {
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
                      See warning {w.code}.
                    </p>
                  ))}
            </li>
          );
        })}
      </ol>
      {calculator.references.length > 0 && (
        <ul class="refs" aria-label="Sources">
          {calculator.references.map((r) => (
            <li key={r.id}>
              {r.citation} — {r.usedFor}
            </li>
          ))}
        </ul>
      )}
    </details>
  );
}
