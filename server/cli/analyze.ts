/**
 * `npm run -s analyze -- FILE.csv [--json]`: analyse one sounding in the exchange CSV format.
 *
 * With --json, prints the analysis JSON described in docs/analysis.md and
 * docs/analysis.schema.json (plus `metadata` and `warnings`). Without it, prints a readable
 * table grouped as instability, moisture, cloud base, kinematics and composites. Warnings
 * (missing metadata, sorted levels…) and quality flags go to stderr; the exit status stays 0.
 * Invalid input (unreadable file, parse or validation errors): messages on stderr naming
 * file, line and column, exit 2.
 */
import { readFileSync, statSync } from 'node:fs';
import { basename } from 'node:path';
import { analyzeSounding, MAX_FILE_BYTES, parseSoundingCsv, type ParsedSounding, type SoundingAnalysis } from '../../shared/sounding';
import { formatAnalysisTable } from './format-table';

const USAGE = 'usage: npm run -s analyze -- FILE.csv [--json]';

/** Round every number in a JSON value to `digits` decimals (presentation only). */
function roundNumbers(value: unknown, digits = 3): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? Number(value.toFixed(digits)) : null;
  if (Array.isArray(value)) return value.map((item) => roundNumbers(item, digits));
  if (value !== null && typeof value === 'object') {
    return Object.fromEntries(Object.entries(value).map(([key, item]) => [key, roundNumbers(item, digits)]));
  }
  return value;
}

function fail(lines: string[]): never {
  for (const line of lines) process.stderr.write(`${line}\n`);
  process.exit(2);
}

function main(argv: string[]): void {
  const json = argv.includes('--json');
  const files = argv.filter((arg) => !arg.startsWith('--'));
  const unknown = argv.filter((arg) => arg.startsWith('--') && arg !== '--json');
  const [path] = files;
  if (path === undefined || files.length !== 1 || unknown.length > 0) fail([USAGE]);
  const name = basename(path);

  let text: string;
  try {
    if (statSync(path).size > MAX_FILE_BYTES) fail([`${name}: error FILE_TOO_LARGE: the file is larger than 2 MB.`]);
    text = readFileSync(path, 'utf8');
  } catch (error) {
    fail([`${name}: cannot read the file (${error instanceof Error && 'code' in error ? String(error.code) : 'unknown error'}).`]);
  }

  const parsed = parseSoundingCsv(text, name);
  if (!parsed.ok) {
    fail(parsed.error.map((issue) => `${issue.severity} ${issue.code}: ${issue.message}`));
  }
  const sounding: ParsedSounding = parsed.value;
  for (const warning of sounding.warnings) process.stderr.write(`warning ${warning.code}: ${warning.message}\n`);
  const analysis: SoundingAnalysis = analyzeSounding(sounding.levels, { latitude: sounding.metadata.latitude });
  for (const flag of analysis.flags) process.stderr.write(`flag ${flag.code}: ${name}: ${flag.message}\n`);
  if (json) {
    const output = { ...analysis, metadata: sounding.metadata, warnings: sounding.warnings };
    process.stdout.write(`${JSON.stringify(roundNumbers(output), null, 2)}\n`);
  } else {
    process.stdout.write(formatAnalysisTable(sounding, analysis));
  }
}

main(process.argv.slice(2));
