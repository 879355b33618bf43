import type { Ref } from 'react';
import { UpgradeHint } from './upgrade-hint';
import type { Blocker } from 'react-router';
import type { CalculatorDefinition } from '@wickstone/calc-core';
import type { EmbedWidget, Widget } from '@wickstone/contracts';
import type { FieldErrors } from '../lib/form';
import type { SaveOutcome } from '../lib/use-widget-editor';
import { ConfirmAction } from './confirm';
import { Button, Card } from './ui';
import { changeLabel } from './widget-history';
import { WidgetPreview } from './widget-preview';

/* The widget editor's frame: its section links, the error summary, the preview and the save bar. */

const sections = [
  ['widget-status', 'Name and status'],
  ['widget-inputs', 'Inputs'],
  ['widget-units', 'Units'],
  ['widget-look', 'Look'],
  ['widget-cautions', 'Cautions'],
  ['widget-lead-form', 'Request form'],
  ['widget-sheet', 'Calculation sheet'],
  ['widget-sites', 'Sites'],
  ['widget-embed', 'Embed code'],
  ['widget-history', 'Revisions'],
] as const;

/** The section an error key belongs to, for the summary's links. */
function sectionOf(key: string): string {
  if (key.startsWith('allowedOrigins')) return 'widget-sites';
  if (key.startsWith('settings.inputs')) return 'widget-inputs';
  if (key.startsWith('settings.units')) return 'widget-units';
  if (key.startsWith('settings.look')) return 'widget-look';
  if (key.startsWith('settings.cautions')) return 'widget-cautions';
  if (key.startsWith('settings.leadForm')) return 'widget-lead-form';
  if (key.startsWith('settings.sheet')) return 'widget-sheet';
  return 'widget-status';
}

/** What a reader sees instead of the form (widget-summary), then the same last two sections. */
const summarySections = [
  ['summary-basics', 'Name, status and units'],
  ['summary-inputs', 'Inputs'],
  ['summary-look', 'Look'],
  ['summary-visitors', 'Cautions, requests and sheets'],
  ['widget-embed', 'Embed code'],
  ['widget-history', 'Revisions'],
] as const;

export function EditorNav({ summary = false }: { summary?: boolean }) {
  return (
    <nav aria-label="Editor sections" className="flex flex-wrap gap-x-1 gap-y-1 text-sm">
      {(summary ? summarySections : sections).map(([id, label]) => (
        <a
          key={id}
          href={`#${id}`}
          className="rounded-md px-2 py-1 font-semibold text-brand hover:bg-brand-tint"
        >
          {label}
        </a>
      ))}
      <a
        href="#widget-preview"
        className="rounded-md px-2 py-1 font-semibold text-brand hover:bg-brand-tint @4xl:hidden"
      >
        Preview
      </a>
    </nav>
  );
}

/** Every problem of a refused save, each linked to its section; focused when nothing else is. */
export function ErrorSummary({
  errors,
  calc,
  ref,
}: {
  errors: FieldErrors;
  calc: CalculatorDefinition;
  ref: Ref<HTMLDivElement>;
}) {
  const entries = Object.entries(errors);
  if (entries.length === 0) return null;
  return (
    <div
      ref={ref}
      tabIndex={-1}
      role="alert"
      className="rounded-lg border border-bad/40 bg-bad-tint px-5 py-4 text-bad"
    >
      <p className="font-semibold">Fix these before saving:</p>
      <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
        {entries.map(([key, message]) => (
          <li key={key}>
            <a href={`#${sectionOf(key)}`} className="font-semibold underline underline-offset-2">
              {changeLabel(key.replace(/\.\d+$/, ''), calc)}
            </a>
            : {message}
          </li>
        ))}
      </ul>
    </div>
  );
}

export function PreviewPanel({
  widget,
  preview,
  dirty,
}: {
  widget: Widget;
  preview: EmbedWidget;
  dirty: boolean;
}) {
  return (
    <aside
      id="widget-preview"
      aria-label="Live preview"
      className="scroll-mt-6 space-y-3 @4xl:sticky @4xl:top-4 @4xl:max-h-[calc(100vh-7rem)] @4xl:overflow-y-auto"
    >
      <Card className="space-y-3 p-4">
        <div className="space-y-1">
          <h2 id="widget-preview-title" className="text-lg font-bold tracking-tight">
            Live preview
          </h2>
          <p className="text-sm text-ink-soft">
            The real widget, release {widget.release}, showing{' '}
            {dirty ? 'your unsaved settings' : 'the saved settings'}. Runs here are not counted and the
            request form sends nothing.
          </p>
        </div>
        <WidgetPreview
          widget={preview}
          integrity={widget.embed.integrity}
          labelledBy="widget-preview-title"
        />
      </Card>
    </aside>
  );
}

/** The bar that stays in view: where the draft stands, discard, save, and the leave-anyway question. */
export function SaveBar({
  blocker,
  outcome,
  dirty,
  saving,
  saveError,
  onSave,
  onDiscard,
}: {
  blocker: Blocker;
  outcome: SaveOutcome | null;
  dirty: boolean;
  saving: boolean;
  saveError: unknown;
  onSave: () => void;
  onDiscard: () => void;
}) {
  return (
    <div className="sticky bottom-0 z-10 -mx-4 border-t border-line bg-card/95 px-4 py-3 backdrop-blur sm:-mx-6 sm:px-6 md:mx-0 md:rounded-t-lg md:border-x">
      {blocker.state === 'blocked' ? (
        // In the bar that is always in view, wherever the page was scrolled to.
        <div role="alert" className="flex flex-wrap items-center justify-between gap-3">
          <span className="text-sm font-semibold text-warn">
            This widget has unsaved changes. Leave without saving them?
          </span>
          <span className="flex gap-2">
            <Button size="sm" tone="danger" onClick={() => blocker.proceed()}>
              Leave without saving
            </Button>
            <Button size="sm" autoFocus onClick={() => blocker.reset()}>
              Stay here
            </Button>
          </span>
        </div>
      ) : (
        <div className="flex flex-wrap items-center justify-between gap-3">
          <div
            role="status"
            aria-live="polite"
            className="min-w-0 text-sm"
            data-save-state={outcome?.tone ?? (dirty ? 'dirty' : 'clean')}
          >
            {outcome ? (
              <>
                <span className={`font-semibold ${outcome.tone === 'ok' ? 'text-ok' : 'text-bad'}`}>
                  {outcome.text}
                </span>
                {outcome.tone === 'bad' ? <UpgradeHint error={saveError} /> : null}
              </>
            ) : dirty ? (
              <span className="font-semibold text-warn">Unsaved changes</span>
            ) : (
              <span className="text-ink-soft">Everything is saved.</span>
            )}
          </div>
          <div className="flex flex-wrap items-center gap-2">
            {dirty ? (
              <ConfirmAction
                label="Discard changes"
                question="Discard every unsaved change?"
                confirmLabel="Discard"
                busy={false}
                onConfirm={onDiscard}
              />
            ) : null}
            <Button tone="primary" busy={saving} disabled={!dirty} onClick={onSave}>
              Save changes
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
