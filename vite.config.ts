import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist', sourcemap: true },
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
