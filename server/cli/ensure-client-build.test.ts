import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { ensureClientBuild } from './ensure-client-build';

let root: string;
let outDir: string;
let builds: number;

/** Stands in for `vite build`: empties dist/ and writes a page, as Vite does. */
async function fakeBuild(): Promise<void> {
  builds += 1;
  rmSync(outDir, { recursive: true, force: true });
  mkdirSync(outDir, { recursive: true });
  writeFileSync(path.join(outDir, 'index.html'), `<html>build ${builds}</html>`);
}

beforeEach(() => {
  root = mkdtempSync(path.join(tmpdir(), 'stormdraft-client-build-'));
  outDir = path.join(root, 'dist');
  builds = 0;
  mkdirSync(path.join(root, 'src', 'features'), { recursive: true });
  writeFileSync(path.join(root, 'src', 'main.tsx'), 'export const a = 1;\n');
  writeFileSync(path.join(root, 'src', 'features', 'page.tsx'), 'export const b = 2;\n');
  writeFileSync(path.join(root, 'index.html'), '<div id="root"></div>\n');
  writeFileSync(path.join(root, 'package-lock.json'), '{}\n');
});

afterEach(() => rmSync(root, { recursive: true, force: true }));

describe('ensureClientBuild', () => {
  it('when there is no dist/, then it builds', async () => {
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
    expect(builds).toBe(1);
  });

  it('when the sources are unchanged since the last build, then it does not build again', async () => {
    await ensureClientBuild(root, outDir, fakeBuild);
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('current');
    expect(builds).toBe(1);
  });

  it('when a file deep in src/ changes, then it rebuilds', async () => {
    await ensureClientBuild(root, outDir, fakeBuild);
    writeFileSync(path.join(root, 'src', 'features', 'page.tsx'), 'export const b = 3;\n');
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
    expect(builds).toBe(2);
  });

  it('when a source file is added or the lockfile changes, then it rebuilds', async () => {
    await ensureClientBuild(root, outDir, fakeBuild);
    writeFileSync(path.join(root, 'src', 'new-page.tsx'), 'export const c = 4;\n');
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
    writeFileSync(path.join(root, 'package-lock.json'), '{"lockfileVersion":3}\n');
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
    expect(builds).toBe(3);
  });

  it('when a file is moved to another folder with the same content, then it rebuilds', async () => {
    await ensureClientBuild(root, outDir, fakeBuild);
    rmSync(path.join(root, 'src', 'features', 'page.tsx'));
    writeFileSync(path.join(root, 'src', 'page.tsx'), 'export const b = 2;\n');
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
  });

  it('when dist/ lost its page but kept the stamp, then it rebuilds', async () => {
    await ensureClientBuild(root, outDir, fakeBuild);
    rmSync(path.join(outDir, 'index.html'));
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
  });

  it('when the build fails, then no stamp is written and the next start tries again', async () => {
    const failing = async () => {
      await fakeBuild();
      throw new Error('build failed');
    };
    await expect(ensureClientBuild(root, outDir, failing)).rejects.toThrow('build failed');
    expect(await ensureClientBuild(root, outDir, fakeBuild)).toBe('built');
  });
});
