import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Benchmarks that need the app's own modules (run by scripts/bench/*; they print figures).
export default defineConfig({
  root: fileURLToPath(new URL('../../pwa', import.meta.url)),
  test: {
    include: ['../scripts/bench/*.bench-run.ts'],
    environment: 'node',
    testTimeout: 300_000,
    hookTimeout: 300_000,
  },
});
