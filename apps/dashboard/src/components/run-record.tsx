import { unitGap, units, unitSymbol, type UnitId } from '@wickstone/calc-core';
import { formatValue } from '@wickstone/calc-core/format';
import type { RunDetail, ShownValue } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { Badge, Card, Notice } from './ui';
import { RunInputsTable } from './run-inputs-table';

/** One stored step of the server's working: canonical value and unit, exactly as kept. */
interface StoredStep {
  label: string;
  formula: string;
  substituted: string;
  /** Four significant figures, as the widget shows it; `exact` is the stored number in full. */
  value: string;
  exact: string;
  /** The unit's symbol (`kg/m³`), or the stored id as it is when this calc-core does not know it. */
  unit: string;
  /** What stands between number and symbol: calc-core's one rule (`35°`, `20 °C`). */
  gap: string;
}

function unitOf(id: string): { unit: string; gap: string } {
  if (!Object.hasOwn(units, id)) return { unit: id, gap: id === '' ? '' : ' ' };
  return { unit: unitSymbol(id as UnitId), gap: unitGap(id as UnitId) };
}

const text = (v: unknown): string =>
  typeof v === 'string' ? v : typeof v === 'number' ? String(v) : v == null ? '' : JSON.stringify(v);

/*
 * The contract keeps the stored result as an open record (it is whatever the calculator wrote at
 * the time), so the steps are read defensively rather than trusted to a shape.
 */
function storedSteps(result: RunDetail['serverResult']): StoredStep[] {
  const working = result?.working;
  if (!Array.isArray(working)) return [];
  return working.map((raw: unknown) => {
    const s = typeof raw === 'object' && raw !== null ? (raw as Record<string, unknown>) : {};
    return {
      label: text(s.label),
      formula: text(s.formula),
      substituted: text(s.substituted),
      value: typeof s.value === 'number' ? formatValue(s.value) : text(s.value),
      exact: text(s.value),
      ...unitOf(text(s.unit)),
    };
  });
}

function ValueList({ title, values }: { title: string; values: readonly ShownValue[] }) {
  return (
    <Card className="p-4">
      <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">{title}</h3>
      {values.length === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">None.</p>
      ) : (
        <dl className="mt-2 grid grid-cols-[minmax(0,1fr)_auto] gap-x-4 gap-y-1.5 text-sm">
          {values.map((v) => (
            <div key={v.id} className="contents">
              <dt className="text-ink-soft">{v.label}</dt>
              <dd className="text-right font-semibold tabular-nums">{v.text}</dd>
            </div>
          ))}
        </dl>
      )}
    </Card>
  );
}

/** A run as the firm reviews it: values, the stored working step by step, warnings, agreement. */
export function RunRecord({ run }: { run: RunDetail }) {
  const steps = storedSteps(run.serverResult);
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        {run.widget.name} · {run.calculator.title} ·{' '}
        <time dateTime={run.createdAt}>{formatDateTime(run.createdAt)}</time> · {run.origin} · release{' '}
        {run.release} · calculator version {run.calcVersion}
      </p>
      {run.agreed ? (
        <Notice tone="ok">The server recomputed this run from its inputs and reached the same result.</Notice>
      ) : (
        <Notice tone="bad">
          <p className="font-semibold">
            The server&apos;s recomputation did not reproduce what the visitor saw.
          </p>
          {run.mismatch ? (
            <pre className="mt-2 overflow-x-auto text-xs whitespace-pre-wrap" data-testid="run-mismatch">
              {JSON.stringify(run.mismatch, null, 2)}
            </pre>
          ) : null}
        </Notice>
      )}
      <div className="grid gap-4 md:grid-cols-2">
        <ValueList title={`Inputs (${run.unitSystem.toUpperCase()} units)`} values={run.inputs} />
        <ValueList title="Results shown" values={run.outputs} />
      </div>
      {run.inputs.map((v) => (v.table ? <RunInputsTable key={v.id} value={v} /> : null))}
      <Card className="p-4">
        <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">Warnings</h3>
        {run.warningCodes.length === 0 ? (
          <p className="mt-2 text-sm text-ink-soft">No validity warning was raised.</p>
        ) : (
          <ul className="mt-2 flex flex-wrap gap-2">
            {run.warningCodes.map((c) => (
              <li key={c}>
                <Badge tone="warn">{c}</Badge>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <section aria-labelledby={`working-${run.id}`} className="space-y-2">
        <h3 id={`working-${run.id}`} className="text-lg font-bold tracking-tight">
          Working, as stored
        </h3>
        {steps.length === 0 ? (
          <p className="text-sm text-ink-soft">No working was stored for this run.</p>
        ) : (
          <ol className="space-y-2">
            {steps.map((s, i) => (
              <li
                key={`${i}-${s.label}`}
                className="rounded-md border border-line bg-card px-4 py-3"
                data-working-step
              >
                <p className="font-semibold">
                  <span className="mr-2 text-ink-faint tabular-nums">{i + 1}.</span>
                  {s.label}
                </p>
                <p className="mt-1 font-mono text-sm">{s.formula}</p>
                <p className="font-mono text-sm text-ink-soft">{s.substituted}</p>
                <p className="mt-1 text-sm">
                  ={' '}
                  <strong className="tabular-nums" title={`${s.exact}${s.gap}${s.unit} as stored`}>
                    {s.value}
                  </strong>
                  {s.gap}
                  {s.unit}
                </p>
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}
