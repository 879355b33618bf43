import { useState } from 'react';
import { can, MAX_KEY_OVERLAP_DAYS, type Role, type Widget } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { formatDateTime } from '../lib/labels';
import { useEndKeyOverlap, useRotateKey } from '../queries/embed-access';
import { describeError } from './states';
import { ConfirmAction } from './confirm';
import { TextField } from './form';
import { LiveMessage, Notice } from './ui';

const DAY = 86_400_000;
const isoDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const utcDay = new Intl.DateTimeFormat('en-GB', { dateStyle: 'medium', timeZone: 'UTC' });

/** When a replaced key stops: a day chosen in the date field ends at the next UTC midnight, so say "through" that day. */
function servedThrough(iso: string): string {
  const ms = Date.parse(iso);
  return ms % DAY === 0 ? `through ${utcDay.format(ms - 1)} (UTC)` : `until ${formatDateTime(iso)}`;
}

/**
 * The widget's key and its replacement. A new key goes into the embed code at once; the replaced
 * one keeps being served until the chosen day, so the firm has time to update its pages, and is
 * then refused with a message saying it was replaced.
 */
export function KeysPanel({ orgId, widget, role }: { orgId: number; widget: Widget; role: Role }) {
  const mayRotate = can(role, 'embed:manage');
  const rotate = useRotateKey(orgId, widget.id);
  const endOverlap = useEndKeyOverlap(orgId, widget.id);
  // The day the panel opened: the date field's limits (a re-render must not move them).
  const [today] = useState(() => Date.now());
  const [until, setUntil] = useState(() => isoDay(today + 14 * DAY));
  const previous = widget.previousKey;
  const fieldError = isApiError(rotate.error)
    ? rotate.error.fields.find((f) => f.field === 'body.oldKeyValidUntil')?.message
    : undefined;
  const otherError = rotate.isError && !fieldError ? describeError(rotate.error) : null;

  return (
    <div className="space-y-3" data-widget-keys>
      <h3 className="font-semibold">Widget key</h3>
      <dl className="grid gap-x-4 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
        <dt className="text-ink-soft">In the embed code</dt>
        <dd>
          <code className="font-mono break-all" data-current-key>
            {widget.publicKey}
          </code>
        </dd>
        {previous ? (
          <>
            <dt className="text-ink-soft">Replaced key</dt>
            <dd data-previous-key={previous.served ? 'served' : 'refused'}>
              <code className="font-mono break-all">{previous.publicKey}</code>{' '}
              <span className="text-ink-soft">
                replaced {formatDateTime(previous.replacedAt)};{' '}
                {previous.served
                  ? `pages still using it are served ${servedThrough(previous.validUntil)}`
                  : `refused since ${formatDateTime(previous.validUntil)}`}
              </span>
            </dd>
          </>
        ) : null}
      </dl>
      <LiveMessage
        message={
          endOverlap.isSuccess && !previous?.served
            ? `${endOverlap.data.previousKey?.publicKey ?? 'The replaced key'} is refused from now on.`
            : null
        }
      />
      {!mayRotate ? (
        <Notice>Developers, owners and admins replace a widget&rsquo;s key.</Notice>
      ) : previous?.served ? (
        <div className="space-y-2" data-end-overlap>
          <p className="text-sm text-ink-soft">
            The key can be replaced again once the replaced key&rsquo;s time is over. If the replaced key was
            leaked, or every page already carries the new code, stop serving it now.
          </p>
          <ConfirmAction
            label="Stop serving the replaced key now"
            question={`Pages still carrying ${previous.publicKey} show no widget from this moment. Stop serving it?`}
            confirmLabel="Stop it now"
            busy={endOverlap.isPending}
            onConfirm={() => endOverlap.mutate()}
          />
          <LiveMessage
            message={
              endOverlap.isError
                ? `The replaced key is still served: ${describeError(endOverlap.error)}`
                : null
            }
            tone="bad"
          />
        </div>
      ) : (
        <div className="space-y-2">
          {widget.nextKeyKind === 'older' ? (
            <Notice>
              Release {widget.release}&rsquo;s loader reads only the older kind of key, so the new key will be
              one of those. From release 0.3.0 on, keys are reference keys.
            </Notice>
          ) : null}
          <div className="max-w-xs">
            <TextField
              label="Keep serving the current key through (UTC)"
              name="oldKeyValidUntil"
              type="date"
              value={until}
              min={isoDay(today)}
              max={isoDay(today + (MAX_KEY_OVERLAP_DAYS - 1) * DAY)}
              onChange={(e) => setUntil(e.target.value)}
              error={fieldError}
              hint={`Up to ${MAX_KEY_OVERLAP_DAYS} days: time to put the new code on every page.`}
              data-rotation-until
            />
          </div>
          <ConfirmAction
            label="Replace the key"
            question={`Pages with the current code keep working through ${until} (UTC), then show no widget until their code is updated. Replace the key?`}
            confirmLabel="Replace it"
            busy={rotate.isPending}
            onConfirm={() => rotate.mutate({ oldKeyValidUntil: until })}
          />
          <LiveMessage
            message={
              otherError
                ? `The key was not replaced: ${otherError}`
                : rotate.isSuccess
                  ? `New key ${rotate.data.publicKey}: the embed code now carries it.`
                  : null
            }
            tone={otherError ? 'bad' : 'ok'}
          />
        </div>
      )}
    </div>
  );
}
