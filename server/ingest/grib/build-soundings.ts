/**
 * Turns decoded model fields into one sounding per kept grid point, packed as Float32 values
 * six per level (pressure hPa, height m above sea level, temperature °C, dewpoint °C, u and v
 * m/s; NaN when missing), lowest level first: the form stored in `grid_soundings.levels`.
 */
import { dewpointFromMixingRatio, dewpointFromRelativeHumidity, GRAVITY, layerThickness, MIN_LEVELS, type SoundingLevel } from '../../../shared/sounding';

/** Values per packed level. */
export const VALUES_PER_LEVEL = 6;

/** The fields of one isobaric level, one value per kept point. */
export interface IsobaricFields {
  temperatureK?: Float32Array;
  /** Geopotential height, gpm (from gh, or z / g). */
  heightM?: Float32Array;
  relativeHumidityPct?: Float32Array;
  specificHumidity?: Float32Array;
  dewpointK?: Float32Array;
  uMs?: Float32Array;
  vMs?: Float32Array;
}

/** The surface fields present in the file, one value per kept point. */
export interface SurfaceFields {
  pressurePa?: Float32Array;
  orographyM?: Float32Array;
  temperature2mK?: Float32Array;
  dewpoint2mK?: Float32Array;
  relativeHumidity2mPct?: Float32Array;
  u10mMs?: Float32Array;
  v10mMs?: Float32Array;
}

/** Everything one run gives per kept point. */
export interface RunFields {
  pointCount: number;
  /** Keyed by pressure, hPa. */
  isobaric: Map<number, IsobaricFields>;
  surface: SurfaceFields;
}

/** The soundings of a run, packed. Point p's levels are `levels[starts[p]*6 .. starts[p+1]*6)`. */
export interface PackedSoundings {
  levels: Float32Array;
  starts: Int32Array;
  /** Ground elevation per point, m (NaN: unknown). */
  elevationM: Float32Array;
  /** 1 when the point has enough levels for an analysis (≥ 5, top at or above 500 hPa). */
  usable: Uint8Array;
  /** Levels dropped because they were below ground. */
  belowGroundDropped: number;
}

/** Top of a usable sounding, hPa (the same rule as uploaded soundings). */
const TOP_PRESSURE_MAX_HPA = 500;

const at = (array: Float32Array | undefined, point: number): number => (array ? (array[point]!) : NaN);

function dewpointC(fields: IsobaricFields, point: number, pressureHpa: number, temperatureK: number): number {
  let dewpointK = at(fields.dewpointK, point);
  if (!Number.isFinite(dewpointK)) {
    const rh = at(fields.relativeHumidityPct, point);
    const q = at(fields.specificHumidity, point);
    if (Number.isFinite(rh) && rh > 0) dewpointK = dewpointFromRelativeHumidity(temperatureK, Math.min(rh, 100));
    else if (Number.isFinite(q) && q > 0 && q < 1) dewpointK = dewpointFromMixingRatio(q / (1 - q), pressureHpa);
  }
  if (!Number.isFinite(dewpointK)) return NaN;
  return Math.min(dewpointK, temperatureK) - 273.15;
}

const usableTemperature = (celsius: number) => Number.isFinite(celsius) && celsius >= -120 && celsius <= 60;

/**
 * Build the soundings of every point. Levels at or below the ground (pressure within 1 hPa of
 * the surface pressure or higher; without surface pressure, height at or below the orography)
 * are dropped; the surface level comes from sp, 2 m and 10 m fields when present.
 */
export function buildGridSoundings(fields: RunFields): PackedSoundings {
  const pressures = [...fields.isobaric.keys()].filter((p) => p >= 10 && p <= 1100).sort((a, b) => b - a);
  const { surface } = fields;
  const count = fields.pointCount;
  const starts = new Int32Array(count + 1);
  const elevationM = new Float32Array(count).fill(NaN);
  const usable = new Uint8Array(count);
  const chunks: number[] = [];
  let belowGroundDropped = 0;
  const row: number[] = [];
  for (let point = 0; point < count; point++) {
    starts[point] = chunks.length / VALUES_PER_LEVEL;
    row.length = 0;
    const surfacePressureHpa = at(surface.pressurePa, point) / 100;
    const orography = at(surface.orographyM, point);
    const hasSurfacePressure = Number.isFinite(surfacePressureHpa) && surfacePressureHpa > 10;
    let lowest: SoundingLevel | null = null;
    for (const pressureHpa of pressures) {
      const level = fields.isobaric.get(pressureHpa)!;
      const temperatureK = at(level.temperatureK, point);
      const heightM = at(level.heightM, point);
      if (hasSurfacePressure ? pressureHpa >= surfacePressureHpa - 1 : Number.isFinite(orography) && heightM <= orography) {
        belowGroundDropped++;
        continue;
      }
      const temperatureC = temperatureK - 273.15;
      if (!usableTemperature(temperatureC) || !Number.isFinite(heightM)) continue;
      const u = at(level.uMs, point);
      const v = at(level.vMs, point);
      const dewpoint = dewpointC(level, point, pressureHpa, temperatureK);
      row.push(pressureHpa, heightM, temperatureC, dewpoint, u, v);
      lowest ??= { pressureHpa, heightM, temperatureC, dewpointC: dewpoint, uMs: u, vMs: v };
    }
    // The surface level, under the lowest isobaric level above ground.
    const temperature2mC = at(surface.temperature2mK, point) - 273.15;
    let groundM = orography;
    if (hasSurfacePressure && usableTemperature(temperature2mC) && lowest && surfacePressureHpa <= 1100) {
      if (!Number.isFinite(groundM)) {
        groundM = lowest.heightM - layerThickness(surfacePressureHpa, lowest.pressureHpa, temperature2mC + 273.15, lowest.temperatureC + 273.15);
      }
      const temperatureK = temperature2mC + 273.15;
      let dewpoint = at(surface.dewpoint2mK, point);
      const rh2 = at(surface.relativeHumidity2mPct, point);
      if (!Number.isFinite(dewpoint) && Number.isFinite(rh2) && rh2 > 0) dewpoint = dewpointFromRelativeHumidity(temperatureK, Math.min(rh2, 100));
      const dewpoint2mC = Number.isFinite(dewpoint) ? Math.min(dewpoint, temperatureK) - 273.15 : NaN;
      if (Number.isFinite(groundM) && groundM < lowest.heightM) {
        chunks.push(surfacePressureHpa, groundM, temperature2mC, dewpoint2mC, at(surface.u10mMs, point), at(surface.v10mMs, point));
      }
    }
    for (const value of row) chunks.push(value);
    elevationM[point] = Number.isFinite(groundM) ? groundM : lowest ? lowest.heightM : NaN;
    const levelCount = chunks.length / VALUES_PER_LEVEL - (starts[point]!);
    const top = chunks[chunks.length - VALUES_PER_LEVEL];
    usable[point] = levelCount >= MIN_LEVELS && top !== undefined && top <= TOP_PRESSURE_MAX_HPA ? 1 : 0;
  }
  starts[count] = chunks.length / VALUES_PER_LEVEL;
  return { levels: Float32Array.from(chunks), starts, elevationM, usable, belowGroundDropped };
}

/** Geopotential (m² s⁻²) to geopotential height (gpm), with standard gravity. */
export function geopotentialToHeight(values: Float32Array): Float32Array {
  const out = new Float32Array(values.length);
  for (let i = 0; i < values.length; i++) out[i] = (values[i]!) / GRAVITY;
  return out;
}

/** Packed levels (six Float32 per level) back to sounding levels (NaN → null for dewpoint and wind). */
export function unpackLevels(packed: Float32Array): SoundingLevel[] {
  const levels: SoundingLevel[] = [];
  const orNull = (value: number) => (Number.isFinite(value) ? value : null);
  for (let i = 0; i + VALUES_PER_LEVEL <= packed.length; i += VALUES_PER_LEVEL) {
    levels.push({
      pressureHpa: packed[i]!,
      heightM: packed[i + 1]!,
      temperatureC: packed[i + 2]!,
      dewpointC: orNull(packed[i + 3]!),
      uMs: orNull(packed[i + 4]!),
      vMs: orNull(packed[i + 5]!),
    });
  }
  return levels;
}

/** Levels `from..to` (level numbers) of a packed array as stored bytes: little-endian Float32. */
export function levelBytes(levels: Float32Array, from: number, to: number): Uint8Array {
  const bytes = new Uint8Array((to - from) * VALUES_PER_LEVEL * 4);
  const view = new DataView(bytes.buffer);
  for (let i = from * VALUES_PER_LEVEL, offset = 0; i < to * VALUES_PER_LEVEL; i++, offset += 4) view.setFloat32(offset, levels[i]!, true);
  return bytes;
}

/** Stored bytes back to packed Float32 levels. */
export function levelsFromBytes(bytes: Uint8Array): Float32Array {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const levels = new Float32Array(Math.floor(bytes.byteLength / 4));
  for (let i = 0; i < levels.length; i++) levels[i] = view.getFloat32(i * 4, true);
  return levels;
}
