import { unitScale } from '../utils/chart-scale';

export interface Series {
  key: string;
  label: string;
  colour: string;
  points: { time: string; csi: number | null }[];
}

const width = 560;
const height = 220;
const margin = { left: 40, right: 110, top: 10, bottom: 28 };
const y = unitScale([height - margin.bottom, margin.top]);

/** CSI over time, one line per level or hazard, each labelled at its end (never colour alone). */
export function CsiSeries({ series }: { series: readonly Series[] }) {
  const times = series.flatMap((s) => s.points.map((p) => Date.parse(p.time)));
  if (times.length === 0) return <p className="text-sm text-ink-muted">No scored issuances match the filters.</p>;
  if (new Set(times).size < 2) return <p className="text-sm text-ink-muted">One scored issuance so far: the trend appears from the second one on. Its scores are in the performance diagram.</p>;
  const t0 = Math.min(...times);
  const t1 = Math.max(...times);
  const x = (time: string) => (t1 === t0 ? (margin.left + width - margin.right) / 2 : margin.left + ((width - margin.left - margin.right) * (Date.parse(time) - t0)) / (t1 - t0));
  return (
    <svg viewBox={`0 0 ${width} ${height}`} role="img" aria-label="Critical success index over time" className="w-full bg-white">
      {[0, 0.25, 0.5, 0.75, 1].map((t) => (
        <g key={t}>
          <line x1={margin.left} x2={width - margin.right} y1={y(t)} y2={y(t)} stroke="#dde2ea" />
          <text x={margin.left - 4} y={y(t) + 3} fontSize={9} textAnchor="end" fill="#3c4456">
            {t.toFixed(2)}
          </text>
        </g>
      ))}
      <text x={margin.left} y={height - 8} fontSize={9} fill="#3c4456">
        {new Date(t0).toISOString().slice(0, 10)}
      </text>
      <text x={width - margin.right} y={height - 8} fontSize={9} textAnchor="end" fill="#3c4456">
        {new Date(t1).toISOString().slice(0, 10)}
      </text>
      {series.map((s) => {
        const points = s.points.filter((p) => p.csi !== null);
        const last = points.at(-1);
        return (
          <g key={s.key}>
            <polyline fill="none" stroke={s.colour} strokeWidth={2} points={points.map((p) => `${x(p.time).toFixed(1)},${y(p.csi ?? 0).toFixed(1)}`).join(' ')} />
            {points.map((p) => (
              <circle key={p.time} cx={x(p.time)} cy={y(p.csi ?? 0)} r={3} fill={s.colour} stroke="#101624" strokeWidth={0.8} />
            ))}
            {last ? (
              <text x={x(last.time) + 6} y={y(last.csi ?? 0) + 3} fontSize={9} fontWeight={600} fill="#101624">
                {s.label}
              </text>
            ) : null}
          </g>
        );
      })}
    </svg>
  );
}
