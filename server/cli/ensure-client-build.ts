import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * `npm start` runs this before the server: it builds the client into dist/ only when dist/ is
 * missing or was built from other sources, so a restart with unchanged sources starts at once.
 * The sources are everything the Vite build reads from the repository: the client tree, the
 * public assets, the page shell, the build and TypeScript settings and the locked dependencies.
 */
export const CLIENT_SOURCES = ['src', 'public', 'index.html', 'vite.config.ts', 'tsconfig.json', 'package-lock.json'] as const;

/** The stamp file written into dist/ after a successful build: the hash of the sources it came from. */
export const STAMP_FILE = '.client-sources.sha256';

function filesUnder(root: string, entry: string): string[] {
  const full = path.join(root, entry);
  if (!existsSync(full)) return [];
  if (!statSync(full).isDirectory()) return [entry];
  return readdirSync(full, { recursive: true, withFileTypes: true })
    .filter((item) => item.isFile())
    .map((item) => path.relative(root, path.join(item.parentPath, item.name)));
}

/** SHA-256 over the client sources' relative paths and contents, in a stable order. */
export function clientSourcesHash(root: string, sources: readonly string[] = CLIENT_SOURCES): string {
  const hash = createHash('sha256');
  const files = sources.flatMap((entry) => filesUnder(root, entry)).map((file) => file.split(path.sep).join('/')).sort();
  for (const file of files) {
    hash.update(`${file}\0`);
    hash.update(readFileSync(path.join(root, file)));
    hash.update('\0');
  }
  return hash.digest('hex');
}

/** The hash recorded by the last build in `outDir`, or null when there is none. */
export function readStamp(outDir: string): string | null {
  const file = path.join(outDir, STAMP_FILE);
  return existsSync(file) && existsSync(path.join(outDir, 'index.html')) ? readFileSync(file, 'utf8').trim() : null;
}

export type BuildOutcome = 'current' | 'built';

/**
 * Runs `build` when `outDir` holds no build of the current sources, then records their hash.
 * The hash is taken before the build, so an edit made during a build triggers the next one.
 */
export async function ensureClientBuild(root: string, outDir: string, build: () => Promise<void>): Promise<BuildOutcome> {
  const current = clientSourcesHash(root);
  if (readStamp(outDir) === current) return 'current';
  await build();
  writeFileSync(path.join(outDir, STAMP_FILE), `${current}\n`);
  return 'built';
}

async function main(): Promise<void> {
  const root = path.resolve(import.meta.dirname, '../..');
  const outDir = path.join(root, 'dist');
  const outcome = await ensureClientBuild(root, outDir, async () => {
    process.stdout.write('Building the client (sources changed since the last build)…\n');
    const { build } = await import('vite');
    await build({ root, logLevel: 'warn' });
  });
  if (outcome === 'current') process.stdout.write('The client build in dist/ is current.\n');
}

if (process.argv[1] && path.resolve(process.argv[1]) === import.meta.filename) await main();
