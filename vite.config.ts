/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const apiPort = process.env.PORT ?? '3000';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: { outDir: 'dist', sourcemap: false, manifest: true },
  server: {
    port: 5173,
    host: '127.0.0.1',
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    setupFiles: ['tests/setup/each-file.ts'],
    pool: 'forks',
    testTimeout: 60_000,
    hookTimeout: 120_000,
    restoreMocks: true,
    // Three projects: the pure core needs no database (`npm run test:unit` runs it alone in
    // seconds); API and browser tests share one throwaway PostgreSQL cluster. Browser tests
    // get generous limits: on a busy machine only a hang should fail them.
    projects: [
      { extends: true, test: { name: 'unit', include: ['tests/shared/**/*.test.ts', 'tests/lib/**/*.test.ts', 'tests/app/**/*.test.ts', 'tests/components/**/*.test.ts'] } },
      { extends: true, test: { name: 'server', include: ['tests/server/**/*.test.ts', 'tests/fakes/**/*.test.ts', 'tests/scripts/**/*.test.ts'], globalSetup: ['tests/setup/global-setup.ts'] } },
      { extends: true, test: { name: 'browser', include: ['tests/e2e/**/*.test.ts'], globalSetup: ['tests/setup/global-setup.ts'], testTimeout: 240_000, hookTimeout: 240_000 } },
    ],
  },
});
