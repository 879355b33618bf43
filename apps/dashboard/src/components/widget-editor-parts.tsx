import { useState, type Ref } from 'react';
import { Link, type Blocker } from 'react-router';
import { UpgradeHint } from './upgrade-hint';
import type { CalculatorDefinition } from '@wickstone/calc-core';
import type { EmbedWidget, Widget } from '@wickstone/contracts';
import {
  sectionOfKey,
  sectionStateLabel,
  type EditorSectionId,
  type EditorSectionInfo,
  type SectionState,
} from '../lib/editor-sections';
import type { FieldErrors } from '../lib/form';
import type { SaveOutcome } from '../lib/use-widget-editor';
import { ConfirmAction } from './confirm';
import { Button, Card, ContentsToggle, NumberBadge } from './ui';
import { changeLabel } from './widget-history';
import { WidgetPreview } from './widget-preview';

/* The widget editor's frame: its contents, the section's title block and steps, the error summary, the preview and the save bar. */

const stateMark: Record<SectionState, string> = { errors: '!', changed: '●', here: '▸', done: '✓', open: '' };
const stateTone: Record<SectionState, string> = {
  errors: 'text-bad',
  changed: 'text-warn',
  here: 'text-ink',
  done: 'text-ok',
  open: 'text-ink-soft',
};

const number = (i: number) => String(i + 1).padStart(2, '0');
const sectionLink = (id: EditorSectionId) => ({ search: `?section=${id}` });

/**
 * The editor's contents: a ruled register of its sections, numbered like the sheets of a report,
 * each with where it stands. On a phone it folds behind one button naming the section shown.
 */
export function SectionContents({
  sections,
  current,
  stateOf,
  onOpen,
}: {
  sections: readonly EditorSectionInfo[];
  current: EditorSectionId;
  stateOf: (s: EditorSectionInfo) => SectionState;
  onOpen: (id: EditorSectionId) => void;
}) {
  const [open, setOpen] = useState(false);
  const at = sections.findIndex((s) => s.id === current);
  return (
    <nav aria-label="Editor sections" className="border-t-2 border-ink bg-card" data-editor-contents>
      <ContentsToggle
        open={open}
        onToggle={() => setOpen((o) => !o)}
        controls="editor-contents"
        kicker={`Sections · ${number(at)} of ${sections.length}`}
        here={sections[at]?.label ?? ''}
        className="border-b border-line px-3 py-2 @3xl:hidden"
      />
      <ol
        id="editor-contents"
        className={`${open ? 'grid' : 'hidden'} border-l border-line @3xl:grid ${
          sections.length <= 4 ? '@3xl:grid-cols-4' : '@3xl:grid-cols-3 @5xl:grid-cols-4'
        }`}
      >
        {sections.map((s, i) => {
          const state = stateOf(s);
          const here = s.id === current;
          return (
            <li key={s.id} className="border-r border-b border-line">
              <Link
                to={sectionLink(s.id)}
                aria-current={here ? 'step' : undefined}
                data-section-link={s.id}
                data-section-state={state}
                onClick={() => {
                  setOpen(false);
                  onOpen(s.id);
                }}
                className={`flex h-full items-center gap-3 px-3 py-2 text-sm ${
                  here
                    ? 'bg-brand-tint font-bold text-ink'
                    : 'font-semibold text-ink-soft hover:bg-paper-deep hover:text-ink'
                }`}
              >
                <NumberBadge n={i + 1} current={here} />
                <span className="min-w-0">
                  <span className="block">{s.label}</span>
                  {s.edits ? (
                    <span className={`block text-xs font-semibold ${stateTone[state]}`}>
                      <span aria-hidden="true">{stateMark[state]} </span>
                      {sectionStateLabel[state]}
                    </span>
                  ) : null}
                </span>
              </Link>
            </li>
          );
        })}
      </ol>
    </nav>
  );
}

const cell = 'flex min-w-0 flex-col justify-center px-3 py-1.5';
const cellLabel = 'text-xs font-semibold tracking-wider text-ink-soft uppercase';

/** The title block above the section shown: which sheet of how many, and where it stands. */
export function SectionTitleBlock({
  sections,
  current,
  state,
  ref,
}: {
  sections: readonly EditorSectionInfo[];
  current: EditorSectionInfo;
  state: SectionState;
  ref: Ref<HTMLDivElement>;
}) {
  const at = sections.indexOf(current);
  return (
    <div
      ref={ref}
      tabIndex={-1}
      aria-label={`Section ${at + 1} of ${sections.length}: ${current.label}`}
      className="flex flex-wrap items-stretch border border-line bg-card"
      data-section-title-block={current.id}
    >
      <dl className="flex min-w-0 flex-1">
        <div className={`${cell} flex-none border-r border-line`}>
          <dt className={cellLabel}>Section</dt>
          <dd className="font-bold tabular-nums">
            {number(at)} <span className="font-semibold text-ink-soft">of {sections.length}</span>
          </dd>
        </div>
        {current.edits ? (
          <div className={`${cell} flex-1`}>
            <dt className={cellLabel}>State</dt>
            <dd className={`font-semibold ${stateTone[state]}`} data-current-state={state}>
              {sectionStateLabel[state]}
            </dd>
          </div>
        ) : (
          <div className={`${cell} flex-1`}>
            <dt className={cellLabel}>Saving</dt>
            <dd className="font-semibold">{current.saving}</dd>
          </div>
        )}
      </dl>
      <a
        href="#widget-preview"
        className="flex items-center border-l border-line px-3 text-sm font-semibold text-brand underline decoration-brand/30 underline-offset-4 @4xl:hidden"
      >
        Preview ↓
      </a>
    </div>
  );
}

/** Previous and next, each naming the section it opens. */
export function SectionSteps({
  sections,
  current,
  onOpen,
}: {
  sections: readonly EditorSectionInfo[];
  current: EditorSectionInfo;
  onOpen: (id: EditorSectionId) => void;
}) {
  const at = sections.indexOf(current);
  const prev = sections[at - 1];
  const next = sections[at + 1];
  const step = 'flex min-w-0 flex-col px-3 py-2 text-sm hover:bg-paper-deep';
  return (
    <nav aria-label="Previous and next section" className="grid grid-cols-2 border border-line bg-card">
      {prev ? (
        <Link to={sectionLink(prev.id)} onClick={() => onOpen(prev.id)} className={step} rel="prev">
          <span className={cellLabel}>← Previous</span>
          <span className="font-semibold text-brand">
            {number(at - 1)} {prev.label}
          </span>
        </Link>
      ) : (
        <span />
      )}
      {next ? (
        <Link
          to={sectionLink(next.id)}
          onClick={() => onOpen(next.id)}
          className={`${step} border-l border-line text-right`}
          rel="next"
        >
          <span className={cellLabel}>Next →</span>
          <span className="font-semibold text-brand">
            {number(at + 1)} {next.label}
          </span>
        </Link>
      ) : (
        <span className="border-l border-line" />
      )}
    </nav>
  );
}

/** Every problem of a refused save, each linked to its section and field; focused when nothing else is. */
export function ErrorSummary({
  errors,
  calc,
  ref,
  onJump,
}: {
  errors: FieldErrors;
  calc: CalculatorDefinition;
  ref: Ref<HTMLDivElement>;
  /** Opens the key's section and moves focus to its field. */
  onJump: (key: string) => void;
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
            <Link
              to={sectionLink(sectionOfKey(key))}
              onClick={() => onJump(key)}
              className="font-semibold underline underline-offset-2"
            >
              {changeLabel(key.replace(/\.\d+$/, ''), calc)}
            </Link>
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
