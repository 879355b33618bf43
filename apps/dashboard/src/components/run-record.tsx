import {
  fromCanonical,
  getCalculator,
  units,
  type CalculationResult,
  type UnitId,
  type UnitSystemId,
} from '@wickstone/calc-core';
import { headline } from '@wickstone/calc-core/answer';
import { displayUnitOf, unitGap, unitSymbol, withUnit } from '@wickstone/calc-core/display';
import { formatValue } from '@wickstone/calc-core/format';
import type { RunDetail, ShownValue } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { Card, Notice } from './ui';
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
  /** The value again in the visitor's units when they differ from the working's SI, as the widget shows it. */
  converted: string | null;
  source: string;
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
function inVisitorUnits(value: unknown, id: string, system: UnitSystemId): string | null {
  if (typeof value !== 'number' || !Object.hasOwn(units, id)) return null;
  const unit = id as UnitId;
  const shown = displayUnitOf({ kind: units[unit].kind }, system);
  return shown === unit ? null : withUnit(formatValue(fromCanonical(value, shown)), shown);
}

function storedSteps(result: RunDetail['serverResult'], system: UnitSystemId): StoredStep[] {
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
      converted: inVisitorUnits(s.value, text(s.unit), system),
      source: text(s.source),
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

const systemName: Record<UnitSystemId, string> = { si: 'metric (SI)', us: 'US customary' };

interface StoredWarning {
  code: string;
  title: string | null;
  message: string;
}

/** The warnings as the visitor read them: the calculator's title for each, and the stored sentence. */
function storedWarnings(run: RunDetail): StoredWarning[] {
  const calc = getCalculator(run.calculator.id);
  const titleOf = (code: string) => calc?.warnings.find((w) => w.code === code)?.summary ?? null;
  const stored = run.serverResult?.warnings;
  const messages = new Map<string, string>();
  if (Array.isArray(stored)) {
    for (const raw of stored as unknown[]) {
      if (typeof raw === 'object' && raw !== null) {
        const w = raw as Record<string, unknown>;
        if (typeof w.code === 'string') messages.set(w.code, text(w.message));
      }
    }
  }
  const codes = [...new Set([...run.warningCodes, ...messages.keys()])];
  return codes.map((code) => ({ code, title: titleOf(code), message: messages.get(code) ?? '' }));
}

/**
 * The headline sentence the visitor read, written by calc-core's `headline` from the stored result
 * in the visitor's units, as the widget writes it; null when the result was not stored or this
 * dashboard does not know the calculator.
 */
export function runHeadline(run: RunDetail): string | null {
  const calc = getCalculator(run.calculator.id);
  const r = run.serverResult;
  const record = (v: unknown) => typeof v === 'object' && v !== null && !Array.isArray(v);
  if (!calc || !r || !record(r.inputs) || !record(r.outputs) || !Array.isArray(r.warnings)) return null;
  const result = r as unknown as Pick<CalculationResult, 'inputs' | 'outputs' | 'warnings'>;
  return headline(calc, result, run.visitorUnitSystem).text;
}

/** A run as the firm reviews it: what the visitor saw, in their units, then the stored working step by step. */
export function RunRecord({ run }: { run: RunDetail }) {
  const system = run.visitorUnitSystem;
  const steps = storedSteps(run.serverResult, system);
  const warnings = storedWarnings(run);
  const sentence = runHeadline(run);
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        {run.widget.name} · {run.calculator.title} ·{' '}
        <time dateTime={run.createdAt}>{formatDateTime(run.createdAt)}</time> · {run.origin} · release{' '}
        {run.release} · calculator version {run.calcVersion}
      </p>
      <p className="text-sm" data-visitor-units={system}>
        Shown in <strong>{systemName[system]}</strong> units, as the visitor saw them
        {run.unitSystem !== system
          ? ` (the widget opens in ${systemName[run.unitSystem]}; the visitor switched)`
          : ''}
        .
      </p>
      {sentence ? (
        <Card className="p-4">
          <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">
            The answer the visitor read
          </h3>
          <p className="mt-1 text-lg font-bold" data-run-headline>
            {sentence}
          </p>
        </Card>
      ) : null}
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
        <ValueList title="Inputs the visitor set" values={run.inputs} />
        <ValueList title="Results the visitor saw" values={run.outputs} />
      </div>
      {run.inputs.map((v) => (v.table ? <RunInputsTable key={v.id} value={v} /> : null))}
      <Card className="p-4">
        <h3 className="text-sm font-semibold tracking-wider text-ink-soft uppercase">Warnings</h3>
        {warnings.length === 0 ? (
          <p className="mt-2 text-sm text-ink-soft">No validity warning was raised.</p>
        ) : (
          <ul className="mt-2 space-y-3">
            {warnings.map((w) => (
              <li key={w.code} data-run-warning={w.code} className="text-sm">
                <p className="font-semibold text-warn">
                  {w.title ?? w.code}{' '}
                  <code className="ml-1 font-mono text-xs font-normal text-ink-soft">{w.code}</code>
                </p>
                {w.message ? <p className="mt-0.5">{w.message}</p> : null}
              </li>
            ))}
          </ul>
        )}
      </Card>
      <section aria-labelledby={`working-${run.id}`} className="space-y-2">
        <h3 id={`working-${run.id}`} className="text-lg font-bold tracking-tight">
          Working
        </h3>
        <p className="text-sm text-ink-soft">
          Made again from the stored inputs by the engine of release {run.release}, which gave the stored
          figures. Worked in SI, as the formulas are written; each value is repeated in the visitor&apos;s
          units where they differ.
        </p>
        {steps.length === 0 ? (
          <p className="text-sm text-ink-soft">
            No working for this run: its engine could not make it again.
          </p>
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
                  {s.converted ? <span className="text-ink-soft"> ({s.converted})</span> : null}
                </p>
                {s.source ? <p className="mt-1 text-xs text-ink-soft">{s.source}</p> : null}
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}
