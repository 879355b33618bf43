import { widgetStatusWords, type WidgetStatus } from '@wickstone/contracts';
import { Badge } from './ui';

export const statusLabel = widgetStatusWords;

const statusTone: Record<WidgetStatus, 'neutral' | 'brand' | 'warn'> = {
  draft: 'neutral',
  live: 'brand',
  paused: 'warn',
};

/** A widget's saved status; `prefix` is read out before it (e.g. "Saved status: "). */
export function StatusBadge({ status, prefix }: { status: WidgetStatus; prefix?: string }) {
  return (
    <Badge tone={statusTone[status]}>
      {prefix ? <span className="sr-only">{prefix}</span> : null}
      <span data-status={status}>{statusLabel[status]}</span>
    </Badge>
  );
}
