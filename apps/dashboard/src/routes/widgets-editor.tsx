import { useEffect, useRef, useState, type KeyboardEvent, type ReactNode } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useBlocker, useParams, useSearchParams } from 'react-router';
import { getCalculator, type CalculatorDefinition } from '@wickstone/calc-core';
import { can, type Widget } from '@wickstone/contracts';
import { ApiError } from '../lib/api';
import {
  editingSections,
  firstErrorKey,
  readingSections,
  sectionFromParam,
  sectionOfKey,
  sectionState,
  type EditorSectionId,
  type EditorSectionInfo,
} from '../lib/editor-sections';
import { formatDateTime } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { useWidgetEditor } from '../lib/use-widget-editor';
import { orgPath } from '../nav';
import { widgetQuery } from '../queries/widgets';
import { ErrorState, LoadingState } from '../components/states';
import { Notice, TextLink } from '../components/ui';
import {
  ErrorSummary,
  PreviewPanel,
  SaveBar,
  SectionContents,
  SectionSteps,
  SectionTitleBlock,
} from '../components/widget-editor-parts';
import {
  CautionsSection,
  SheetSection,
  StatusSection,
  UnitsSection,
} from '../components/widget-editor-sections';
import type { SectionProps } from '../components/widget-fields';
import { EmbedCodeSection } from '../components/widget-embed';
import { ReleaseSection } from '../components/widget-release';
import { HistorySection } from '../components/widget-history';
import { InputsSection } from '../components/widget-inputs';
import { LeadFormSection } from '../components/widget-lead-form';
import { LookSection } from '../components/widget-look';
import { SitesSection } from '../components/widget-sites';
import { StatusBadge } from '../components/widget-status';
import { WidgetSummary } from '../components/widget-summary';

/** Asks before leaving with unsaved changes: in the page for a link (no browser dialog), by the browser for a reload. */
function useLeaveGuard(dirty: boolean) {
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname,
  );
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);
  return blocker;
}

/** Where focus goes once a section is shown: its title block, or the field an error names. */
interface FocusTarget {
  section: EditorSectionId;
  key?: string;
}

/** The control an error is about: the invalid one whose own message is that error's, else the first invalid one. */
function fieldFor(root: HTMLElement, message: string | undefined): HTMLElement | null {
  const invalid = [...root.querySelectorAll<HTMLElement>('[aria-invalid="true"]')];
  const named = invalid.find((el) =>
    (el.getAttribute('aria-describedby') ?? '')
      .split(' ')
      .some((id) => id && message && document.getElementById(id)?.textContent?.includes(message)),
  );
  return named ?? invalid[0] ?? null;
}

export function Editor({
  widget,
  calc,
  editable,
}: {
  widget: Widget;
  calc: CalculatorDefinition;
  editable: boolean;
}) {
  const { orgId, role } = useOrg();
  const [params, setParams] = useSearchParams();
  const sections = editable ? editingSections : readingSections;
  const current = sectionFromParam(params.get('section'), sections);
  const summaryRef = useRef<HTMLDivElement>(null);
  const formRef = useRef<HTMLDivElement>(null);
  const blockRef = useRef<HTMLDivElement>(null);
  const [focusTarget, setFocusTarget] = useState<FocusTarget | null>(null);
  // Sections opened in this visit: left with nothing to fix, they count as done.
  const [seen, setSeen] = useState<ReadonlySet<EditorSectionId>>(() => new Set());
  if (!seen.has(current.id)) setSeen(new Set([...seen, current.id]));

  /** A refused save opens the section of the earliest field named and puts focus on that field. */
  const onProblem = (keys: string[]) => {
    const key = firstErrorKey(keys);
    if (key === undefined) return;
    const section = sectionOfKey(key);
    if (section !== current.id) setParams({ section });
    setFocusTarget({ section, key });
  };
  const editor = useWidgetEditor(widget, calc, editable, onProblem);
  const blocker = useLeaveGuard(editor.dirty);

  useEffect(() => {
    if (!focusTarget || focusTarget.section !== current.id) return;
    const frame = requestAnimationFrame(() => {
      const root = formRef.current;
      const target =
        focusTarget.key !== undefined && root
          ? (fieldFor(root, editor.errors[focusTarget.key]) ?? summaryRef.current)
          : blockRef.current;
      target?.focus();
      setFocusTarget(null);
    });
    return () => cancelAnimationFrame(frame);
  }, [focusTarget, current.id, editor.errors]);

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 's') {
      e.preventDefault();
      editor.save();
    }
  };

  const props: SectionProps = {
    draft: editor.draft,
    onChange: editor.onChange,
    errors: editor.errors,
    readOnly: !editable,
    calc,
  };
  const stateOf = (s: EditorSectionInfo) =>
    sectionState(s, {
      draft: editor.draft,
      saved: editor.saved,
      errors: editor.errors,
      seen,
      current: current.id,
    });
  const open = (section: EditorSectionId) => setFocusTarget({ section });

  // Each section's component, mounted only while it is the one shown.
  const render: Record<EditorSectionId, () => ReactNode> = {
    name: () => <StatusSection {...props} />,
    inputs: () => <InputsSection {...props} />,
    units: () => <UnitsSection {...props} />,
    look: () => <LookSection {...props} fallbackColors={editor.fallbackColors} />,
    cautions: () => <CautionsSection {...props} />,
    requests: () => <LeadFormSection {...props} />,
    sheet: () => <SheetSection {...props} />,
    sites: () => <SitesSection {...props} />,
    settings: () => <WidgetSummary widget={widget} calc={calc} />,
    embed: () => <EmbedCodeSection widget={widget} dirty={editor.dirty} />,
    release: () => <ReleaseSection orgId={orgId} widget={widget} role={role} />,
    revisions: () => (
      <HistorySection
        orgId={orgId}
        widgetId={widget.id}
        calc={calc}
        system={widget.settings.units.system}
        restore={
          editable
            ? {
                allowed: !editor.dirty,
                onRestored: (w, n) =>
                  editor.adopt(
                    w,
                    `Revision ${n} restored at ${formatDateTime(w.updatedAt)}, as a new revision.`,
                  ),
              }
            : undefined
        }
      />
    ),
  };

  return (
    <div className="space-y-5" onKeyDown={onKeyDown}>
      {!editable ? (
        <Notice>
          What this widget is set to, and its embed code to copy. Owners and admins change widgets.
        </Notice>
      ) : null}
      <div className="@container space-y-5">
        <SectionContents sections={sections} current={current.id} stateOf={stateOf} onOpen={open} />
        <div className="grid items-start gap-6 @4xl:grid-cols-[minmax(0,1fr)_26rem]">
          <div
            ref={formRef}
            className="min-w-0 space-y-4"
            data-widget-editor
            data-editor-section={current.id}
          >
            {editor.attempted ? (
              <ErrorSummary
                ref={summaryRef}
                errors={editor.errors}
                calc={calc}
                onJump={(key) => setFocusTarget({ section: sectionOfKey(key), key })}
              />
            ) : null}
            <SectionTitleBlock
              ref={blockRef}
              sections={sections}
              current={current}
              state={stateOf(current)}
            />
            {render[current.id]()}
            <SectionSteps sections={sections} current={current} onOpen={open} />
          </div>
          <PreviewPanel widget={widget} preview={editor.preview} dirty={editor.dirty} />
        </div>
      </div>
      {editable ? (
        <SaveBar
          blocker={blocker}
          outcome={editor.outcome}
          dirty={editor.dirty}
          saving={editor.saving}
          saveError={editor.saveError}
          onSave={editor.save}
          onDiscard={editor.discard}
        />
      ) : null}
    </div>
  );
}

export function WidgetEditorPage() {
  const { orgId, role } = useOrg();
  const widgetId = Number(useParams().widgetId);
  const valid = Number.isInteger(widgetId) && widgetId > 0;
  const widget = useQuery({ ...widgetQuery(orgId, widgetId), enabled: valid });
  usePageTitle(widget.data?.name ?? 'Widget');
  const calc = widget.data ? getCalculator(widget.data.calculatorId) : undefined;

  let body;
  if (!valid)
    body = (
      <ErrorState
        title="There is no widget at this address"
        error={new ApiError(404, { code: 'not_found', message: 'Widget not found', details: null })}
      />
    );
  else if (widget.isPending) body = <LoadingState label="Loading the widget…" />;
  else if (widget.isError)
    body = (
      <ErrorState
        title="The widget could not be loaded"
        error={widget.error}
        onRetry={() => void widget.refetch()}
      />
    );
  else if (!calc)
    body = (
      <Notice tone="bad">
        This widget uses the calculator &ldquo;{widget.data.calculatorId}&rdquo;, which this dashboard does
        not know. Reload the page; if it stays, the dashboard is older than the server.
      </Notice>
    );
  else
    body = (
      <Editor key={widget.data.id} widget={widget.data} calc={calc} editable={can(role, 'widgets:write')} />
    );

  return (
    <section className="space-y-5">
      <p className="text-sm">
        <TextLink to={orgPath(orgId, 'widgets')}>← All widgets</TextLink>
      </p>
      <div className="flex flex-wrap items-end justify-between gap-3 border-b border-line pb-5">
        <div className="min-w-0 space-y-1">
          <h1 className="text-2xl font-bold tracking-tight">{widget.data?.name ?? 'Widget'}</h1>
          {calc ? <p className="text-ink-soft">{calc.title}</p> : null}
        </div>
        {widget.data ? <StatusBadge status={widget.data.status} prefix="Saved status: " /> : null}
      </div>
      {body}
    </section>
  );
}
