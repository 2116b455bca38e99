/**
 * `npm run -s boundaries`: writes the offline base map's boundary levels to public/boundaries/
 * (served as static files). Run it again only when us-atlas or the levels change.
 */
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { gzipSync } from 'node:zlib';
import { BOUNDARY_LEVELS, boundaryLevel } from './boundary-levels';

const require = createRequire(import.meta.url);
const source = JSON.parse(readFileSync(require.resolve('us-atlas/counties-10m.json'), 'utf8'));
mkdirSync('public/boundaries', { recursive: true });
for (const level of BOUNDARY_LEVELS) {
  const text = JSON.stringify(boundaryLevel(source, level));
  writeFileSync(`public/boundaries/${level.name}.json`, text);
  console.log(`boundaries ${level.name}: ${(text.length / 1024).toFixed(0)} KB, ${(gzipSync(text).length / 1024).toFixed(0)} KB gzip`);
}
