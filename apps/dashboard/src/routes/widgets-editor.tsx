import { useEffect, useRef, type KeyboardEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useBlocker, useParams } from 'react-router';
import { getCalculator, type CalculatorDefinition } from '@wickstone/calc-core';
import { can, type Widget } from '@wickstone/contracts';
import { ApiError } from '../lib/api';
import { formatDateTime } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import { useWidgetEditor } from '../lib/use-widget-editor';
import { orgPath } from '../nav';
import { widgetQuery } from '../queries/widgets';
import { ErrorState, LoadingState } from '../components/states';
import { Notice, TextLink } from '../components/ui';
import { EditorNav, ErrorSummary, PreviewPanel, SaveBar } from '../components/widget-editor-parts';
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
  const summaryRef = useRef<HTMLDivElement>(null);
  const formRef = useRef<HTMLDivElement>(null);
  const focusFirstProblem = () =>
    requestAnimationFrame(() => {
      const bad = formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]');
      (bad ?? summaryRef.current)?.focus();
    });
  const editor = useWidgetEditor(widget, calc, editable, focusFirstProblem);
  const blocker = useLeaveGuard(editor.dirty);

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

  return (
    <div className="space-y-5" onKeyDown={onKeyDown}>
      {!editable ? (
        <Notice>
          What this widget is set to, and its embed code to copy. Owners and admins change widgets.
        </Notice>
      ) : null}
      <div className="@container space-y-5">
        <EditorNav summary={!editable} />
        <div className="grid items-start gap-6 @4xl:grid-cols-[minmax(0,1fr)_26rem]">
          <div ref={formRef} className="min-w-0 space-y-5" data-widget-editor>
            {editor.attempted ? <ErrorSummary ref={summaryRef} errors={editor.errors} calc={calc} /> : null}
            {editable ? (
              <>
                <StatusSection {...props} />
                <InputsSection {...props} />
                <UnitsSection {...props} />
                <LookSection {...props} fallbackColors={editor.fallbackColors} />
                <CautionsSection {...props} />
                <LeadFormSection {...props} />
                <SheetSection {...props} />
                <SitesSection {...props} />
              </>
            ) : (
              <WidgetSummary widget={widget} calc={calc} />
            )}
            <EmbedCodeSection widget={widget} dirty={editor.dirty} />
            <ReleaseSection orgId={orgId} widget={widget} role={role} />
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
