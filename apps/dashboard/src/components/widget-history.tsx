import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  displayUnitOf,
  fromCanonical,
  withUnit,
  type CalculatorDefinition,
  type UnitSystemId,
} from '@wickstone/calc-core';
import { hexColorPattern, type WidgetStatus } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { formatNumber } from '../lib/widget-draft';
import { widgetRevisionsQuery } from '../queries/widgets';
import { EmptyState, ErrorState, LoadingState } from './states';
import { PageNav } from './paged-table';
import { EditorSection } from './widget-fields';
import { statusLabel } from './widget-status';

const pageSize = 10;

const fixedLabels: Record<string, string> = {
  name: 'Name',
  status: 'Status',
  allowedOrigins: 'Sites',
  release: 'Release',
  'settings.units.system': 'Unit system',
  'settings.units.visitorMaySwitch': 'Visitor may switch units',
  'settings.look.colors.background': 'Background colour',
  'settings.look.colors.text': 'Text colour',
  'settings.look.colors.primary': 'Button colour',
  'settings.look.colors.primaryText': 'Button text colour',
  'settings.look.font': 'Font',
  'settings.look.corner': 'Corners',
  'settings.look.logoAssetId': 'Logo',
  'settings.cautions': "Firm's cautions",
  'settings.leadForm.enabled': 'Request form offered',
  'settings.sheet.enabled': 'Calculation sheet offered',
  'settings.sheet.paper': 'Calculation sheet paper',
  'settings.leadForm.consentText': 'Consent wording',
  'settings.leadForm.notify': 'Told of requests',
};

/** A person's name for a changed setting; the path itself is shown beside it. */
export function changeLabel(path: string, calc: CalculatorDefinition): string {
  const fixed = fixedLabels[path];
  if (fixed) return fixed;
  const field = /^settings\.leadForm\.fields\.(\w+)$/.exec(path);
  if (field) return `Request form: ${field[1]}`;
  const input = /^settings\.inputs\.(\w+)(?:\.(mode|default))?$/.exec(path);
  if (input) {
    const label = calc.inputs.find((i) => i.id === input[1])?.label ?? input[1] ?? path;
    return input[2] === 'mode'
      ? `${label}: for visitors`
      : input[2] === 'default'
        ? `${label}: default`
        : label;
  }
  return path;
}

const systemName: Record<string, string> = { si: 'Metric (SI)', us: 'US customary' };

/** Values that read better as words: statuses, unit systems, a logo, switches. */
function namedValue(path: string, value: unknown): string | null {
  if (path === 'status' && typeof value === 'string') return statusLabel[value as WidgetStatus] ?? value;
  if (path === 'settings.units.system' && typeof value === 'string') return systemName[value] ?? value;
  if (path === 'settings.look.logoAssetId' && typeof value === 'number') return `image no. ${value}`;
  if (typeof value === 'boolean') return value ? 'on' : 'off';
  return null;
}

function shortText(s: string): string {
  return s.length > 90 ? `${s.slice(0, 88)}…` : s;
}

function Value({
  path,
  value,
  calc,
  system,
}: {
  path: string;
  value: unknown;
  calc: CalculatorDefinition;
  system: UnitSystemId;
}) {
  if (value === null || value === undefined || value === '')
    return <span className="text-ink-faint">none</span>;
  const named = namedValue(path, value);
  if (named) return <span>{named}</span>;
  if (typeof value === 'string' && hexColorPattern.test(value)) {
    return (
      <span className="inline-flex items-center gap-1 font-mono">
        <span
          aria-hidden="true"
          className="inline-block h-3 w-3 rounded-sm border border-line-strong"
          style={{ backgroundColor: value }}
        />
        {value}
      </span>
    );
  }
  const input = /^settings\.inputs\.(\w+)\.default$/.exec(path);
  const def = input ? calc.inputs.find((i) => i.id === input[1]) : undefined;
  if (typeof value === 'number' && def && def.kind !== 'choice' && def.kind !== 'table') {
    const unit = displayUnitOf(def, system);
    return <span className="tabular-nums">{withUnit(formatNumber(fromCanonical(value, unit)), unit)}</span>;
  }
  if (Array.isArray(value)) {
    return value.length ? (
      <span className="break-all">{value.map(String).join(', ')}</span>
    ) : (
      <span className="text-ink-faint">none</span>
    );
  }
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return (
    <span title={text.length > 90 ? text : undefined} className="break-words">
      {shortText(text)}
    </span>
  );
}

function ChangeList({
  changes,
  calc,
  system,
}: {
  changes: readonly { path: string; before: unknown; after: unknown }[];
  calc: CalculatorDefinition;
  system: UnitSystemId;
}) {
  return (
    <ul className="space-y-1.5">
      {changes.map((c) => (
        <li key={c.path} className="text-sm" data-change={c.path}>
          <span className="font-semibold">{changeLabel(c.path, calc)}</span>{' '}
          <code className="rounded bg-paper px-1 font-mono text-xs text-ink-soft">{c.path}</code>
          <span className="mt-0.5 flex flex-wrap items-center gap-x-2 gap-y-1">
            <Value path={c.path} value={c.before} calc={calc} system={system} />
            <span aria-label="changed to" className="text-ink-soft">
              →
            </span>
            <Value path={c.path} value={c.after} calc={calc} system={system} />
          </span>
        </li>
      ))}
    </ul>
  );
}

/** Every save, newest first: who, when, and each changed setting with its value before and after. */
export function HistorySection({
  orgId,
  widgetId,
  calc,
  system,
}: {
  orgId: number;
  widgetId: number;
  calc: CalculatorDefinition;
  system: UnitSystemId;
}) {
  const [page, setPage] = useState(1);
  const history = useQuery(widgetRevisionsQuery(orgId, widgetId, page, pageSize));
  let body;
  if (history.isPending) body = <LoadingState label="Loading the history…" />;
  else if (history.isError)
    body = (
      <ErrorState
        title="The history could not be loaded"
        error={history.error}
        onRetry={() => void history.refetch()}
      />
    );
  else if (history.data.items.length === 0) body = <EmptyState title="No saves yet" />;
  else {
    body = (
      <div className="space-y-3">
        <ol
          className={`space-y-3 ${history.isPlaceholderData ? 'opacity-60' : ''}`}
          aria-busy={history.isPlaceholderData || undefined}
        >
          {history.data.items.map((r) => {
            const created = r.changes.length > 0 && r.changes.every((c) => c.before === null);
            return (
              <li key={r.id} data-revision={r.id} className="rounded-md border border-line px-4 py-3">
                <p className="flex flex-wrap items-baseline justify-between gap-x-3 text-sm">
                  <span>
                    <strong>{r.author?.name ?? 'Someone no longer in the team'}</strong>{' '}
                    {created
                      ? 'created the widget'
                      : `changed ${r.changes.length === 1 ? 'one setting' : `${r.changes.length} settings`}`}
                  </span>
                  <time dateTime={r.createdAt} className="text-ink-soft">
                    {formatDateTime(r.createdAt)}
                  </time>
                </p>
                <div className="mt-2">
                  {created ? (
                    <details>
                      <summary className="cursor-pointer text-sm font-semibold text-brand">
                        How it started
                      </summary>
                      <div className="mt-2">
                        {/* The settings themselves are one block each here: the later saves show them field by field. */}
                        <ChangeList
                          changes={r.changes.filter(
                            (c) => typeof c.after !== 'object' || Array.isArray(c.after),
                          )}
                          calc={calc}
                          system={system}
                        />
                      </div>
                    </details>
                  ) : (
                    <ChangeList changes={r.changes} calc={calc} system={system} />
                  )}
                </div>
              </li>
            );
          })}
        </ol>
        <PageNav
          label="History pages"
          page={page}
          pageSize={pageSize}
          total={history.data.total}
          noun="saves"
          loading={history.isPlaceholderData}
          back="← Newer"
          forward="Older →"
          onPage={setPage}
        />
      </div>
    );
  }
  return (
    <EditorSection
      id="widget-history"
      title="History"
      lead="Every save is kept: who made it, when, and what changed."
    >
      {body}
    </EditorSection>
  );
}
