import type { SoundingKeyFigures } from '../../../../shared/contracts/soundings';

/**
 * Colours for the soundings layer of the workspace: a five-step light-to-dark ramp per
 * parameter family over a fixed domain (SI units). Values outside the domain take the end colour.
 */
export type PointParameter = 'mlCape' | 'muCape' | 'mlCin' | 'bulkShear0to6kmMs' | 'srh0to1km' | 'precipitableWaterMm' | 'surfaceDewpointC' | 'stp';

const instability = ['#fff5e0', '#f6c97c', '#e48a45', '#c2452f', '#6e1c3a'];
const moisture = ['#eef6ea', '#b2d9bf', '#5aab9e', '#1c7782', '#0c4560'];
const kinematic = ['#f0eff8', '#c1c1e4', '#8a8cce', '#5753ad', '#30206a'];
const cap = ['#f4f5f8', '#cbd2dd', '#95a3b6', '#5f6f88', '#2f3b50'];

export const pointParameters: Record<PointParameter, { label: string; from: number; to: number; ramp: string[] }> = {
  mlCape: { label: 'MLCAPE', from: 0, to: 4000, ramp: instability },
  muCape: { label: 'MUCAPE', from: 0, to: 5000, ramp: instability },
  mlCin: { label: 'MLCIN', from: 0, to: -300, ramp: cap },
  bulkShear0to6kmMs: { label: '0–6 km shear', from: 0, to: 35, ramp: kinematic },
  srh0to1km: { label: '0–1 km SRH', from: 0, to: 400, ramp: kinematic },
  precipitableWaterMm: { label: 'Precipitable water', from: 10, to: 60, ramp: moisture },
  surfaceDewpointC: { label: 'Surface dewpoint', from: 0, to: 25, ramp: moisture },
  stp: { label: 'STP', from: 0, to: 6, ramp: instability },
};

export const isPointParameter = (value: string): value is PointParameter => value in pointParameters;

/** The ramp colour for a value (null when the sounding has no value for the parameter). */
export function pointColour(parameter: PointParameter, figures: SoundingKeyFigures): string | null {
  const value = figures[parameter];
  if (value === null || !Number.isFinite(value)) return null;
  const { from, to, ramp } = pointParameters[parameter];
  const fraction = Math.min(1, Math.max(0, (value - from) / (to - from)));
  return ramp[Math.min(ramp.length - 1, Math.floor(fraction * ramp.length))] ?? null;
}
