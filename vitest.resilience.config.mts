import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Fault, two-instance, load and backup tests: they stop the database and start a second server, so
// they run on their own, after the other suites (scripts/test.sh), one file after another.
export default defineConfig({
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('.', import.meta.url)),
      'server-only': fileURLToPath(new URL('./tests/support/empty.ts', import.meta.url)),
    },
  },
  test: {
    include: ['tests/resilience/**/*.test.ts'],
    setupFiles: ['tests/support/env.ts'],
    fileParallelism: false,
    testTimeout: 180_000,
    hookTimeout: 120_000,
    reporters: ['default', './tests/support/summary-reporter.ts'],
  },
});
