import { useId, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { can, type Role, type UpgradePreview, type Widget } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { formatDate, formatDateTime } from '../lib/labels';
import { orgPath } from '../nav';
import { refusedOriginsQuery, releasesQuery, upgradePreviewQuery, usePinRelease } from '../queries/releases';
import { EmptyState, ErrorState, LoadingState } from './states';
import { Button, LiveMessage, Notice, TextLink } from './ui';
import { EditorSection } from './widget-fields';
import { AllowedOriginsPanel } from './widget-sites';
import { KeysPanel } from './widget-keys';
import { useSetOrigins } from '../queries/embed-access';

const percent = (x: number | null) =>
  x === null ? 'no figure to compare' : `${(x * 100).toPrecision(x < 0.001 ? 1 : 3)} %`;

function PreviewResult({ orgId, preview }: { orgId: number; preview: UpgradePreview }) {
  if (preview.runs === 0)
    return (
      <EmptyState title="No logged runs to re-run">
        This widget has no stored runs yet, so there is nothing an upgrade could change.
      </EmptyState>
    );
  return (
    <div className="space-y-3" data-upgrade-preview>
      <p className="text-sm">
        <strong>{preview.runsChanged.toLocaleString('en-GB')}</strong> of{' '}
        {preview.runs.toLocaleString('en-GB')} logged runs would read differently on {preview.to.version}{' '}
        (engine {preview.to.engineVersion}) than on {preview.from.version}.
        {preview.refused ? ` ${preview.refused} would be refused by the new engine.` : ''}{' '}
        <span className="text-ink-soft">Engine time {preview.engineMs} ms.</span>
      </p>
      {preview.outputs.length ? (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Changes per result</caption>
          <thead className="text-ink-soft">
            <tr>
              <th className="py-1 pr-3 font-semibold">Result</th>
              <th className="py-1 pr-3 font-semibold">Runs changed</th>
              <th className="py-1 font-semibold">Largest change</th>
            </tr>
          </thead>
          <tbody>
            {preview.outputs.map((o) => (
              <tr key={o.id} className="border-t border-line">
                <td className="py-1 pr-3">{o.label}</td>
                <td className="py-1 pr-3">{o.runsChanged.toLocaleString('en-GB')}</td>
                <td className="py-1">
                  {percent(o.largestRelativeChange)}
                  {o.withheldNow ? `; now withheld in ${o.withheldNow}` : ''}
                  {o.shownNow ? `; now shown in ${o.shownNow}` : ''}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {preview.warnings.length ? (
        <ul className="list-disc space-y-1 pl-5 text-sm">
          {preview.warnings.map((w) => (
            <li key={w.code}>
              Warning <code className="font-mono">{w.code}</code>: appears in {w.appearsIn}, disappears from{' '}
              {w.disappearsFrom}
            </li>
          ))}
        </ul>
      ) : null}
      {preview.topRuns.length ? (
        <div className="space-y-1">
          <p className="text-sm font-semibold">The runs that change most</p>
          <ul className="space-y-1 text-sm">
            {preview.topRuns.slice(0, 5).map((r) => (
              <li key={r.runId}>
                <TextLink to={orgPath(orgId, `usage/runs/${r.runId}`)}>
                  Run of {formatDateTime(r.createdAt)}
                </TextLink>{' '}
                <span className="text-ink-soft">moves by {percent(r.largestRelativeChange)}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

/**
 * The developer's part of a widget: which release its snippet loads, what moving to another
 * would change over its logged runs, and the sites the embed API refused.
 */
export function ReleaseSection({ orgId, widget, role }: { orgId: number; widget: Widget; role: Role }) {
  const id = useId();
  const mayPin = can(role, 'releases:pin');
  const releases = useQuery(releasesQuery());
  const [candidate, setCandidate] = useState<string | null>(null);
  const [asked, setAsked] = useState<string | null>(null);
  const preview = useQuery({
    ...upgradePreviewQuery(orgId, widget.id, asked ?? ''),
    enabled: mayPin && asked !== null,
  });
  const refused = useQuery({ ...refusedOriginsQuery(orgId, widget.id), enabled: can(role, 'embed:manage') });
  const pin = usePinRelease(orgId, widget.id);
  const allow = useSetOrigins(orgId, widget.id);
  const mayManage = can(role, 'embed:manage');
  const published = releases.data?.items.filter((r) => r.published) ?? [];
  const chosen = candidate ?? published.find((r) => r.version !== widget.release)?.version ?? widget.release;

  return (
    <EditorSection
      id="widget-release"
      title="Release and sites"
      lead="The release decides which engine computes the widget's results. Published releases never change, so a page keeps working whichever one it loads."
    >
      <p className="text-sm">
        Loads release <strong data-widget-release>{widget.release}</strong>
        {widget.releasePin ? (
          <>
            {' '}
            (pinned to <code className="font-mono">{widget.releasePin}</code>)
          </>
        ) : (
          ' (the release it was made with; not pinned)'
        )}
        .
      </p>
      {!mayPin ? (
        <Notice>Owners, admins and developers move a widget to another release.</Notice>
      ) : releases.isPending ? (
        <LoadingState label="Loading the releases…" />
      ) : releases.isError ? (
        <ErrorState
          title="The releases could not be loaded"
          error={releases.error}
          onRetry={() => void releases.refetch()}
        />
      ) : published.length === 0 ? (
        <EmptyState title="No published releases">The server has no published release to pin to.</EmptyState>
      ) : (
        <div className="space-y-3">
          <div className="flex flex-wrap items-end gap-3">
            <label className="space-y-1 text-sm" htmlFor={`${id}-to`}>
              <span className="block font-semibold">Release</span>
              <select
                id={`${id}-to`}
                value={chosen}
                onChange={(e) => setCandidate(e.target.value)}
                className="block rounded-md border border-line-strong bg-paper px-3 py-2"
              >
                {published.map((r) => (
                  <option key={r.version} value={r.version}>
                    {r.version} (engine {r.engineVersion}
                    {r.publishedAt ? `, ${formatDate(r.publishedAt)}` : ''})
                  </option>
                ))}
              </select>
            </label>
            <Button size="sm" onClick={() => setAsked(chosen)} disabled={chosen === widget.release}>
              Preview the change
            </Button>
            <Button
              tone="primary"
              size="sm"
              disabled={chosen === widget.release || pin.isPending}
              onClick={() =>
                pin.mutate(chosen, {
                  // The preview compared with the old release: it says nothing about the new one.
                  onSuccess: () => {
                    setAsked(null);
                    setCandidate(null);
                  },
                })
              }
            >
              Pin to {chosen}
            </Button>
          </div>
          <LiveMessage
            message={
              pin.isError
                ? `The pin was not moved: ${(isApiError(pin.error) && pin.error.fields[0]?.message) || pin.error.message}`
                : pin.isSuccess
                  ? `Pinned to ${pin.data.releasePin}: the embed code now loads ${pin.data.release}.`
                  : null
            }
            tone={pin.isError ? 'bad' : 'ok'}
          />
          {asked === null || asked !== chosen ? null : preview.isPending ? (
            <LoadingState label={`Re-running the logged runs on ${asked}…`} />
          ) : preview.isError ? (
            <ErrorState
              title="The preview could not be made"
              error={preview.error}
              onRetry={() => void preview.refetch()}
            />
          ) : (
            <PreviewResult orgId={orgId} preview={preview.data} />
          )}
          {published
            .filter((r) => r.version === chosen && r.changelog.length)
            .map((r) => (
              <details key={r.version} className="text-sm">
                <summary className="cursor-pointer font-semibold">What {r.version} changed</summary>
                <ul className="mt-2 list-disc space-y-1 pl-5 text-ink-soft">
                  {r.changelog.map((c) => (
                    <li key={c.id}>{c.summary}</li>
                  ))}
                </ul>
              </details>
            ))}
        </div>
      )}
      <div className="space-y-2">
        <h3 className="font-semibold">Sites refused in the last 30 days</h3>
        {!can(role, 'embed:manage') ? (
          <Notice>Owners, admins and developers see the sites the widget refused.</Notice>
        ) : refused.isPending ? (
          <LoadingState label="Loading refused sites…" />
        ) : refused.isError ? (
          <ErrorState
            title="Refused sites could not be loaded"
            error={refused.error}
            onRetry={() => void refused.refetch()}
          />
        ) : refused.data.items.length === 0 ? (
          <p className="text-sm text-ink-soft">No page outside the allowed sites asked for this widget.</p>
        ) : (
          <ul className="space-y-1 text-sm" data-refused-origins>
            {refused.data.items.map((o) => (
              <li key={o.origin} className="flex flex-wrap items-center gap-2">
                <code className="font-mono break-all">{o.origin}</code>{' '}
                <span className="text-ink-soft">
                  refused {o.refusals} {o.refusals === 1 ? 'time' : 'times'}, last on {formatDate(o.lastDay)}
                </span>
                {widget.allowedOrigins.includes(o.origin) ? (
                  <span className="text-ok">allowed now</span>
                ) : mayManage ? (
                  <Button
                    size="sm"
                    disabled={allow.isPending}
                    onClick={() => allow.mutate([...widget.allowedOrigins, o.origin])}
                  >
                    Allow this origin<span className="sr-only"> ({o.origin})</span>
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        )}
        <LiveMessage
          message={
            allow.isError
              ? `The site was not allowed: ${allow.error.message}`
              : allow.isSuccess
                ? 'Allowed: its pages get the widget from now on.'
                : null
          }
          tone={allow.isError ? 'bad' : 'ok'}
        />
      </div>
      <AllowedOriginsPanel orgId={orgId} widget={widget} role={role} />
      <KeysPanel orgId={orgId} widget={widget} role={role} />
    </EditorSection>
  );
}
