/**
 * Reads a GRIB2 file through ecCodes' command-line tools (no GRIB decoding of our own):
 * `grib_get` lists the messages' keys, `grib_get_data` streams latitude, longitude and value
 * of every point. Each tool runs as a child process with a time limit and an output limit.
 */
import { execFile, spawn } from 'node:child_process';
import { err, ok, type Result } from '../../../shared/result';

/** Limits of one GRIB file (each named so a refusal can say which one was hit). */
export const gribLimits = {
  /** Largest file taken, bytes. */
  maxFileBytes: 1024 * 1024 * 1024,
  /** Most messages (fields) in one file. */
  maxMessages: 5000,
  /** Most grid points of one field. */
  maxPointsPerMessage: 4_000_000,
  /** Time allowed to list the messages, ms. */
  listTimeoutMs: 60_000,
  /** Time allowed to stream every value, ms. */
  dataTimeoutMs: 300_000,
  /** Text allowed per value line of grib_get_data ("lat lon value\n"), bytes. */
  maxBytesPerValueLine: 64,
} as const;

/** The keys read from every message, in this order. */
const messageKeys = [
  'shortName', 'typeOfLevel', 'level', 'dataDate', 'dataTime', 'endStep', 'validityDate', 'validityTime',
  'gridType', 'Ni', 'Nj', 'numberOfValues', 'md5GridSection', 'centre', 'jPointsAreConsecutive', 'edition',
] as const;

/** One message (field) of the file, as ecCodes describes it. */
export interface GribMessage {
  shortName: string;
  typeOfLevel: string;
  level: number;
  /** Cycle (reference) time, ISO 8601 UTC. */
  cycleTime: string;
  /** Forecast hour (end of the step, hours). */
  forecastHour: number;
  validTime: string;
  gridType: string;
  ni: number;
  nj: number;
  numberOfValues: number;
  gridHash: string;
  centre: string;
  jPointsAreConsecutive: boolean;
  edition: number;
}

/** Why decoding failed, in words for the intake page. */
export interface DecodeFailure {
  reason: string;
}

function isoFrom(date: string, time: string): string | null {
  if (!/^\d{8}$/.test(date) || !/^\d{1,4}$/.test(time)) return null;
  const hhmm = time.padStart(4, '0');
  const iso = `${date.slice(0, 4)}-${date.slice(4, 6)}-${date.slice(6, 8)}T${hhmm.slice(0, 2)}:${hhmm.slice(2, 4)}:00.000Z`;
  return Number.isNaN(Date.parse(iso)) ? null : new Date(iso).toISOString();
}

/** The first error line a tool printed (ecCodes prints some errors on standard output), for a failure reason. */
function toolMessage(stderr: string, fallback: string, stdout = ''): string {
  const fromOutput = stdout.split('\n').find((l) => /ERROR/.test(l)) ?? '';
  const line = [...stderr.split('\n'), fromOutput].map((l) => l.replace(/["\t]/g, '').replace(/^(ECCODES )?ERROR\s*:\s*/i, '').trim()).find((l) => l.length > 0);
  const text = line ? line.slice(0, 300) : fallback;
  return /unreadable|truncat|end of (file|resource)|wrong length|7777/i.test(text) ? `${text} (the file looks truncated or damaged)` : text;
}

/**
 * List the messages of a GRIB file.
 * @returns one entry per message, or the reason the file cannot be read
 */
export function listGribMessages(filePath: string, signal?: AbortSignal): Promise<Result<GribMessage[], DecodeFailure>> {
  return new Promise((resolve) => {
    execFile(
      'grib_get',
      ['-s', 'stepUnits=h', '-p', messageKeys.join(','), filePath],
      { timeout: gribLimits.listTimeoutMs, maxBuffer: gribLimits.maxMessages * 400, signal },
      (error, stdout, stderr) => {
        const text = String(stdout);
        if (error) {
          const killed = 'killed' in error && error.killed === true;
          if (signal?.aborted) return resolve(err({ reason: 'The intake was cancelled.' }));
          if (killed) return resolve(err({ reason: `Listing the GRIB messages took longer than ${gribLimits.listTimeoutMs / 1000} s or printed too much.` }));
          return resolve(err({ reason: `ecCodes could not read the file as GRIB: ${toolMessage(String(stderr), 'no readable message', text)}.` }));
        }
        const lines = text.split('\n').filter((line) => line.trim().length > 0);
        if (lines.length === 0) return resolve(err({ reason: 'The file holds no GRIB message.' }));
        if (lines.length > gribLimits.maxMessages) return resolve(err({ reason: `The file holds ${lines.length} messages; at most ${gribLimits.maxMessages} are taken.` }));
        const messages: GribMessage[] = [];
        for (const [index, line] of lines.entries()) {
          const parts = line.trim().split(/\s+/);
          const get = (key: (typeof messageKeys)[number]) => parts[messageKeys.indexOf(key)] ?? '';
          const cycleTime = isoFrom(get('dataDate'), get('dataTime'));
          const validTime = isoFrom(get('validityDate'), get('validityTime'));
          const numbers = { level: Number(get('level')), forecastHour: Number(get('endStep')), ni: Number(get('Ni')), nj: Number(get('Nj')), numberOfValues: Number(get('numberOfValues')), edition: Number(get('edition')) };
          if (parts.length !== messageKeys.length || !cycleTime || !validTime || Object.values(numbers).some((n) => !Number.isFinite(n))) {
            return resolve(err({ reason: `Message ${index + 1} lacks its date, step or grid keys (${get('shortName') || 'unknown field'}).` }));
          }
          if (numbers.edition !== 2) return resolve(err({ reason: `Message ${index + 1} is GRIB edition ${numbers.edition}; only GRIB2 is taken.` }));
          if (numbers.numberOfValues > gribLimits.maxPointsPerMessage) {
            return resolve(err({ reason: `Message ${index + 1} has ${numbers.numberOfValues} points; at most ${gribLimits.maxPointsPerMessage} are taken.` }));
          }
          messages.push({
            shortName: get('shortName'), typeOfLevel: get('typeOfLevel'), cycleTime, validTime, gridType: get('gridType'),
            gridHash: get('md5GridSection'), centre: get('centre'), jPointsAreConsecutive: get('jPointsAreConsecutive') === '1',
            ...numbers,
          });
        }
        resolve(ok(messages));
      },
    );
  });
}

/** Where the values of one message go: called once per message with its points, in grib_get_data's order. */
export interface ValueSink {
  /** The first message's coordinates (every message shares the grid); a reason stops the decoding. */
  onCoordinates(latitudes: Float64Array, longitudes: Float64Array): string | null;
  /** Called with the slot of each wanted point (−1: skip), after onCoordinates. */
  slotOf(pointIndex: number): number;
  onValue(messageIndex: number, slot: number, value: number): void;
}

/**
 * Stream every message's values through `grib_get_data`, one process for the whole file.
 * Missing values arrive as NaN. The first message's points give the coordinates.
 */
export function streamGribValues(filePath: string, messages: readonly GribMessage[], sink: ValueSink, signal?: AbortSignal): Promise<Result<void, DecodeFailure>> {
  const totalPoints = messages.reduce((sum, message) => sum + message.numberOfValues, 0);
  const maxBytes = totalPoints * gribLimits.maxBytesPerValueLine + messages.length * 64;
  const firstCount = messages[0]?.numberOfValues ?? 0;
  return new Promise((resolve) => {
    const child = spawn('grib_get_data', ['-m', 'nan', '-F', '%.8g', '-L', '%.5f %.5f', filePath], { stdio: ['ignore', 'pipe', 'pipe'] });
    let failure: string | null = null;
    let stderr = '';
    let bytes = 0;
    let messageIndex = -1;
    let point = 0;
    let rest = '';
    const latitudes = new Float64Array(firstCount);
    const longitudes = new Float64Array(firstCount);
    // The first message's values wait until its coordinates fix which points are wanted.
    const firstValues: number[] = [];
    const flushFirst = () => {
      for (let index = 0; index < firstValues.length; index++) {
        const slot = sink.slotOf(index);
        if (slot >= 0) sink.onValue(0, slot, firstValues[index]!);
      }
      firstValues.length = 0;
    };
    const stop = (reason: string) => {
      failure ??= reason;
      child.kill('SIGKILL');
    };
    const timer = setTimeout(() => stop(`Reading the GRIB values took longer than ${gribLimits.dataTimeoutMs / 1000} s.`), gribLimits.dataTimeoutMs);
    const onAbort = () => stop('The intake was cancelled.');
    signal?.addEventListener('abort', onAbort, { once: true });

    const finishMessage = () => {
      if (messageIndex < 0) return;
      const expected = messages[messageIndex]?.numberOfValues ?? 0;
      if (point !== expected) stop(`Message ${messageIndex + 1} gave ${point} values where ${expected} were declared; the file looks truncated or damaged.`);
      if (messageIndex === 0 && failure === null) {
        const refusal = sink.onCoordinates(latitudes, longitudes);
        if (refusal !== null) stop(refusal);
      }
    };

    const handleLine = (line: string) => {
      if (line.length === 0) return;
      if (line.charCodeAt(0) === 76 /* L */ && line.startsWith('Latitude')) {
        finishMessage();
        messageIndex++;
        point = 0;
        if (messageIndex >= messages.length) stop('ecCodes printed more messages than it listed.');
        return;
      }
      if (messageIndex < 0) return;
      if (messageIndex === 0) {
        const [lat, lon, value] = line.trim().split(/\s+/);
        if (point < firstCount) {
          latitudes[point] = Number(lat);
          longitudes[point] = Number(lon);
        }
        firstValues.push(Number(value));
      } else {
        const slot = sink.slotOf(point);
        if (slot >= 0) {
          const space = line.lastIndexOf(' ');
          sink.onValue(messageIndex, slot, Number(line.slice(space + 1)));
        }
      }
      point++;
    };

    child.stdout.setEncoding('latin1');
    child.stdout.on('data', (chunk: string) => {
      if (failure !== null) return;
      bytes += chunk.length;
      if (bytes > maxBytes) return stop(`ecCodes printed more than the ${maxBytes} bytes this file can need; it was stopped.`);
      const text = rest + chunk;
      let start = 0;
      let newline = text.indexOf('\n', start);
      while (newline >= 0) {
        handleLine(text.slice(start, newline));
        if (failure !== null) return;
        start = newline + 1;
        newline = text.indexOf('\n', start);
      }
      rest = text.slice(start);
      if (messageIndex > 0 && firstValues.length > 0) flushFirst();
    });
    child.stderr.setEncoding('utf8');
    child.stderr.on('data', (chunk: string) => {
      if (stderr.length < 4096) stderr += chunk;
    });
    child.on('error', (error) => stop(`ecCodes could not be started: ${error.message}.`));
    child.on('close', (code) => {
      clearTimeout(timer);
      signal?.removeEventListener('abort', onAbort);
      if (failure === null && rest.length > 0) handleLine(rest);
      if (failure === null && code !== 0) failure = `ecCodes could not read every value: ${toolMessage(stderr, `exit status ${code}`)}.`;
      if (failure === null) finishMessage();
      if (failure === null && messageIndex !== messages.length - 1) failure = `ecCodes gave values for ${messageIndex + 1} of ${messages.length} messages; the file looks truncated or damaged.`;
      if (failure === null && firstValues.length > 0) flushFirst();
      resolve(failure === null ? ok(undefined) : err({ reason: failure }));
    });
  });
}
