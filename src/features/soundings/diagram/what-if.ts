import {
  analyzeSounding,
  liftParcelFromLevel,
  type ParcelResult,
  type SoundingAnalysis,
  type SoundingLevel,
} from '../../../../shared/sounding';

/**
 * The what-if model: a change to the surface temperature and dewpoint and/or a chosen parcel
 * start level, applied to a copy of the sounding and recomputed with the shared engine. Pure.
 */
export interface WhatIfChange {
  /** New surface (lowest level) temperature, °C; undefined keeps the observed value. */
  surfaceTemperatureC?: number | undefined;
  /** New surface dewpoint, °C; undefined keeps the observed value. */
  surfaceDewpointC?: number | undefined;
  /** Pressure of the level a parcel is lifted from, hPa; undefined for the standard parcels only. */
  parcelStartPressureHpa?: number | undefined;
}

export interface WhatIfResult {
  /** The levels with the surface change applied (the original array when nothing changed). */
  levels: readonly SoundingLevel[];
  /** Full analysis with parcel traces. */
  analysis: SoundingAnalysis;
  /** The parcel lifted from the chosen level, with its trace; null when none is chosen. */
  chosenParcel: ParcelResult | null;
}

/** Why a change cannot be applied, in words for the forecaster; null when it can. */
export function whatIfProblem(levels: readonly SoundingLevel[], change: WhatIfChange): string | null {
  const surface = levels[0];
  if (!surface) return 'This sounding has no levels.';
  const temperature = change.surfaceTemperatureC ?? surface.temperatureC;
  const dewpoint = change.surfaceDewpointC ?? surface.dewpointC;
  if (dewpoint !== null && dewpoint > temperature + 1e-9) {
    return 'The dewpoint cannot be higher than the temperature. Lower the dewpoint or raise the temperature.';
  }
  return null;
}

/** A copy of the levels with the lowest level's temperature and dewpoint replaced. */
export function applySurfaceChange(levels: readonly SoundingLevel[], change: WhatIfChange): readonly SoundingLevel[] {
  const surface = levels[0];
  if (!surface || (change.surfaceTemperatureC === undefined && change.surfaceDewpointC === undefined)) return levels;
  const temperatureC = change.surfaceTemperatureC ?? surface.temperatureC;
  const dewpointC = change.surfaceDewpointC ?? surface.dewpointC;
  return [{ ...surface, temperatureC, dewpointC: dewpointC === null ? null : Math.min(dewpointC, temperatureC) }, ...levels.slice(1)];
}

/** Analyse a sounding for display: every parcel with its trace. */
export function analyzeForDiagram(levels: readonly SoundingLevel[]): SoundingAnalysis {
  return analyzeSounding(levels, { trace: true });
}

/** Lift a parcel from a level for display; null when the level has no dewpoint or lies outside. */
export function liftChosenParcel(levels: readonly SoundingLevel[], pressureHpa: number | undefined): ParcelResult | null {
  if (pressureHpa === undefined) return null;
  try {
    return liftParcelFromLevel(levels, pressureHpa, { trace: true });
  } catch {
    // The engine throws RangeError for a start outside the data or without a dewpoint: no parcel to show.
    return null;
  }
}

/** Apply a what-if change and recompute everything the views show. */
export function recomputeWhatIf(levels: readonly SoundingLevel[], change: WhatIfChange): WhatIfResult {
  const modified = applySurfaceChange(levels, change);
  return {
    levels: modified,
    analysis: analyzeForDiagram(modified),
    chosenParcel: liftChosenParcel(modified, change.parcelStartPressureHpa),
  };
}

/** Levels a parcel may start from: those with a dewpoint within the lowest 300 hPa (the most-unstable search depth). */
export function parcelStartOptions(levels: readonly SoundingLevel[]): number[] {
  const surface = levels[0];
  if (!surface) return [];
  return levels
    .filter((level) => level.dewpointC !== null && level.pressureHpa >= surface.pressureHpa - 300)
    .map((level) => level.pressureHpa);
}

/**
 * How long one what-if recomputation takes, ms (median of `runs`, after one warm-up run that
 * also builds the engine's pseudo-adiabat table). `now` is injectable so the arithmetic can be
 * tested without timing anything.
 */
export function measureRecomputeMs(
  levels: readonly SoundingLevel[],
  options: { runs?: number; now?: () => number } = {},
): number {
  const runs = Math.max(1, options.runs ?? 15);
  const now = options.now ?? (() => performance.now());
  const surface = levels[0];
  const baseTemperature = surface?.temperatureC ?? 0;
  recomputeWhatIf(levels, { surfaceTemperatureC: baseTemperature });
  const durations: number[] = [];
  for (let i = 0; i < runs; i++) {
    const change: WhatIfChange = { surfaceTemperatureC: baseTemperature + 0.1 * (i + 1), surfaceDewpointC: surface?.dewpointC ?? undefined };
    const start = now();
    recomputeWhatIf(levels, change);
    durations.push(now() - start);
  }
  durations.sort((a, b) => a - b);
  return durations[Math.floor(durations.length / 2)] as number;
}
