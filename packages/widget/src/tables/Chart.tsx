import type { CalculationResult, TableRow } from '@wickstone/calc-core';
import { absorptionPoints, inFitWindow, type AbsorptionMethod } from '@wickstone/calc-core/absorption';
import { formatValue } from '@wickstone/calc-core/format';

// The readings against √t with the fitted line, drawn as inline SVG: a few dozen elements, no
// charting library. Points that entered the fit are filled; those the method leaves out are hollow.

const W = 320;
const H = 200;
/** Room on the left for the tick labels and, left of them, the vertical axis title with a margin of its own. */
const PAD = { left: 56, right: 10, top: 10, bottom: 34 };
/** Where the vertical axis title's baseline runs: its letters (9 px) then stand about 12 px from the edge. */
const Y_TITLE_X = 20;

/** Round tick steps (1, 2 or 5 × 10ⁿ) giving about four ticks from 0 to `max`. */
export function ticks(max: number): number[] {
  if (!(max > 0)) return [0];
  const raw = max / 4;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? raw;
  const out: number[] = [];
  for (let v = 0; v <= max + step * 1e-9; v += step) out.push(Number(v.toPrecision(12)));
  return out;
}

/** The chart of an absorption-coefficient result, or nothing for a result without readings. */
export function ReadingsChart({ result }: { result: CalculationResult }) {
  const rows = result.inputs.readings;
  const area = result.inputs.faceArea;
  const method = result.inputs.method as AbsorptionMethod;
  if (!Array.isArray(rows) || typeof area !== 'number') return null;
  const readings = rows as readonly TableRow[];
  const points = absorptionPoints(
    readings.map((r) => ({ time: r.time ?? 0, mass: r.mass ?? 0 })),
    area,
  );
  const slope = result.outputs.absorptionCoefficient;
  const intercept = result.outputs.intercept;
  const xMax = Math.max(...points.map((p) => p.x), 1e-9);
  const yLow = Math.min(0, ...points.map((p) => p.y), intercept ?? 0);
  const yHigh = Math.max(...points.map((p) => p.y), 1e-9);
  const xt = ticks(xMax);
  const yt = ticks(yHigh);
  const xTop = xt[xt.length - 1] ?? xMax;
  const yTop = yt[yt.length - 1] ?? yHigh;
  const sx = (x: number): number => PAD.left + (x / xTop) * (W - PAD.left - PAD.right);
  const sy = (y: number): number =>
    H - PAD.bottom - ((y - yLow) / (yTop - yLow)) * (H - PAD.top - PAD.bottom);
  const line =
    typeof slope === 'number' && typeof intercept === 'number'
      ? { x1: sx(0), y1: sy(intercept), x2: sx(xTop), y2: sy(intercept + slope * xTop) }
      : null;
  const summary = `Mass gained per area against the square root of time: ${points.length} readings${
    line ? ', with the fitted straight line' : '; no line is drawn because no rate is given'
  }.`;
  return (
    <figure class="chart" data-wickstone="chart">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={summary}>
        {yt.map((v) => (
          <g key={`y${v}`}>
            <line class="grid-line" x1={PAD.left} x2={W - PAD.right} y1={sy(v)} y2={sy(v)} />
            <text class="tick" x={PAD.left - 4} y={sy(v) + 3} text-anchor="end">
              {formatValue(v, 3)}
            </text>
          </g>
        ))}
        {xt.map((v) => (
          <text key={`x${v}`} class="tick" x={sx(v)} y={H - PAD.bottom + 12} text-anchor="middle">
            {formatValue(v, 3)}
          </text>
        ))}
        <line class="axis" x1={PAD.left} x2={PAD.left} y1={PAD.top} y2={H - PAD.bottom} />
        <line class="axis" x1={PAD.left} x2={W - PAD.right} y1={sy(0)} y2={sy(0)} />
        {line && <line class="fit" data-wickstone="fit-line" {...line} />}
        {points.map((p, i) => {
          const used = i > 0 && inFitWindow(method, readings[i]?.time ?? 0);
          return (
            <circle
              key={i}
              class={used ? 'pt' : 'pt out'}
              data-point={used ? 'fit' : 'left-out'}
              cx={sx(p.x)}
              cy={sy(p.y)}
              r="3.5"
            />
          );
        })}
        <text class="axis-label" x={(PAD.left + W - PAD.right) / 2} y={H - 4} text-anchor="middle">
          √t (√s)
        </text>
        <text
          class="axis-label"
          x={Y_TITLE_X}
          y={(PAD.top + H - PAD.bottom) / 2}
          text-anchor="middle"
          transform={`rotate(-90 ${Y_TITLE_X} ${(PAD.top + H - PAD.bottom) / 2})`}
        >
          Δm/A (kg/m²)
        </text>
      </svg>
      <figcaption class="note">Filled points entered the fit; hollow ones the method leaves out.</figcaption>
    </figure>
  );
}
