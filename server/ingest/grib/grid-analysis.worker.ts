/**
 * Worker-thread task of GRIB intake: analyse a batch of packed grid soundings and return
 * their key figures as numbers (NaN for null), so 40,000 analyses stay off the event loop.
 * Pure: no database.
 */
import { analyzeSounding, keyFigureKeys, keyFiguresFromAnalysis } from '../../../shared/sounding';
import { unpackLevels, VALUES_PER_LEVEL } from './build-soundings';

/** A batch: levels of `starts.length - 1` soundings, packed as in build-soundings.ts. */
export interface GridAnalysisTask {
  levels: Float32Array;
  starts: Int32Array;
  latitudes: Float64Array;
}

/** Per sounding: `keyFigureKeys.length` figures in that order (NaN: null), and the flag count. */
export interface GridAnalysisResult {
  figures: Float32Array;
  flagCounts: Int16Array;
  /** Soundings the engine could not analyse (their figures are all NaN). */
  failed: number;
}

/** Analyse every sounding of the batch. */
export function analyseGridBatch(task: GridAnalysisTask): GridAnalysisResult {
  const count = task.starts.length - 1;
  const keyCount = keyFigureKeys.length;
  const figures = new Float32Array(count * keyCount).fill(NaN);
  const flagCounts = new Int16Array(count);
  let failed = 0;
  for (let index = 0; index < count; index++) {
    const packed = task.levels.subarray((task.starts[index]!) * VALUES_PER_LEVEL, (task.starts[index + 1]!) * VALUES_PER_LEVEL);
    try {
      const keyFigures = keyFiguresFromAnalysis(analyzeSounding(unpackLevels(packed), { latitude: task.latitudes[index] ?? null }));
      for (let key = 0; key < keyCount; key++) {
        const value = keyFigures[keyFigureKeys[key]!];
        if (typeof value === 'number' && Number.isFinite(value)) figures[index * keyCount + key] = value;
      }
      flagCounts[index] = Math.min(keyFigures.flagCount, 32767);
    } catch {
      failed++;
    }
  }
  return { figures, flagCounts, failed };
}

export default analyseGridBatch;
