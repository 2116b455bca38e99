/**
 * Reads radiosonde soundings out of ecCodes' structured JSON dump (`bufr_dump -js`) of BUFR
 * (WMO FM 94) messages built on the TEMP sequences (e.g. 309052): station, position, launch time
 * and, per level, pressure, geopotential height, temperature, dewpoint and wind. Pure: no I/O.
 *
 * The dump nests each element's successors inside an array after it; walking the tree in
 * document order gives the elements in descriptor order. An uncompressed message holds one such
 * tree per subset; a compressed message holds one tree whose values are arrays (one per subset)
 * or a single value shared by every subset.
 */
import { err, ok, type Result } from '../../../shared/result';

/** One level as the message carries it (BUFR units); null when the element is missing. */
export interface BufrLevel {
  pressurePa: number;
  geopotentialHeightM: number | null;
  temperatureK: number | null;
  dewpointK: number | null;
  windDirectionDeg: number | null;
  windSpeedMs: number | null;
}

/** One subset: one radiosonde ascent. */
export interface BufrRadiosonde {
  /** WMO block and station number ("72901"), or the ship/mobile identifier; "" when neither. */
  station: string;
  latitude: number | null;
  longitude: number | null;
  /** Height of the station ground above mean sea level, m. */
  elevationM: number | null;
  /** Launch time, ISO 8601 UTC; null when the message does not give a whole date and time. */
  launchTime: string | null;
  /** Levels in the order of the message, merged where a pressure repeats. */
  levels: BufrLevel[];
  /** Levels left out (no pressure, or a repeat that only carries wind shear). */
  levelsWithoutTemperature: number;
}

export interface ReadLimits {
  /** Most subsets (soundings) taken from one file. */
  maxSubsets: number;
  /** Most levels per subset. */
  maxLevels: number;
}

export const DEFAULT_READ_LIMITS: ReadLimits = { maxSubsets: 500, maxLevels: 5000 };

interface Element {
  key: string;
  value: unknown;
}

function isElement(node: unknown): node is Element {
  return typeof node === 'object' && node !== null && !Array.isArray(node) && 'key' in node && typeof node.key === 'string';
}

/** The elements of a tree in document order (iterative: the nesting grows with the message). */
function flatten(tree: unknown): Element[] {
  const out: Element[] = [];
  const stack: unknown[] = [tree];
  while (stack.length > 0) {
    const node = stack.pop();
    if (Array.isArray(node)) {
      for (let i = node.length - 1; i >= 0; i--) stack.push(node[i]);
    } else if (isElement(node)) {
      out.push(node);
    }
  }
  return out;
}

const numberOrNull = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);
const pad = (value: number, width: number) => String(Math.trunc(value)).padStart(width, '0');

/** The value of an element for subset `index` (compressed messages carry one value per subset). */
function valueFor(element: Element, index: number, compressed: boolean): unknown {
  if (compressed && Array.isArray(element.value)) return element.value[index] ?? null;
  return element.value;
}

function launchTimeOf(parts: Record<'year' | 'month' | 'day' | 'hour' | 'minute' | 'second', number | null>): string | null {
  const { year, month, day, hour, minute } = parts;
  const second = parts.second ?? 0;
  if (year === null || month === null || day === null || hour === null || minute === null) return null;
  if (month < 1 || month > 12 || day < 1 || day > 31 || hour > 23 || minute > 59 || second > 59.999 || year < 1900 || year > 2200) return null;
  const date = new Date(Date.UTC(year, month - 1, day, hour, minute, Math.floor(second)));
  if (date.getUTCDate() !== day) return null;
  return date.toISOString();
}

const levelKeys: Record<string, keyof Omit<BufrLevel, 'pressurePa'>> = {
  nonCoordinateGeopotentialHeight: 'geopotentialHeightM',
  geopotentialHeight: 'geopotentialHeightM',
  airTemperature: 'temperatureK',
  dewpointTemperature: 'dewpointK',
  windDirection: 'windDirectionDeg',
  windSpeed: 'windSpeedMs',
};

/** One subset's elements → a radiosonde; `Error` text when a limit is passed. */
function readSubset(elements: Element[], index: number, compressed: boolean, limits: ReadLimits): Result<BufrRadiosonde, string> {
  const header: Record<string, number | string | null> = {};
  const levels: BufrLevel[] = [];
  let current: BufrLevel | null = null;
  let levelCount = 0;
  for (const element of elements) {
    const value = valueFor(element, index, compressed);
    if (element.key === 'pressure') {
      levelCount++;
      if (levelCount > limits.maxLevels) return err(`a sounding has more than ${limits.maxLevels} levels, the limit per sounding`);
      const pressurePa = numberOrNull(value);
      current = pressurePa === null ? null : { pressurePa, geopotentialHeightM: null, temperatureK: null, dewpointK: null, windDirectionDeg: null, windSpeedMs: null };
      if (current) levels.push(current);
      continue;
    }
    const field = levelKeys[element.key];
    if (field && levelCount > 0) {
      if (current) current[field] = numberOrNull(value);
      continue;
    }
    // Station, position and launch time come before the first level; the first occurrence counts.
    if (levelCount === 0 && !(element.key in header)) header[element.key] = typeof value === 'string' ? value : numberOrNull(value);
  }
  const num = (key: string) => numberOrNull(header[key]);
  const block = num('blockNumber');
  const stationNumber = num('stationNumber');
  const mobile = typeof header.shipOrMobileLandStationIdentifier === 'string' ? header.shipOrMobileLandStationIdentifier.trim() : '';
  const station = block !== null && stationNumber !== null ? `${pad(block, 2)}${pad(stationNumber, 3)}` : mobile;
  const latitude = num('latitude');
  const longitude = num('longitude');

  // Merge repeats of a pressure (a standard level that is also a significant level).
  const byPressure = new Map<number, BufrLevel>();
  for (const level of levels) {
    const seen = byPressure.get(level.pressurePa);
    if (!seen) {
      byPressure.set(level.pressurePa, { ...level });
      continue;
    }
    for (const key of Object.values(levelKeys)) seen[key] ??= level[key];
  }
  const merged = [...byPressure.values()];
  const withTemperature = merged.filter((level) => level.temperatureK !== null);
  return ok({
    station,
    latitude: latitude !== null && Math.abs(latitude) <= 90 ? latitude : null,
    longitude: longitude !== null && Math.abs(longitude) <= 180 ? longitude : null,
    elevationM: num('heightOfStationGroundAboveMeanSeaLevel') ?? num('height'),
    launchTime: launchTimeOf({ year: num('year'), month: num('month'), day: num('day'), hour: num('hour'), minute: num('minute'), second: num('second') }),
    levels: withTemperature,
    levelsWithoutTemperature: merged.length - withTemperature.length,
  });
}

/**
 * Every radiosonde (subset) of a `bufr_dump -js` document.
 * @param dump - the parsed JSON (unknown: checked here)
 * @param limits - most subsets per file and levels per subset
 * @returns the soundings in file order, or the reason the document cannot be read
 */
export function readRadiosondes(dump: unknown, limits: ReadLimits = DEFAULT_READ_LIMITS): Result<BufrRadiosonde[], string> {
  if (typeof dump !== 'object' || dump === null || !('messages' in dump) || !Array.isArray(dump.messages)) return err('the decoder returned no messages');
  const soundings: BufrRadiosonde[] = [];
  for (const [messageIndex, message] of dump.messages.entries()) {
    if (!Array.isArray(message)) return err(`message ${messageIndex + 1} is not readable BUFR (${typeof message === 'string' ? message.replace(/^ERROR:\s*/, '') : 'unexpected content'})`);
    const header = new Map<string, unknown>();
    for (const entry of message) if (isElement(entry)) header.set(entry.key, entry.value);
    const data = message.find((entry) => Array.isArray(entry));
    const subsetCount = numberOrNull(header.get('numberOfSubsets')) ?? 0;
    const compressed = header.get('compressedData') === 1;
    if (!Array.isArray(data) || subsetCount < 1) continue;
    if (soundings.length + subsetCount > limits.maxSubsets) return err(`the file holds more than ${limits.maxSubsets} soundings, the limit per file`);
    // Uncompressed: one tree per subset, each an array of its own; otherwise the one tree serves all.
    const trees: unknown[] = !compressed && data.length === subsetCount && data.every((tree) => Array.isArray(tree)) ? data : [data];
    for (let subset = 0; subset < subsetCount; subset++) {
      const tree = trees.length === subsetCount ? trees[subset] : trees[0];
      const read = readSubset(flatten(tree), subset, compressed, limits);
      if (!read.ok) return err(`message ${messageIndex + 1}, subset ${subset + 1}: ${read.error}`);
      soundings.push(read.value);
    }
  }
  if (soundings.length === 0) return err('the file holds no radiosonde soundings (no BUFR subsets with levels)');
  return ok(soundings);
}
