import path from 'node:path';
import { ESLint, type Linter } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

/**
 * The import boundaries, the accessibility rules and the type-aware promise and assertion rules
 * of eslint.config.js, shown firing on deliberate violations in tests/lint/fixtures/ (a folder
 * that mirrors the project's tree and that the normal `eslint .` run ignores).
 */
const fixtures = path.resolve(import.meta.dirname, 'fixtures');

/** rule id → lines it reported, per fixture file (path relative to the fixtures folder). */
let findings: Map<string, Linter.LintMessage[]>;

function rulesAt(file: string): { ruleId: string | null; line: number }[] {
  const messages = findings.get(file);
  if (!messages) throw new Error(`${file} was not linted; linted: ${[...findings.keys()].join(', ')}`);
  return messages.map((m) => ({ ruleId: m.ruleId, line: m.line }));
}

beforeAll(async () => {
  // The project's own configuration, with the fixtures folder as the working directory so
  // its `src/`, `server/` and `shared/` stand where the real ones do.
  const eslint = new ESLint({
    cwd: fixtures,
    overrideConfigFile: path.resolve(import.meta.dirname, '../../eslint.config.js'),
    overrideConfig: { settings: { 'boundaries/root-path': fixtures } },
  });
  const results = await eslint.lintFiles(['.']);
  findings = new Map(results.map((r) => [path.relative(fixtures, r.filePath).split(path.sep).join('/'), r.messages]));
}, 120_000);

describe('import boundaries', () => {
  it('when a feature imports another feature, then boundaries/dependencies reports the import', () => {
    expect(rulesAt('src/features/alpha/imports-other-feature.ts')).toEqual([{ ruleId: 'boundaries/dependencies', line: 2 }]);
  });

  it('when a feature imports only from itself, then nothing is reported', () => {
    expect(rulesAt('src/features/alpha/alpha-panel.tsx')).toEqual([]);
    expect(rulesAt('src/features/beta/beta-label.ts')).toEqual([]);
  });

  it('when a shared UI component imports a feature, then boundaries/dependencies reports it', () => {
    expect(rulesAt('src/components/ui/imports-feature.ts')).toEqual([{ ruleId: 'boundaries/dependencies', line: 2 }]);
  });

  it('when a route imports server/db, then boundaries/dependencies reports it', () => {
    expect(rulesAt('server/routes/reads-db.routes.ts')).toEqual([{ ruleId: 'boundaries/dependencies', line: 2 }]);
  });

  it('when shared code imports server code, then boundaries/dependencies reports it', () => {
    expect(rulesAt('shared/imports-server.ts')).toEqual([{ ruleId: 'boundaries/dependencies', line: 2 }]);
  });
});

describe('accessibility of JSX (eslint-plugin-jsx-a11y on ESLint 10)', () => {
  it('when an image has no text alternative, then jsx-a11y/alt-text reports it', () => {
    expect(rulesAt('src/features/alpha/image-without-alt.tsx')).toEqual([{ ruleId: 'jsx-a11y/alt-text', line: 3 }]);
  });
});

describe('type-aware rules in server code', () => {
  it('when a promise is dropped, an async callback is given where a void one is expected, and parsed JSON is asserted, then each rule reports its line', () => {
    expect(rulesAt('server/services/promises.service.ts')).toEqual([
      { ruleId: '@typescript-eslint/no-floating-promises', line: 11 },
      { ruleId: '@typescript-eslint/no-misused-promises', line: 13 },
      { ruleId: '@typescript-eslint/no-unsafe-type-assertion', line: 17 },
    ]);
  });
});
