import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

/** Modules the public bulletin loads first (see tests/bench/bulletin-bundle.ts for the budget). */
const publicBulletinModules =
  /[\\/](src[\\/](app[\\/]layouts[\\/]public-layout|components[\\/]ui[\\/](caution|notice|empty-state|risk-swatch)|features[\\/]bulletin[\\/](routes[\\/]bulletin|components[\\/](issuance-details|issuance-map|issuance-downloads|issuance-state-badge|map-legend|discussion-text)|utils[\\/](issuance-format|map-areas)|api[\\/](issuance-schema))|api[\\/]issuances[\\/](get-bulletin|issuances-keys)|lib[\\/]map[\\/](static-risk-map|svg-paths|use-offline-boundaries|offline-boundaries))|shared[\\/](contracts[\\/](risk-areas|issuances|me)|issuances[\\/]in-force))\.tsx?$|[\\/]node_modules[\\/]topojson-client[\\/]/;

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: {
    outDir: 'dist',
    // No source maps in the build: dist/ is served as is, and maps would publish the source.
    sourcemap: false,
    manifest: true,
    // Every browser we support has modulepreload; the polyfill would only add to the first load.
    modulePreload: false,
    rolldownOptions: {
      output: {
        codeSplitting: {
          // The public bulletin's own modules in one chunk rather than a dozen small ones: fewer
          // requests and a smaller download on the first public visit (issue 13's budget).
          groups: [{ name: 'public-bulletin', test: publicBulletinModules }],
        },
      },
    },
  },
  server: { port: 5173 },
  test: {
    projects: [
      {
        test: {
          name: 'node',
          environment: 'node',
          include: ['shared/**/*.test.ts', 'server/**/*.test.ts', 'tests/api/**/*.test.ts', 'tests/e2e/**/*.test.ts', 'tests/lint/**/*.test.ts'],
          testTimeout: 60_000,
          hookTimeout: 180_000,
          globalSetup: ['tests/api/helpers/global-setup.ts'],
        },
      },
      {
        plugins: [react()],
        test: {
          name: 'jsdom',
          environment: 'jsdom',
          include: ['src/**/*.test.tsx', 'src/**/*.test.ts'],
          testTimeout: 30_000,
        },
      },
    ],
  },
});
