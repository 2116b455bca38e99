import { analyzeSounding, parseSoundingCsv } from '../../shared/sounding';
import { bulletinInitialJsKbGzip } from './bulletin-bundle';
import { matchTenThousandSubscribers, smtpMessagesPerSecond } from './distribution';
import { evidenceSixAreas } from './evidence';
import { liveEvidenceSixAreas } from './live-evidence';
import { gridEvidenceSixAreas } from './grid-evidence';
import { evidenceTenThousandVertices, healthDuringPublish } from './heavy-work';
import { verifyOneIssuance } from './verification';
import { gribBytesPerSounding, gribIngestFortyThousand } from './grib';
import { assertParses, fixtureTexts, oddSoundingTexts, syntheticSounding } from './soundings';

/** One benchmark figure: how to measure it and the unit it is printed in. */
export interface BenchFigure {
  name: string;
  unit: string;
  /** Runs the measurement and returns the value (some figures, like SMTP, are asynchronous). */
  measure(): number | Promise<number>;
}

/**
 * Runs per second of `work`: after a warm-up, five rounds of about one second each; the best
 * round is reported, which filters out time stolen by other processes on a shared machine
 * (the usual practice of timing tools, e.g. Python's timeit).
 */
function runsPerSecond(work: (iteration: number) => void, rounds = 5, secondsPerRound = 1): number {
  for (let i = 0; i < 500; i++) work(i);
  let best = 0;
  let iteration = 0;
  for (let round = 0; round < rounds; round++) {
    let runs = 0;
    const start = performance.now();
    let elapsed = 0;
    while (elapsed < secondsPerRound * 1000) {
      for (let i = 0; i < 20; i++) work(iteration++);
      runs += 20;
      elapsed = performance.now() - start;
    }
    best = Math.max(best, runs / (elapsed / 1000));
  }
  return best;
}

/** Full analyses per second (three parcels, environment, kinematics, composites) of one size. */
function analysesPerSecond(levelCount: number): BenchFigure {
  return {
    name: `analyses_per_s_${levelCount}_levels`,
    unit: 'analyses/s',
    measure() {
      const soundings = Array.from({ length: 20 }, (_, variant) => syntheticSounding(levelCount, variant));
      let sink = 0;
      const rate = runsPerSecond((i) => {
        sink += analyzeSounding(soundings[i % soundings.length] ?? []).mostUnstable.cape;
      });
      if (!Number.isFinite(sink)) throw new Error('analysis returned a non-finite CAPE');
      return Math.round(rate);
    },
  };
}

/**
 * Wall time to parse and analyse 2000 CSV soundings (the three observed fixtures in turn,
 * 53–145 levels each), best of three runs after a warm-up.
 */
const twoThousandSoundings: BenchFigure = {
  name: 'ms_for_2000_soundings',
  unit: 'ms',
  measure() {
    const texts = fixtureTexts();
    assertParses(texts);
    const once = (): number => {
      let sink = 0;
      for (let i = 0; i < 2000; i++) {
        const { name, text } = texts[i % texts.length] as { name: string; text: string };
        const parsed = parseSoundingCsv(text, name);
        if (parsed.ok) sink += analyzeSounding(parsed.value.levels).surfaceBased.cape;
      }
      return sink;
    };
    once(); // warm-up
    let best = Infinity;
    for (let run = 0; run < 3; run++) {
      const start = performance.now();
      once();
      best = Math.min(best, performance.now() - start);
    }
    return Math.round(best);
  },
};

/**
 * The slowest single file among odd but legal soundings (superadiabatic surface, sparse,
 * truncated, 5,000 levels, isothermal, saturated, and the three observed fixtures): parse and
 * full analysis, the median of 5 runs per file after a warm-up, in ms.
 */
const slowestFile: BenchFigure = {
  name: 'slowest_file_ms',
  unit: 'ms',
  measure() {
    const texts = [...oddSoundingTexts(), ...fixtureTexts()];
    assertParses(texts);
    let slowest = 0;
    for (const { name, text } of texts) {
      const runs: number[] = [];
      for (let run = 0; run < 7; run++) {
        const start = performance.now();
        const parsed = parseSoundingCsv(text, name);
        if (parsed.ok) analyzeSounding(parsed.value.levels, { latitude: parsed.value.metadata.latitude });
        if (run >= 2) runs.push(performance.now() - start);
      }
      runs.sort((a, b) => a - b);
      slowest = Math.max(slowest, runs[2] ?? 0);
    }
    return Math.round(slowest * 10) / 10;
  },
};

/** Every figure `npm run -s bench` prints, in order. Add new figures here. */
/** JavaScript (gzip) the public bulletin loads before it can show anything; issue 13's budget is 150 KB. */
const bulletinInitialJs: BenchFigure = { name: 'bulletin_initial_js_kb_gzip', unit: 'KB', measure: bulletinInitialJsKbGzip };

export const BENCH_FIGURES: BenchFigure[] = [analysesPerSecond(100), analysesPerSecond(1000), analysesPerSecond(5000), slowestFile, twoThousandSoundings, evidenceSixAreas, liveEvidenceSixAreas, gridEvidenceSixAreas, evidenceTenThousandVertices, matchTenThousandSubscribers, smtpMessagesPerSecond, healthDuringPublish, bulletinInitialJs, verifyOneIssuance, gribIngestFortyThousand, gribBytesPerSounding];
