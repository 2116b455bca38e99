import { BENCH_FIGURES } from './figures';

// Only the sounding-analysis figures (the first four), for quick engine work.
const wanted = process.argv.slice(2);
for (const figure of BENCH_FIGURES.slice(0, 4)) {
  if (wanted.length > 0 && !wanted.some((w) => figure.name.includes(w))) continue;
  console.log(`${figure.name}: ${await figure.measure()} ${figure.unit}`);
}
