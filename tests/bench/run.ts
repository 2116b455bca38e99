/**
 * `npm run -s bench`: prints one line per figure, `name: value unit`.
 * Single process, single thread (one core). Figures are listed in figures.ts.
 */
import { BENCH_FIGURES } from './figures';

for (const figure of BENCH_FIGURES) {
  console.log(`${figure.name}: ${await figure.measure()} ${figure.unit}`);
}
