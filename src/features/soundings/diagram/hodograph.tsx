import { clsx } from 'clsx';
import type { Units } from '../../../../shared/contracts/users';
import type { KinematicsAnalysis, SoundingLevel, WindVector } from '../../../../shared/sounding';
import { windDirectionAndSpeed } from '../../../../shared/sounding';
import { formatNumber, speedText, speedUnitLabel } from './format';
import { hodographRings, hodographSegments } from './hodograph-data';
import { HODOGRAPH_BANDS, SOUNDING_PALETTE as C } from './palette';
import { METRES_PER_SECOND_PER_KNOT, METRES_PER_SECOND_PER_MPH } from '../../../utils/units';

export interface HodographProps {
  /** Levels sorted by decreasing pressure (heights MSL). */
  levels: readonly SoundingLevel[];
  /** The engine's kinematics (Bunkers storm motions, mean wind). */
  kinematics: KinematicsAnalysis;
  units: Units;
  className?: string;
}

const SIZE = 320;
const CENTRE = SIZE / 2;
const RADIUS = SIZE / 2 - 18;

const toDisplaySpeed = (speedMs: number, unit: Units['speed']): number =>
  unit === 'ms' ? speedMs : unit === 'kt' ? speedMs / METRES_PER_SECOND_PER_KNOT : speedMs / METRES_PER_SECOND_PER_MPH;

function motionText(vector: WindVector, units: Units): string {
  const { directionDeg, speed } = windDirectionAndSpeed(vector.u, vector.v);
  return `${String(Math.round(directionDeg) % 360).padStart(3, '0')}° ${speedText(speed, units)}`;
}

/** Hodograph of the 0–10 km AGL winds, coloured by height band, with Bunkers storm motions. */
export function Hodograph({ levels, kinematics, units, className }: HodographProps) {
  const segments = hodographSegments(levels);
  const motions = [kinematics.stormMotionRight, kinematics.stormMotionLeft, kinematics.meanWind0to6km].filter((m): m is WindVector => m !== null);
  const speeds = [...segments.flatMap((s) => s.points.map((p) => Math.hypot(p.u, p.v))), ...motions.map((m) => Math.hypot(m.u, m.v))];
  const maxDisplay = toDisplaySpeed(Math.max(10, ...speeds), units.speed);
  const rings = hodographRings(maxDisplay);
  const scale = RADIUS / (rings.step * rings.count); // px per display unit
  const at = (u: number, v: number) => ({ x: CENTRE + toDisplaySpeed(u, units.speed) * scale, y: CENTRE - toDisplaySpeed(v, units.speed) * scale });
  const unit = speedUnitLabel[units.speed];
  const right = kinematics.stormMotionRight;
  const left = kinematics.stormMotionLeft;
  const summary = [
    segments.length ? `Winds from ${segments[0]?.band.label.split('–')[0]} to ${segments.at(-1)?.band.label.split('–')[1]} above ground` : 'No winds reported',
    right ? `Bunkers right mover ${motionText(right, units)}` : null,
    left ? `left mover ${motionText(left, units)}` : null,
  ]
    .filter(Boolean)
    .join('; ');

  return (
    <figure className={clsx('m-0', className)}>
      <svg viewBox={`0 0 ${SIZE} ${SIZE}`} className="block h-auto w-full" role="img" aria-label={`Hodograph. ${summary}.`} fontFamily="Public Sans, ui-sans-serif, system-ui, sans-serif">
        <rect x={0} y={0} width={SIZE} height={SIZE} fill={C.background} rx={6} />
        {Array.from({ length: rings.count }, (_, i) => (i + 1) * rings.step).map((speed) => (
          <g key={speed}>
            <circle cx={CENTRE} cy={CENTRE} r={speed * scale} fill="none" stroke={C.isobar} strokeWidth={0.9} />
            <text x={CENTRE + speed * scale * Math.SQRT1_2 + 2} y={CENTRE + speed * scale * Math.SQRT1_2 + 10} fontSize={9.5} fill={C.label}>
              {speed}
            </text>
          </g>
        ))}
        <line x1={CENTRE - RADIUS} x2={CENTRE + RADIUS} y1={CENTRE} y2={CENTRE} stroke={C.frame} strokeWidth={0.7} />
        <line y1={CENTRE - RADIUS} y2={CENTRE + RADIUS} x1={CENTRE} x2={CENTRE} stroke={C.frame} strokeWidth={0.7} />
        <text x={SIZE - 6} y={SIZE - 6} fontSize={9.5} fill={C.label} textAnchor="end">
          {unit}
        </text>
        {segments.map(({ band, points }) => (
          <polyline
            key={band.label}
            points={points.map((p) => at(p.u, p.v)).map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join(' ')}
            fill="none"
            stroke={band.colour}
            strokeWidth={2.6}
            strokeLinejoin="round"
            strokeLinecap="round"
          />
        ))}
        {segments.map(({ band, points }) => {
          const last = points[points.length - 1];
          if (!last) return null;
          const p = at(last.u, last.v);
          return (
            <text key={band.label} x={p.x + 4} y={p.y - 4} fontSize={9} fill={band.colour} fontWeight={600}>
              {Math.round(last.heightM / 1000)}
            </text>
          );
        })}
        {kinematics.meanWind0to6km ? (
          <g>
            <rect {...square(at(kinematics.meanWind0to6km.u, kinematics.meanWind0to6km.v), 3.5)} fill="none" stroke={C.parcel} strokeWidth={1.3} />
          </g>
        ) : null}
        {right ? <StormMarker point={at(right.u, right.v)} label="RM" filled /> : null}
        {left ? <StormMarker point={at(left.u, left.v)} label="LM" filled={false} /> : null}
      </svg>
      <figcaption className="mt-2 text-[12px] text-ink-muted">
        <ul className="flex flex-wrap gap-x-3 gap-y-1" aria-label="Hodograph legend">
          {HODOGRAPH_BANDS.map((band) => (
            <li key={band.label} className="inline-flex items-center gap-1">
              <svg width={18} height={8} aria-hidden="true">
                <line x1={0} x2={18} y1={4} y2={4} stroke={band.colour} strokeWidth={3} />
              </svg>
              {band.label}
            </li>
          ))}
          <li>● RM / ○ LM Bunkers right / left mover</li>
          <li>□ 0–6 km mean wind</li>
          <li>Rings every {formatNumber(rings.step, 0)} {unit}</li>
        </ul>
        {right || left ? (
          <p className="mt-1 tabular-nums">
            {right ? `RM ${motionText(right, units)}` : ''}
            {right && left ? ' · ' : ''}
            {left ? `LM ${motionText(left, units)}` : ''}
          </p>
        ) : null}
      </figcaption>
    </figure>
  );
}

function square(point: { x: number; y: number }, half: number) {
  return { x: point.x - half, y: point.y - half, width: half * 2, height: half * 2 };
}

function StormMarker({ point, label, filled }: { point: { x: number; y: number }; label: string; filled: boolean }) {
  return (
    <g>
      <circle cx={point.x} cy={point.y} r={4.5} fill={filled ? C.parcel : '#ffffff'} stroke={C.parcel} strokeWidth={1.5} />
      <text x={point.x + 7} y={point.y + 4} fontSize={10.5} fontWeight={700} fill={C.parcel} paintOrder="stroke" stroke="#ffffff" strokeWidth={3}>
        {label}
      </text>
    </g>
  );
}
