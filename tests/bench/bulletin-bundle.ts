import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { build } from 'vite';

/** The modules the `/bulletin` route needs before it can show anything (see src/app/router.tsx). */
export const bulletinRouteModules = ['src/main.tsx', 'src/app/layouts/public-layout.tsx', 'src/features/bulletin/routes/bulletin.tsx'] as const;

/** What the bench reads of each output chunk of the build (Rolldown's output, as Vite returns it). */
export interface BuiltChunk {
  fileName: string;
  isEntry: boolean;
  moduleIds: readonly string[];
  /** Chunks this one imports statically (loaded with it). */
  imports: readonly string[];
}

/**
 * The JavaScript files a first visit to `/bulletin` loads: the entry chunk, the chunks holding
 * the route modules and, transitively, every chunk those import statically. Chunks reached only
 * through `import()` (the interactive map, the Markdown renderer, staff pages) are not counted:
 * they load later or never.
 */
export function initialChunkFiles(chunks: readonly BuiltChunk[], routeModules: readonly string[]): string[] {
  const byFile = new Map(chunks.map((c) => [c.fileName, c]));
  const roots = chunks.filter((c) => c.isEntry || c.moduleIds.some((id) => routeModules.some((m) => id.replaceAll('\\', '/').endsWith(`/${m}`))));
  const found = new Set(routeModules.filter((m) => chunks.some((c) => c.moduleIds.some((id) => id.replaceAll('\\', '/').endsWith(`/${m}`)))));
  const missing = routeModules.filter((m) => !found.has(m));
  if (missing.length) throw new Error(`no chunk of the build holds ${missing.join(', ')}`);
  const files = new Set<string>();
  const visit = (chunk: BuiltChunk) => {
    if (files.has(chunk.fileName)) return;
    files.add(chunk.fileName);
    for (const imported of chunk.imports) {
      const next = byFile.get(imported);
      if (next) visit(next);
    }
  };
  roots.forEach(visit);
  return [...files].sort();
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

/** The chunks of Vite's build result (one output, or the first of several). */
function chunksOf(result: unknown): BuiltChunk[] {
  const output = Array.isArray(result) ? result[0] : result;
  if (!isRecord(output) || !Array.isArray(output.output)) throw new Error('vite build returned no output to read');
  return output.output.filter(isRecord).flatMap((item) =>
    item.type === 'chunk' && typeof item.fileName === 'string'
      ? [{ fileName: item.fileName, isEntry: item.isEntry === true, moduleIds: Array.isArray(item.moduleIds) ? item.moduleIds.map(String) : [], imports: Array.isArray(item.imports) ? item.imports.map(String) : [] }]
      : [],
  );
}

/** Builds the client into a temporary folder and sums the gzip size of `/bulletin`'s first-load JavaScript, in KB. */
export async function bulletinInitialJsKbGzip(): Promise<number> {
  const outDir = mkdtempSync(join(tmpdir(), 'stormdraft-bench-build-'));
  try {
    const chunks = chunksOf(await build({ logLevel: 'silent', build: { outDir, sourcemap: false, emptyOutDir: true } }));
    const html = readFileSync(join(outDir, 'index.html'), 'utf8');
    const entries = chunks.filter((c) => c.isEntry);
    // index.html is the real entry: the page must load the entry chunk the walk starts from.
    if (entries.length !== 1 || !entries.every((c) => html.includes(c.fileName))) throw new Error('index.html does not load the single entry chunk');
    const files = initialChunkFiles(chunks, bulletinRouteModules);
    const bytes = files.reduce((sum, file) => sum + gzipSync(readFileSync(join(outDir, file)), { level: 9 }).length, 0);
    return Math.round((bytes / 1024) * 10) / 10;
  } finally {
    rmSync(outDir, { recursive: true, force: true });
  }
}
