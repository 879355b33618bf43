/**
 * The product's mark drawn large: water standing higher in narrower tubes (Jurin's law, rise
 * inversely proportional to bore). Purely decorative.
 */
const tubes = [
  { x: 52, w: 28, rise: 16 },
  { x: 104, w: 16, rise: 30 },
  { x: 146, w: 10, rise: 48 },
  { x: 180, w: 6, rise: 76 },
];

const level = 118;

export function RiseFigure({ className = '' }: { className?: string }) {
  return (
    <svg viewBox="0 0 240 160" className={className} aria-hidden="true" focusable="false">
      <rect x="20" y={level} width="200" height="30" rx="4" className="fill-accent/35" />
      <line x1="20" x2="220" y1={level} y2={level} className="stroke-accent" strokeWidth="1.5" />
      {tubes.map((t) => {
        const top = level - t.rise;
        const dip = Math.min(4, t.w / 3);
        return (
          <g key={t.x}>
            <path
              d={`M${t.x} ${top + dip} Q${t.x + t.w / 2} ${top + dip * 2.2} ${t.x + t.w} ${top + dip} L${t.x + t.w} 140 L${t.x} 140 Z`}
              className="fill-accent"
            />
            <rect
              x={t.x}
              y="14"
              width={t.w}
              height="126"
              rx={Math.min(3, t.w / 2)}
              className="fill-none stroke-brand-tint/70"
              strokeWidth="1.5"
            />
            <line
              x1={t.x - 6}
              x2={t.x + t.w + 6}
              y1={top + dip}
              y2={top + dip}
              className="stroke-brand-tint/40"
              strokeDasharray="2 3"
            />
          </g>
        );
      })}
    </svg>
  );
}
