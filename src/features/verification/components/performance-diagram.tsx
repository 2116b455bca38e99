import { podOnCsiLine } from '../../../../shared/verification/aggregate';
import { unitScale } from '../utils/chart-scale';

export interface DiagramPoint {
  key: string;
  label: string;
  colour: string;
  successRatio: number | null;
  pod: number | null;
}

const size = 320;
const margin = { left: 44, right: 40, top: 12, bottom: 40 };
const x = unitScale([margin.left, size - margin.right]);
const y = unitScale([size - margin.bottom, margin.top]);
const csiLines = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9];
const biasLines = [0.5, 1, 2, 4];
const ticks = [0, 0.2, 0.4, 0.6, 0.8, 1];

function csiPath(csi: number): string {
  const points: string[] = [];
  for (let i = 0; i <= 100; i++) {
    const sr = csi + ((1 - csi) * i) / 100;
    const pod = podOnCsiLine(csi, Math.max(sr, 1e-6));
    if (pod !== null) points.push(`${x(sr).toFixed(1)},${y(pod).toFixed(1)}`);
  }
  return points.length ? `M${points.join('L')}` : '';
}

/**
 * Performance diagram (Roebber 2009, Wea. Forecasting 24): success ratio across, probability of
 * detection up, CSI as curved isolines and frequency bias as dashed rays from the origin; one
 * point per risk level, labelled with its level so colour is never the only cue.
 */
export function PerformanceDiagram({ points }: { points: readonly DiagramPoint[] }) {
  const shown = points.filter((p) => p.successRatio !== null && p.pod !== null);
  return (
    <figure className="space-y-1">
      <svg viewBox={`0 0 ${size} ${size}`} role="img" aria-labelledby="performance-title" className="w-full max-w-[26rem] bg-white">
        <title id="performance-title">Performance diagram: {shown.map((p) => `${p.label} POD ${p.pod?.toFixed(2)}, success ratio ${p.successRatio?.toFixed(2)}`).join('; ') || 'no scored levels'}</title>
        {csiLines.map((csi) => (
          <g key={`csi${csi}`}>
            <path d={csiPath(csi)} fill="none" stroke="#9aa3b2" strokeWidth={0.8} />
            <text x={x(1) - 2} y={y(podOnCsiLine(csi, 1) ?? 0) - 2} fontSize={8} textAnchor="end" fill="#4a5263">
              {csi.toFixed(1)}
            </text>
          </g>
        ))}
        {biasLines.map((bias) => {
          const end = bias >= 1 ? { sr: 1 / bias, pod: 1 } : { sr: 1, pod: bias };
          return (
            <g key={`bias${bias}`}>
              <line x1={x(0)} y1={y(0)} x2={x(end.sr)} y2={y(end.pod)} stroke="#6b7385" strokeWidth={0.8} strokeDasharray="4 3" />
              <text x={bias > 1 ? x(end.sr) + 2 : x(1) + 3} y={bias > 1 ? y(end.pod) + 9 : y(end.pod) + 3} fontSize={8} textAnchor="start" fill="#4a5263">
                bias {bias}
              </text>
            </g>
          );
        })}
        <rect x={x(0)} y={y(1)} width={x(1) - x(0)} height={y(0) - y(1)} fill="none" stroke="#3c4456" />
        {ticks.map((t) => (
          <g key={`t${t}`} fontSize={9} fill="#3c4456">
            <text x={x(t)} y={y(0) + 12} textAnchor="middle">
              {t.toFixed(1)}
            </text>
            <text x={x(0) - 4} y={y(t) + 3} textAnchor="end">
              {t.toFixed(1)}
            </text>
          </g>
        ))}
        <text x={(x(0) + x(1)) / 2} y={size - 6} fontSize={10} textAnchor="middle" fill="#1f2533">
          Success ratio (1 − FAR)
        </text>
        <text transform={`translate(11 ${(y(0) + y(1)) / 2}) rotate(-90)`} fontSize={10} textAnchor="middle" fill="#1f2533">
          Probability of detection
        </text>
        {shown.map((p) => (
          <g key={p.key}>
            <circle cx={x(p.successRatio ?? 0)} cy={y(p.pod ?? 0)} r={6} fill={p.colour} stroke="#101624" strokeWidth={1.5} />
            <text x={x(p.successRatio ?? 0) + 8} y={y(p.pod ?? 0) + 3} fontSize={9} fontWeight={600} fill="#101624">
              {p.label}
            </text>
          </g>
        ))}
      </svg>
      <figcaption className="text-[13px] text-ink-muted">Curves: CSI. Dashed rays: frequency bias. Best forecasts sit at the top right.</figcaption>
    </figure>
  );
}
