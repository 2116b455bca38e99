import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { BOUNDARY_LEVELS, boundaryLevel } from './boundary-levels';

const require = createRequire(import.meta.url);

describe('boundary levels', () => {
  it('when the levels are rebuilt from us-atlas, they equal the files shipped in public/boundaries', () => {
    const source = JSON.parse(readFileSync(require.resolve('us-atlas/counties-10m.json'), 'utf8'));
    for (const level of BOUNDARY_LEVELS) {
      expect(readFileSync(`public/boundaries/${level.name}.json`, 'utf8'), `${level.name} is stale: run npm run -s boundaries`).toBe(JSON.stringify(boundaryLevel(source, level)));
    }
  });

  it('when a page loads one level, it stays within the 200 KB gzip boundary budget (issue 13) and below the source file', () => {
    const sourceGzip = gzipSync(readFileSync(require.resolve('us-atlas/counties-10m.json'))).length;
    for (const level of BOUNDARY_LEVELS) {
      const gzip = gzipSync(readFileSync(`public/boundaries/${level.name}.json`)).length;
      expect(gzip).toBeLessThanOrEqual(200 * 1024);
      expect(gzip).toBeLessThan(sourceGzip);
    }
  });
});
