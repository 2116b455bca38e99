import type { ParcelResult, SoundingLevel } from '../../../../shared/sounding';
import { interpolateInLogPressure, levelVirtualTemperatureC } from './profile-helpers';

/**
 * The shaded areas of a parcel on the diagram: between the parcel's virtual-temperature trace and
 * the environment's virtual temperature, the way the engine integrates buoyancy. Positive area
 * (CAPE) only between the LFC and the EL; negative area (CIN) only from the start to the LFC;
 * nothing when the parcel has no LFC (the engine's CAPE and CIN are both 0 then).
 */
export interface BuoyancyArea {
  sign: 'positive' | 'negative';
  /** Closed outline: up the parcel trace, back down the environment. */
  outline: { pressureHpa: number; temperatureC: number }[];
}

interface Sample {
  pressureHpa: number;
  parcelC: number;
  environmentC: number;
}

export function buoyancyAreas(levels: readonly SoundingLevel[], parcel: ParcelResult): BuoyancyArea[] {
  const trace = parcel.trace;
  if (!trace || trace.length < 2 || parcel.lfcPressure === null) return [];
  const pressures = levels.map((level) => level.pressureHpa);
  const environment = levels.map(levelVirtualTemperatureC);
  const lfc = parcel.lfcPressure;
  const top = parcel.elPressure ?? (trace[trace.length - 1] as (typeof trace)[number]).pressureHpa;

  // Samples along the trace with the LFC and EL inserted, so the areas start and stop exactly there.
  const cut = new Set<number>([lfc, top]);
  const samplePressures = [...new Set([...trace.map((point) => point.pressureHpa), ...cut])]
    .filter((p) => p <= parcel.parcelPressure && p >= top)
    .sort((a, b) => b - a);
  const tracePressures = trace.map((point) => point.pressureHpa);
  const traceVirtual = trace.map((point) => point.virtualTemperatureC);
  const samples: Sample[] = samplePressures
    .map((pressureHpa) => ({
      pressureHpa,
      parcelC: interpolateInLogPressure(tracePressures, traceVirtual, pressureHpa),
      environmentC: interpolateInLogPressure(pressures, environment, pressureHpa),
    }))
    .filter((sample) => Number.isFinite(sample.parcelC) && Number.isFinite(sample.environmentC));

  // Insert the points where the curves cross, so each segment keeps one sign.
  const points: Sample[] = [];
  for (let i = 0; i < samples.length; i++) {
    const sample = samples[i] as Sample;
    const previous = samples[i - 1];
    if (previous) {
      const a = previous.parcelC - previous.environmentC;
      const b = sample.parcelC - sample.environmentC;
      if (a * b < 0) {
        const fraction = a / (a - b);
        const logP = Math.log(previous.pressureHpa) + fraction * (Math.log(sample.pressureHpa) - Math.log(previous.pressureHpa));
        const temperature = previous.environmentC + fraction * (sample.environmentC - previous.environmentC);
        points.push({ pressureHpa: Math.exp(logP), parcelC: temperature, environmentC: temperature });
      }
    }
    points.push(sample);
  }

  // Classify each segment by its midpoint and join neighbours of the same kind.
  const areas: BuoyancyArea[] = [];
  let run: Sample[] = [];
  let runSign: BuoyancyArea['sign'] | null = null;
  const close = (): void => {
    if (runSign && run.length >= 2) {
      areas.push({
        sign: runSign,
        outline: [
          ...run.map((s) => ({ pressureHpa: s.pressureHpa, temperatureC: s.parcelC })),
          ...[...run].reverse().map((s) => ({ pressureHpa: s.pressureHpa, temperatureC: s.environmentC })),
        ],
      });
    }
    run = [];
    runSign = null;
  };
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1] as Sample;
    const b = points[i] as Sample;
    const difference = (a.parcelC - a.environmentC + b.parcelC - b.environmentC) / 2;
    const middle = Math.sqrt(a.pressureHpa * b.pressureHpa);
    let sign: BuoyancyArea['sign'] | null = null;
    if (difference > 0 && middle < lfc) sign = 'positive';
    else if (difference < 0 && middle > lfc) sign = 'negative';
    if (sign !== runSign) {
      close();
      runSign = sign;
      if (sign) run.push(a);
    }
    if (sign) run.push(b);
  }
  close();
  return areas;
}
