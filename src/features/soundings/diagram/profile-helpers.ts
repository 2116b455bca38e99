import {
  ZERO_CELSIUS_K,
  mixingRatio,
  saturationVaporPressure,
  virtualTemperature,
  windDirectionAndSpeed,
  type ParcelTracePoint,
  type SoundingLevel,
} from '../../../../shared/sounding';

/** Environment virtual temperature of a level, °C (temperature when the dewpoint is missing). Engine formulas. */
export function levelVirtualTemperatureC(level: SoundingLevel): number {
  const temperatureK = level.temperatureC + ZERO_CELSIUS_K;
  if (level.dewpointC === null) return level.temperatureC;
  const dewpointK = Math.min(level.dewpointC, level.temperatureC) + ZERO_CELSIUS_K;
  const w = mixingRatio(saturationVaporPressure(dewpointK), level.pressureHpa);
  return virtualTemperature(temperatureK, w) - ZERO_CELSIUS_K;
}

/** Linear interpolation in ln p of `values` given at `pressures` (decreasing); NaN outside. */
export function interpolateInLogPressure(pressures: readonly number[], values: readonly number[], pressureHpa: number): number {
  const n = pressures.length;
  for (let i = 1; i < n; i++) {
    const p0 = pressures[i - 1] as number;
    const p1 = pressures[i] as number;
    if ((p0 - pressureHpa) * (p1 - pressureHpa) <= 0) {
      const v0 = values[i - 1] as number;
      const v1 = values[i] as number;
      if (p0 === p1) return v0;
      const fraction = (Math.log(pressureHpa) - Math.log(p0)) / (Math.log(p1) - Math.log(p0));
      return v0 + fraction * (v1 - v0);
    }
  }
  return n === 1 && pressures[0] === pressureHpa ? (values[0] as number) : NaN;
}

/** Parcel temperature (°C) at a pressure from its trace; NaN outside the trace. */
export function parcelTemperatureAt(trace: readonly ParcelTracePoint[] | undefined, pressureHpa: number): number {
  if (!trace || trace.length === 0) return NaN;
  return interpolateInLogPressure(
    trace.map((point) => point.pressureHpa),
    trace.map((point) => point.temperatureC),
    pressureHpa,
  );
}

/** Wind of a level as direction (from, degrees) and speed (m s⁻¹); null when not reported. */
export function levelWind(level: SoundingLevel): { directionDeg: number; speedMs: number } | null {
  if (level.uMs === null || level.vMs === null) return null;
  const { directionDeg, speed } = windDirectionAndSpeed(level.uMs, level.vMs);
  return { directionDeg, speedMs: speed };
}

/** Height above the lowest level, m. */
export function heightAboveGround(levels: readonly SoundingLevel[], level: SoundingLevel): number {
  return level.heightM - (levels[0]?.heightM ?? level.heightM);
}
