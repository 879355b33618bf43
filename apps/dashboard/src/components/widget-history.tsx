import { useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import {
  displayUnitOf,
  fromCanonical,
  withUnit,
  type CalculatorDefinition,
  type InputDefinition,
  type UnitSystemId,
} from '@wickstone/calc-core';
import { diffWords } from 'diff';
import { hexColorPattern, type InputMode, type Widget, type WidgetStatus } from '@wickstone/contracts';
import { formatDateTime } from '../lib/labels';
import { formatNumber } from '../lib/widget-draft';
import { useRestoreRevision, widgetRevisionsQuery } from '../queries/widgets';
import { ConfirmAction } from './confirm';
import { describeError, EmptyState, ErrorState, LoadingState } from './states';
import { PageNav } from './paged-table';
import { EditorSection } from './widget-fields';
import { statusLabel } from './widget-status';
import { inputModeLabel } from './widget-inputs';
import { Breakable } from './ui';

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

/** An input's whole setting (as the first save of it is stored) in words: how it is shown, and its default. */
function inputSetting(value: unknown, def: InputDefinition | undefined, system: UnitSystemId): string | null {
  if (typeof value !== 'object' || value === null || !('mode' in value)) return null;
  const v = value as { mode: unknown; default?: unknown };
  const mode =
    typeof v.mode === 'string' && v.mode in inputModeLabel ? inputModeLabel[v.mode as InputMode] : null;
  if (!mode) return null;
  if (v.default === undefined || !def) return mode;
  if (def.kind === 'choice')
    return `${mode}: ${def.options.find((o) => o.value === v.default)?.label ?? String(v.default)}`;
  if (def.kind === 'table')
    return Array.isArray(v.default) ? `${mode}: ${v.default.length} starting rows` : mode;
  if (typeof v.default !== 'number') return mode;
  const unit = displayUnitOf(def, system);
  return `${mode}: ${withUnit(formatNumber(fromCanonical(v.default, unit)), unit)}`;
}

function shortText(s: string): string {
  return s.length > 90 ? `${s.slice(0, 88)}…` : s;
}

export function SettingValue({
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
  const whole = /^settings\.inputs\.(\w+)$/.exec(path);
  const setting = whole
    ? inputSetting(
        value,
        calc.inputs.find((i) => i.id === whole[1]),
        system,
      )
    : null;
  if (setting) return <span>{setting}</span>;
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
      <span>
        <Breakable text={value.map(String).join(', ')} />
      </span>
    ) : (
      <span className="text-ink-faint">none</span>
    );
  }
  const text = typeof value === 'string' ? value : JSON.stringify(value);
  return (
    <span title={text.length > 90 ? text : undefined}>
      <Breakable text={shortText(text)} />
    </span>
  );
}

/** Long text (cautions, consent wording) as it changed, word by word: what went out and what came in. */
export function TextDifference({ before, after }: { before: string; after: string }) {
  return (
    <p
      className="rounded-sm border border-line bg-paper px-3 py-2 text-sm whitespace-pre-wrap"
      data-text-diff
    >
      {diffWords(before, after).map((part, i) =>
        part.added ? (
          <ins key={i} className="bg-ok-tint text-ok no-underline decoration-2">
            <span className="sr-only">added: </span>
            {part.value}
          </ins>
        ) : part.removed ? (
          <del key={i} className="bg-bad-tint text-bad">
            <span className="sr-only">removed: </span>
            {part.value}
          </del>
        ) : (
          <span key={i}>{part.value}</span>
        ),
      )}
    </p>
  );
}

const isLongText = (v: unknown) => typeof v === 'string' && (v.length > 40 || v.includes('\n'));

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
    <dl className="divide-y divide-line">
      {changes.map((c) => (
        <div key={c.path} className="space-y-1 py-2 text-sm" data-change={c.path}>
          <dt className="font-semibold">{changeLabel(c.path, calc)}</dt>
          <dd className="min-w-0">
            {(isLongText(c.before) || isLongText(c.after)) &&
            (typeof c.before === 'string' || c.before === null) &&
            typeof c.after === 'string' ? (
              <TextDifference before={typeof c.before === 'string' ? c.before : ''} after={c.after} />
            ) : (
              <span className="grid grid-cols-[2.5rem_minmax(0,1fr)] items-baseline gap-x-2 gap-y-0.5">
                <span className="text-xs font-semibold tracking-wider text-ink-soft uppercase">was</span>
                <SettingValue path={c.path} value={c.before} calc={calc} system={system} />
                <span className="text-xs font-semibold tracking-wider text-ink-soft uppercase">now</span>
                <SettingValue path={c.path} value={c.after} calc={calc} system={system} />
              </span>
            )}
          </dd>
        </div>
      ))}
    </dl>
  );
}

const statusPhrase: Record<WidgetStatus, string> = {
  draft: 'returned it to preparation',
  live: 'put it in service',
  paused: 'put it on hold',
};

/** One save in a sentence: what a person would say they did. */
export function describeRevision(
  changes: readonly { path: string; before: unknown; after: unknown }[],
  calc: CalculatorDefinition,
): string {
  if (changes.length > 0 && changes.every((c) => c.before === null)) return 'Created the widget.';
  const phrases: string[] = [];
  const rest: string[] = [];
  for (const c of changes) {
    if (c.path === 'status' && typeof c.after === 'string' && c.after in statusPhrase)
      phrases.push(statusPhrase[c.after as WidgetStatus]);
    else if (c.path === 'name' && typeof c.after === 'string') phrases.push(`renamed it “${c.after}”`);
    else {
      const label = changeLabel(c.path, calc);
      rest.push(`the ${label.charAt(0).toLowerCase()}${label.slice(1)}`);
    }
  }
  if (rest.length > 3)
    phrases.push(`changed ${rest.slice(0, 2).join(', ')} and ${rest.length - 2} more settings`);
  else if (rest.length > 0)
    phrases.push(
      `changed ${rest.length > 1 ? `${rest.slice(0, -1).join(', ')} and ${rest.at(-1)}` : rest[0]}`,
    );
  const text =
    phrases.length > 1 ? `${phrases.slice(0, -1).join('; ')} and ${phrases.at(-1)}` : (phrases[0] ?? 'saved');
  return `${text.charAt(0).toUpperCase()}${text.slice(1)}.`;
}

export interface RestoreControl {
  /** False while the editor holds unsaved changes: a restore would overwrite them. */
  allowed: boolean;
  onRestored: (widget: Widget, revisionNumber: number) => void;
}

function RestoreButton({
  orgId,
  widgetId,
  revisionId,
  number,
  control,
}: {
  orgId: number;
  widgetId: number;
  revisionId: number;
  number: number;
  control: RestoreControl;
}) {
  const restore = useRestoreRevision(orgId, widgetId);
  if (!control.allowed)
    return <p className="text-xs text-ink-soft">Save or discard your changes to restore this revision.</p>;
  return (
    <div className="space-y-1">
      <ConfirmAction
        label={`Restore revision ${number}`}
        question={`Put back the name, sites and settings of revision ${number}? The status stays as it is, and the restore is saved as a new revision.`}
        confirmLabel="Restore"
        busy={restore.isPending}
        onConfirm={() => restore.mutate(revisionId, { onSuccess: (w) => control.onRestored(w, number) })}
      />
      {restore.isError ? <p className="text-sm text-bad">{describeError(restore.error)}</p> : null}
    </div>
  );
}

/**
 * Every save as a numbered revision, newest first, as in the revision block of a drawing: its
 * number, date, what was done in words and who did it; the changes themselves underneath, and a
 * way to put an earlier revision back.
 */
export function HistorySection({
  orgId,
  widgetId,
  calc,
  system,
  restore,
}: {
  orgId: number;
  widgetId: number;
  calc: CalculatorDefinition;
  system: UnitSystemId;
  /** Given to those who may change the widget. */
  restore?: RestoreControl;
}) {
  const [page, setPage] = useState(1);
  const history = useQuery(widgetRevisionsQuery(orgId, widgetId, page, pageSize));
  let body;
  if (history.isPending) body = <LoadingState label="Loading the revisions…" />;
  else if (history.isError)
    body = (
      <ErrorState
        title="The revisions could not be loaded"
        error={history.error}
        onRetry={() => void history.refetch()}
      />
    );
  else if (history.data.items.length === 0) body = <EmptyState title="No saves yet" />;
  else {
    const total = history.data.total;
    body = (
      <div className="space-y-3">
        <ol
          className={`divide-y divide-line border-y border-line ${history.isPlaceholderData ? 'opacity-60' : ''}`}
          aria-busy={history.isPlaceholderData || undefined}
        >
          {history.data.items.map((r, i) => {
            const number = total - ((page - 1) * pageSize + i);
            const created = r.changes.length > 0 && r.changes.every((c) => c.before === null);
            const shown = created
              ? // The settings are one block each at creation: the later revisions show them field by field.
                r.changes.filter((c) => typeof c.after !== 'object' || Array.isArray(c.after))
              : r.changes;
            return (
              <li
                key={r.id}
                data-revision={r.id}
                className="grid gap-x-4 gap-y-2 py-3 sm:grid-cols-[3.5rem_1fr]"
              >
                <p className="text-sm" aria-label={`Revision ${number}`}>
                  <span className="inline-flex h-8 min-w-8 items-center justify-center rounded-sm border-2 border-ink px-1 font-bold tabular-nums">
                    {number}
                  </span>
                </p>
                <div className="min-w-0 space-y-2">
                  <p className="font-semibold" data-revision-words>
                    {describeRevision(r.changes, calc)}
                  </p>
                  <p className="text-sm text-ink-soft">
                    {r.author?.name ?? 'Someone no longer in the team'} ·{' '}
                    <time dateTime={r.createdAt}>{formatDateTime(r.createdAt)}</time>
                  </p>
                  <details open={i === 0 && page === 1} className="group">
                    <summary className="cursor-pointer text-sm font-semibold text-brand">
                      {created ? 'Settings it started with' : `What changed (${r.changes.length})`}
                    </summary>
                    <div className="mt-1">
                      <ChangeList changes={shown} calc={calc} system={system} />
                    </div>
                  </details>
                  {restore && !(i === 0 && page === 1) ? (
                    <RestoreButton
                      orgId={orgId}
                      widgetId={widgetId}
                      revisionId={r.id}
                      number={number}
                      control={restore}
                    />
                  ) : null}
                </div>
              </li>
            );
          })}
        </ol>
        <PageNav
          label="Revision pages"
          page={page}
          pageSize={pageSize}
          total={total}
          noun="revisions"
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
      title="Revisions"
      lead="Every save is kept as a numbered revision: what was done, by whom and when. An earlier one can be put back."
    >
      {body}
    </EditorSection>
  );
}
