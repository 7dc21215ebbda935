import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Browser tests: drive Debian's Chromium through playwright-core against a running Panelpass
// (PANELPASS_URL, default http://127.0.0.1:8080, as `scripts/start` serves it).
export default defineConfig({
  root: fileURLToPath(new URL('..', import.meta.url)),
  test: {
    include: ['e2e/**/*.e2e.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 120_000,
    // One browser at a time: CI has two cores.
    fileParallelism: false,
  },
});
