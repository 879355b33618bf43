import { useId } from 'react';
import type { UsageSummary } from '@wickstone/contracts';
import { formatDate } from '../lib/labels';

const height = 160;
const gap = 2;

/**
 * Runs per day as bars drawn here (no chart library: one series of integer counts needs none).
 * The picture is named by a one-line summary; the same numbers sit in a table beside it for
 * anyone who does not see the bars.
 */
export function RunsPerDayChart({ perDay }: { perDay: UsageSummary['perDay'] }) {
  const titleId = useId();
  const max = Math.max(1, ...perDay.map((d) => d.runs));
  const total = perDay.reduce((n, d) => n + d.runs, 0);
  const busiest = perDay.reduce<UsageSummary['perDay'][number] | null>(
    (b, d) => (!b || d.runs > b.runs ? d : b),
    null,
  );
  const width = Math.max(perDay.length * 12, 240);
  const bar = width / Math.max(perDay.length, 1);
  const summary =
    total === 0
      ? `No runs on any of the ${perDay.length} days.`
      : `${total} runs over ${perDay.length} days; the busiest day was ${busiest ? formatDate(busiest.day) : ''} with ${busiest?.runs ?? 0}.`;
  return (
    <figure className="space-y-2">
      <svg
        role="img"
        aria-labelledby={titleId}
        viewBox={`0 0 ${width} ${height + 18}`}
        preserveAspectRatio="none"
        className="h-44 w-full text-accent"
      >
        <title id={titleId}>{summary}</title>
        <line x1={0} x2={width} y1={height} y2={height} className="stroke-line-strong" strokeWidth={1} />
        {perDay.map((d, i) => {
          const h = (d.runs / max) * (height - 8);
          return (
            <g key={d.day}>
              <rect
                x={i * bar + gap / 2}
                y={height - h}
                width={Math.max(bar - gap, 1)}
                height={h}
                className="fill-current"
              >
                <title>{`${formatDate(d.day)}: ${d.runs} runs`}</title>
              </rect>
              {d.withLead > 0 ? (
                <rect
                  x={i * bar + gap / 2}
                  y={height + 4}
                  width={Math.max(bar - gap, 1)}
                  height={4}
                  className="fill-brand"
                />
              ) : null}
            </g>
          );
        })}
      </svg>
      <figcaption className="flex flex-wrap items-center justify-between gap-2 text-sm text-ink-soft">
        <span>{summary}</span>
        <span className="flex items-center gap-1.5">
          <span aria-hidden="true" className="inline-block h-1 w-4 bg-brand" /> days with a lead
        </span>
      </figcaption>
      <details className="text-sm">
        <summary className="cursor-pointer font-semibold text-brand">The numbers by day</summary>
        <div className="mt-2 max-h-64 overflow-y-auto rounded-md border border-line">
          <table className="w-full">
            <caption className="sr-only">Runs per day</caption>
            <thead className="sticky top-0 bg-paper text-left text-xs text-ink-soft uppercase">
              <tr>
                <th scope="col" className="px-3 py-1.5">
                  Day
                </th>
                <th scope="col" className="px-3 py-1.5 text-right">
                  Runs
                </th>
                <th scope="col" className="px-3 py-1.5 text-right">
                  With a warning
                </th>
                <th scope="col" className="px-3 py-1.5 text-right">
                  Led to a lead
                </th>
              </tr>
            </thead>
            <tbody>
              {perDay.map((d) => (
                <tr key={d.day} className="border-t border-line tabular-nums">
                  <th scope="row" className="px-3 py-1 text-left font-normal">
                    <time dateTime={d.day}>{formatDate(d.day)}</time>
                  </th>
                  <td className="px-3 py-1 text-right">{d.runs}</td>
                  <td className="px-3 py-1 text-right">{d.withWarning}</td>
                  <td className="px-3 py-1 text-right">{d.withLead}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </figure>
  );
}
