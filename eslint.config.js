import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import boundaries from 'eslint-plugin-boundaries';

/**
 * Lint rules. The architecture's import rules are enforced here rather than remembered:
 * - eslint-plugin-boundaries resolves each import to a file and checks which part of the tree it
 *   lands in, so `../../review/api/x` from inside src/features/outlooks is caught as surely as a
 *   path that spells "features". ESLint's own `no-restricted-imports` only sees the import text.
 * - eslint-plugin-jsx-a11y 6.10 declares ESLint ≤ 9 as its peer; its rules load and run on
 *   ESLint 10's flat config (tests/lint/lint-rules.test.ts proves it), and package.json's
 *   `overrides` lets npm accept the ESLint 10 peer.
 * - The type-aware rules (promises, unsafe assertions) run on server code only, where a dropped
 *   promise loses a write or an unhandled rejection.
 * tests/lint/fixtures/ holds deliberate violations; the lint test runs ESLint there on its own.
 */
export default tseslint.config(
  { ignores: ['dist/', 'node_modules/', 'data/', 'drizzle/', '.tmp/', 'tests/lint/fixtures/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...reactHooks.configs.recommended.rules,
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['src/**/*.tsx'],
    ...jsxA11y.flatConfigs.recommended,
    rules: {
      ...jsxA11y.flatConfigs.recommended.rules,
      // A scrollable table is a labelled region that takes focus so the keyboard can scroll it.
      'jsx-a11y/no-noninteractive-tabindex': ['error', { tags: [], roles: ['tabpanel', 'region'], allowExpressionValues: true }],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}', 'server/**/*.ts', 'shared/**/*.ts'],
    plugins: { boundaries },
    settings: {
      // Element patterns are relative to the project root, wherever ESLint was started from.
      'boundaries/root-path': import.meta.dirname,
      'boundaries/include': ['src/**/*', 'server/**/*', 'shared/**/*'],
      'boundaries/elements': [
        { type: 'feature', pattern: 'src/features/*', capture: ['name'] },
        { type: 'ui', pattern: 'src/components/ui' },
        { type: 'client', pattern: 'src' },
        { type: 'routes', pattern: 'server/routes' },
        { type: 'db', pattern: 'server/db' },
        { type: 'server', pattern: 'server' },
        { type: 'shared', pattern: 'shared' },
      ],
      'import/resolver': { node: { extensions: ['.ts', '.tsx', '.js', '.json'] } },
    },
    rules: {
      'boundaries/dependencies': [
        'error',
        {
          default: 'allow',
          policies: [
            {
              from: { element: { type: 'feature' } },
              disallow: { to: { element: { type: 'feature', captured: { name: '!{{ from.element.captured.name }}' } } } },
              message: 'A feature may not import another feature ({{ to.element.captured.name }}); move what both need to src/lib, src/components or shared/.',
            },
            {
              from: { element: { type: 'ui' } },
              disallow: { to: { element: { type: 'feature' } } },
              message: 'src/components/ui holds dumb shared components: it may not import a feature.',
            },
            {
              from: { element: { type: 'routes' } },
              disallow: { to: { element: { type: 'db' } } },
              message: 'Routes stay thin: reach the database through a service, never server/db.',
            },
            {
              from: { element: { type: 'shared' } },
              disallow: { to: { element: { type: '!shared' } } },
              message: 'shared/ is imported by both sides and imports nothing outside shared/.',
            },
            {
              from: { element: { type: ['feature', 'ui', 'client'] } },
              disallow: { to: { element: { type: ['routes', 'db', 'server'] } } },
              message: 'The client never imports server code.',
            },
            {
              from: { element: { type: ['routes', 'db', 'server'] } },
              disallow: { to: { element: { type: ['feature', 'ui', 'client'] } } },
              message: 'The server never imports client code.',
            },
          ],
        },
      ],
    },
  },
  {
    // shared/ may not use a framework either (the file rules above cover app code).
    files: ['shared/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { paths: ['react', 'react-dom', 'express'] }] },
  },
  {
    files: ['server/**/*.ts'],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': 'error',
    },
  },
  {
    // Server code narrows outside data with zod or a type guard, never with `as`. Tests may
    // assert the shape of an answer they are about to check.
    files: ['server/**/*.ts'],
    ignores: ['server/**/*.test.ts'],
    rules: { '@typescript-eslint/no-unsafe-type-assertion': 'error' },
  },
);
