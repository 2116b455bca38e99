import { keyFigureKeys, type KeyFigureKey } from '../sounding/key-figures';

/**
 * Filled-contour bands of every key figure for the model-field layer: where each band starts
 * (SI units, as stored) and its colour.
 *
 * The breaks and colours are Stormdraft's own choice: round numbers that split the usual range of
 * each figure into eight steps, and three sequential ramps (amber → brown for instability and
 * composites, pale → deep green for moisture, sand → olive for wind, heights and angles) that
 * stay clear of the risk ladder's steel-blue → indigo → plum ramp, so a field under the drawing
 * is never read as a risk level. Darker always means further from "nothing".
 */

/** What a figure measures, so the client can show it in the person's display units. */
export type FieldQuantity = 'energy' | 'temperature' | 'height' | 'speed' | 'helicity' | 'lapseRate' | 'depthMm' | 'mixingRatio' | 'angle' | 'index';

export interface FieldDefinition {
  key: KeyFigureKey;
  /** Short name for pickers and the legend title. */
  label: string;
  quantity: FieldQuantity;
  /** SI unit as stored ('' when dimensionless). */
  unit: string;
  /**
   * 'above': band i covers values ≥ breaks[i] (CAPE, shear …). 'below': band i covers values
   * ≤ breaks[i] (CIN, whose stronger inhibition is more negative).
   */
  sense: 'above' | 'below';
  /** Lower edges of the bands, in SI units, ordered away from "nothing" (ascending for 'above'). */
  breaks: readonly number[];
  colours: readonly string[];
}

/** Amber → brown: instability, lapse rates and composite indices. */
export const amberRamp = ['#fff4c7', '#fde293', '#fbc762', '#f5a23f', '#e3782b', '#c4521d', '#923614', '#5e210b'] as const;
/** Pale → deep green: moisture. */
export const greenRamp = ['#eef7da', '#d3ecb1', '#aadb8b', '#7dc36c', '#50a555', '#2e8547', '#18663b', '#0c482b'] as const;
/** Sand → olive brown: wind, heights and angles. */
export const sandRamp = ['#f7f1dd', '#e9ddb0', '#d7c381', '#c1a456', '#a68535', '#876720', '#664b13', '#46330a'] as const;

type Entry = Omit<FieldDefinition, 'key'>;
const above = (label: string, quantity: FieldQuantity, unit: string, breaks: number[], colours: readonly string[]): Entry => ({ label, quantity, unit, sense: 'above', breaks, colours });

/** One entry per key figure, so any figure can be drawn as a field. */
export const fieldDefinitions: Record<KeyFigureKey, FieldDefinition> = withKeys({
  mlCape: above('MLCAPE', 'energy', 'J/kg', [100, 250, 500, 1000, 1500, 2000, 3000, 4000], amberRamp),
  muCape: above('MUCAPE', 'energy', 'J/kg', [100, 250, 500, 1000, 1500, 2000, 3000, 4000], amberRamp),
  mlCin: { label: 'MLCIN', quantity: 'energy', unit: 'J/kg', sense: 'below', breaks: [-10, -25, -50, -75, -100, -150, -200, -300], colours: sandRamp },
  mlLclHeightM: above('ML LCL height', 'height', 'm', [500, 750, 1000, 1250, 1500, 2000, 2500, 3000], sandRamp),
  precipitableWaterMm: above('Precipitable water', 'depthMm', 'mm', [10, 15, 20, 25, 30, 35, 40, 50], greenRamp),
  bulkShear0to6kmMs: above('0–6 km shear', 'speed', 'm/s', [10, 12.5, 15, 17.5, 20, 25, 30, 35], sandRamp),
  srh0to1km: above('0–1 km SRH', 'helicity', 'm²/s²', [50, 100, 150, 200, 250, 300, 400, 500], sandRamp),
  stp: above('STP', 'index', '', [0.5, 1, 2, 3, 4, 6, 8, 10], amberRamp),
  scp: above('SCP', 'index', '', [1, 2, 4, 6, 8, 10, 15, 20], amberRamp),
  surfaceDewpointC: above('Surface dewpoint', 'temperature', '°C', [8, 10, 12, 14, 16, 18, 20, 22], greenRamp),
  surfaceMixingRatioGkg: above('Surface mixing ratio', 'mixingRatio', 'g/kg', [6, 8, 10, 12, 14, 16, 18, 20], greenRamp),
  srh0to500m: above('0–500 m SRH', 'helicity', 'm²/s²', [25, 50, 100, 150, 200, 250, 300, 400], sandRamp),
  criticalAngleDeg: above('Critical angle', 'angle', '°', [15, 30, 45, 60, 75, 90, 105, 120], sandRamp),
  mlLclLfcGapM: above('ML LCL–LFC gap', 'height', 'm', [250, 500, 750, 1000, 1500, 2000, 2500, 3000], sandRamp),
  lapseRate0to3kmCKm: above('0–3 km lapse rate', 'lapseRate', '°C/km', [5, 6, 6.5, 7, 7.5, 8, 8.5, 9], amberRamp),
  lapseRate3to6kmCKm: above('3–6 km lapse rate', 'lapseRate', '°C/km', [5, 5.5, 6, 6.5, 7, 7.5, 8, 8.5], amberRamp),
  lapseRate850to500CKm: above('850–500 hPa lapse rate', 'lapseRate', '°C/km', [5, 5.5, 6, 6.5, 7, 7.5, 8, 8.5], amberRamp),
  lapseRate700to500CKm: above('700–500 hPa lapse rate', 'lapseRate', '°C/km', [5, 5.5, 6, 6.5, 7, 7.5, 8, 8.5], amberRamp),
  muCapeHailZone: above('MUCAPE in the hail zone', 'energy', 'J/kg', [50, 100, 200, 400, 600, 800, 1000, 1500], amberRamp),
  freezingLevelM: above('Freezing level', 'height', 'm', [2000, 2500, 3000, 3500, 4000, 4500, 5000, 5500], sandRamp),
  effectiveBulkShearMs: above('Effective bulk shear', 'speed', 'm/s', [10, 12.5, 15, 17.5, 20, 25, 30, 35], sandRamp),
  bulkShear0to8kmMs: above('0–8 km shear', 'speed', 'm/s', [10, 15, 20, 25, 30, 35, 40, 50], sandRamp),
  dcape: above('DCAPE', 'energy', 'J/kg', [200, 400, 600, 800, 1000, 1200, 1400, 1600], amberRamp),
  meanWind0to6kmMs: above('0–6 km mean wind', 'speed', 'm/s', [5, 7.5, 10, 12.5, 15, 20, 25, 30], sandRamp),
  corfidiUpwindMs: above('Corfidi upwind speed', 'speed', 'm/s', [5, 7.5, 10, 12.5, 15, 20, 25, 30], sandRamp),
  corfidiDownwindMs: above('Corfidi downwind speed', 'speed', 'm/s', [5, 7.5, 10, 12.5, 15, 20, 25, 30], sandRamp),
  warmCloudDepthM: above('Warm-cloud depth', 'height', 'm', [1000, 1500, 2000, 2500, 3000, 3500, 4000, 4500], greenRamp),
});

function withKeys(entries: Record<KeyFigureKey, Entry>): Record<KeyFigureKey, FieldDefinition> {
  const result = {} as Record<KeyFigureKey, FieldDefinition>;
  for (const key of keyFigureKeys) result[key] = { key, ...entries[key] };
  return result;
}

export function isFieldFigure(value: string): value is KeyFigureKey {
  return (keyFigureKeys as readonly string[]).includes(value);
}

/** One band as the legend and the map draw it: from its break to the next (null: open-ended). */
export interface FieldBand {
  index: number;
  from: number;
  to: number | null;
  colour: string;
}

/** The bands of a figure, in drawing order (the band nearest "nothing" first). */
export function fieldBands(definition: FieldDefinition): FieldBand[] {
  return definition.breaks.map((from, index) => ({ index, from, to: definition.breaks[index + 1] ?? null, colour: definition.colours[index] ?? definition.colours[definition.colours.length - 1] ?? '#000000' }));
}
