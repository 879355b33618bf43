import { useCallback, useEffect, useMemo, useRef, useState, type KeyboardEvent } from 'react';
import { useQuery } from '@tanstack/react-query';
import { useBlocker, useParams } from 'react-router';
import { getCalculator, type CalculatorDefinition } from '@wickstone/calc-core';
import { can, hexColorPattern, widgetStatuses, type Widget, type WidgetStatus } from '@wickstone/contracts';
import { ApiError } from '../lib/api';
import type { FieldErrors } from '../lib/form';
import { formatDateTime } from '../lib/labels';
import { useOrg } from '../lib/org-context';
import { usePageTitle } from '../lib/use-page-title';
import {
  draftBody,
  draftFromWidget,
  isDirty,
  previewWidget,
  serverFieldErrors,
  usableColors,
  validateDraft,
  withUnitSystem,
  type WidgetColors,
  type WidgetDraft,
} from '../lib/widget-draft';
import { orgPath } from '../nav';
import { useUpdateWidget, widgetQuery } from '../queries/widgets';
import { ConfirmAction } from '../components/confirm';
import { TextField } from '../components/form';
import { ErrorState, LoadingState, describeError } from '../components/states';
import { UpgradeHint } from '../components/upgrade-hint';
import { Button, Card, Notice, TextLink } from '../components/ui';
import {
  CheckField,
  ChoiceCards,
  EditorSection,
  TextAreaField,
  type SectionProps,
} from '../components/widget-fields';
import { EmbedCodeSection } from '../components/widget-embed';
import { changeLabel, HistorySection } from '../components/widget-history';
import { InputsSection } from '../components/widget-inputs';
import { LeadFormSection } from '../components/widget-lead-form';
import { LookSection } from '../components/widget-look';
import { WidgetPreview } from '../components/widget-preview';
import { SitesSection } from '../components/widget-sites';
import { StatusBadge, statusLabel } from '../components/widget-status';

const statusDetail: Record<WidgetStatus, string> = {
  draft: 'Not shown anywhere yet; the embed code places nothing.',
  live: 'Shown on the sites listed under Sites. Needs at least one site.',
  paused: 'Taken off every site for now; nothing else changes.',
};

const sections = [
  ['widget-status', 'Name and status'],
  ['widget-inputs', 'Inputs'],
  ['widget-units', 'Units'],
  ['widget-look', 'Look'],
  ['widget-cautions', 'Cautions'],
  ['widget-lead-form', 'Request form'],
  ['widget-sites', 'Sites'],
  ['widget-embed', 'Embed code'],
  ['widget-history', 'History'],
] as const;

/** The section an error key belongs to, for the summary's links. */
function sectionOf(key: string): string {
  if (key.startsWith('allowedOrigins')) return 'widget-sites';
  if (key.startsWith('settings.inputs')) return 'widget-inputs';
  if (key.startsWith('settings.units')) return 'widget-units';
  if (key.startsWith('settings.look')) return 'widget-look';
  if (key.startsWith('settings.cautions')) return 'widget-cautions';
  if (key.startsWith('settings.leadForm')) return 'widget-lead-form';
  return 'widget-status';
}

function StatusSection({ draft, onChange, errors, readOnly }: SectionProps) {
  return (
    <EditorSection id="widget-status" title="Name and status">
      <TextField
        label="Name"
        name="name"
        value={draft.name}
        disabled={readOnly}
        autoComplete="off"
        error={errors.name}
        hint="Shown above the calculator's title in the widget, and in your lists."
        onChange={(e) => {
          const name = e.target.value;
          onChange((d) => ({ ...d, name }));
        }}
      />
      <ChoiceCards
        legend="Status"
        name="widget-status"
        value={draft.status}
        disabled={readOnly}
        error={errors.status}
        onChange={(status) => onChange((d) => ({ ...d, status }))}
        options={widgetStatuses.map((s) => ({ value: s, label: statusLabel[s], detail: statusDetail[s] }))}
      />
    </EditorSection>
  );
}

function UnitsSection({ draft, onChange, errors, readOnly, calc }: SectionProps) {
  const units = draft.settings.units;
  return (
    <EditorSection
      id="widget-units"
      title="Units"
      lead="The units the widget opens in. Defaults above are typed in these units and stored in SI."
    >
      <ChoiceCards
        legend="Unit system"
        name="widget-unit-system"
        value={units.system}
        disabled={readOnly}
        columns="@md:grid-cols-2"
        error={errors['settings.units.system']}
        onChange={(system) => onChange((d) => withUnitSystem(d, calc, system))}
        options={[
          { value: 'si', label: 'Metric (SI)', detail: 'mm, °C, mN/m, kPa' },
          { value: 'us', label: 'US customary', detail: 'in, °F, dyn/cm, psi' },
        ]}
      />
      <CheckField
        label="Visitors may switch units"
        detail="Shows a Metric / US switch in the widget's header."
        checked={units.visitorMaySwitch}
        disabled={readOnly}
        onChange={(visitorMaySwitch) =>
          onChange((d) => ({
            ...d,
            settings: { ...d.settings, units: { ...d.settings.units, visitorMaySwitch } },
          }))
        }
      />
    </EditorSection>
  );
}

function CautionsSection({ draft, onChange, errors, readOnly, calc }: SectionProps) {
  return (
    <EditorSection
      id="widget-cautions"
      title="Cautions"
      lead="Shown under every result. The calculator's own cautions always appear; yours are added after them."
    >
      <div className="grid gap-5 @3xl:grid-cols-2">
        <TextAreaField
          label="The firm's own cautions"
          rows={6}
          value={draft.settings.cautions}
          disabled={readOnly}
          maxLength={2000}
          error={errors['settings.cautions']}
          hint={`Plain text, up to 2000 characters (${draft.settings.cautions.length} so far). A blank line starts a new caution.`}
          onChange={(e) => {
            const cautions = e.target.value;
            onChange((d) => ({ ...d, settings: { ...d.settings, cautions } }));
          }}
        />
        <div className="space-y-2">
          <h3 className="text-sm font-semibold">Built into the calculator (always shown)</h3>
          <ul className="space-y-2" aria-label="The calculator's built-in cautions">
            {calc.cautions.map((c) => (
              <li
                key={c.code}
                data-builtin-caution={c.code}
                className="rounded-md border border-line bg-paper px-3 py-2 text-sm text-ink-soft"
              >
                {c.text}
              </li>
            ))}
          </ul>
        </div>
      </div>
    </EditorSection>
  );
}

/** A server error stays beside its field until the value it was about changes. */
interface ServerError {
  message: string;
  was: string;
}

function valueAt(body: unknown, key: string): string {
  let v: unknown = body;
  for (const part of key.split('.')) {
    v = typeof v === 'object' && v !== null ? (v as Record<string, unknown>)[part] : undefined;
  }
  return JSON.stringify(v ?? null);
}

function Editor({
  widget,
  calc,
  editable,
}: {
  widget: Widget;
  calc: CalculatorDefinition;
  editable: boolean;
}) {
  const { orgId } = useOrg();
  const update = useUpdateWidget(orgId, widget.id);
  const saved = useMemo(() => draftFromWidget(widget, calc), [widget, calc]);
  const [edited, setDraft] = useState<WidgetDraft>(saved);
  // Readers always see what is saved now; an editor keeps their own draft until it is saved.
  const draft = editable ? edited : saved;
  const [attempted, setAttempted] = useState(false);
  const [serverErrors, setServerErrors] = useState<Record<string, ServerError>>({});
  const [outcome, setOutcome] = useState<{ tone: 'ok' | 'bad'; text: string } | null>(null);
  const summaryRef = useRef<HTMLDivElement>(null);
  const formRef = useRef<HTMLDivElement>(null);
  const lastColors = useRef<WidgetColors>(widget.settings.look.colors);

  const dirty = editable && isDirty(draft, saved);
  const checked = useMemo(() => validateDraft(draft, calc), [draft, calc]);
  const body = useMemo(() => draftBody(draft), [draft]);
  const errors: FieldErrors = useMemo(() => {
    const shown: FieldErrors = attempted && checked.errors ? { ...checked.errors } : {};
    for (const [key, e] of Object.entries(serverErrors)) {
      if (valueAt(body, key) === e.was) shown[key] ??= e.message;
    }
    return shown;
  }, [attempted, checked, serverErrors, body]);

  const colors = draft.settings.look.colors;
  if (Object.values(colors).every((c) => hexColorPattern.test(c))) lastColors.current = colors;
  const fallbackColors = lastColors.current;
  const preview = useMemo(
    () => previewWidget(widget, draft, usableColors(colors, fallbackColors)),
    [widget, draft, colors, fallbackColors],
  );

  const onChange = useCallback((change: (d: WidgetDraft) => WidgetDraft) => {
    setDraft((d) => change(d));
    setOutcome((o) => (o?.tone === 'ok' ? null : o));
  }, []);

  const focusFirstProblem = () =>
    requestAnimationFrame(() => {
      const bad = formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]');
      (bad ?? summaryRef.current)?.focus();
    });

  const save = () => {
    if (!editable || update.isPending) return;
    setAttempted(true);
    if (!checked.body) {
      const n = Object.keys(checked.errors).length;
      setOutcome({
        tone: 'bad',
        text: `Not saved: ${n === 1 ? 'one setting needs' : `${n} settings need`} attention.`,
      });
      focusFirstProblem();
      return;
    }
    const sent = body;
    update.mutate(checked.body, {
      onSuccess: (next) => {
        setDraft(draftFromWidget(next, calc));
        setAttempted(false);
        setServerErrors({});
        setOutcome({
          tone: 'ok',
          text: `Saved at ${formatDateTime(next.updatedAt)}. The change is kept in the history.`,
        });
      },
      onError: (error) => {
        // The draft is left exactly as it was: only the messages change.
        const fields = error instanceof ApiError ? serverFieldErrors(error.fields) : {};
        const kept: Record<string, ServerError> = {};
        for (const [key, message] of Object.entries(fields)) kept[key] = { message, was: valueAt(sent, key) };
        setServerErrors(kept);
        const n = Object.keys(fields).length;
        setOutcome({
          tone: 'bad',
          text:
            n > 0
              ? `Not saved: the server refused ${n === 1 ? 'one setting' : `${n} settings`}. Your changes are still here.`
              : `Not saved: ${describeError(error)} Your changes are still here; try again.`,
        });
        if (n > 0) focusFirstProblem();
      },
    });
  };

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 's') {
      e.preventDefault();
      save();
    }
  };

  // Leaving with unsaved changes: asked in the page (no browser dialog) or, for a reload, by the browser.
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) => dirty && currentLocation.pathname !== nextLocation.pathname,
  );
  useEffect(() => {
    if (!dirty) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const props: SectionProps = { draft, onChange, errors, readOnly: !editable, calc };
  const errorEntries = Object.entries(errors);

  return (
    <div className="space-y-5" onKeyDown={onKeyDown}>
      {!editable ? (
        <Notice>You can read every setting and copy the embed code. Owners and admins change widgets.</Notice>
      ) : null}
      <div className="@container space-y-5">
        <nav aria-label="Editor sections" className="flex flex-wrap gap-x-1 gap-y-1 text-sm">
          {sections.map(([id, label]) => (
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

        <div className="grid items-start gap-6 @4xl:grid-cols-[minmax(0,1fr)_26rem]">
          <div ref={formRef} className="min-w-0 space-y-5" data-widget-editor>
            {attempted && errorEntries.length > 0 ? (
              <div
                ref={summaryRef}
                tabIndex={-1}
                role="alert"
                className="rounded-lg border border-bad/40 bg-bad-tint px-5 py-4 text-bad"
              >
                <p className="font-semibold">Fix these before saving:</p>
                <ul className="mt-2 list-disc space-y-1 pl-5 text-sm">
                  {errorEntries.map(([key, message]) => (
                    <li key={key}>
                      <a href={`#${sectionOf(key)}`} className="font-semibold underline underline-offset-2">
                        {changeLabel(key.replace(/\.\d+$/, ''), calc)}
                      </a>
                      : {message}
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
            <StatusSection {...props} />
            <InputsSection {...props} />
            <UnitsSection {...props} />
            <LookSection {...props} fallbackColors={fallbackColors} />
            <CautionsSection {...props} />
            <LeadFormSection {...props} />
            <SitesSection {...props} />
            <EmbedCodeSection widget={widget} dirty={dirty} />
            <HistorySection
              orgId={orgId}
              widgetId={widget.id}
              calc={calc}
              system={widget.settings.units.system}
            />
          </div>
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
        </div>
      </div>

      {editable ? (
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
                    {outcome.tone === 'bad' ? <UpgradeHint error={update.error} /> : null}
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
                    onConfirm={() => {
                      setDraft(saved);
                      setAttempted(false);
                      setServerErrors({});
                      setOutcome(null);
                    }}
                  />
                ) : null}
                <Button tone="primary" busy={update.isPending} disabled={!dirty} onClick={save}>
                  Save changes
                </Button>
              </div>
            </div>
          )}
        </div>
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
