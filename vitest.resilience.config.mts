import { defineConfig } from 'vitest/config';
import base from './vitest.config.mts';

// Fault, two-instance, load and backup tests: they stop the database and start a second server, so
// they run on their own, after the other suites (scripts/test.sh), one file after another. Everything
// else (aliases, setup, reporters) is the main configuration's.
export default defineConfig({
  ...base,
  test: { ...base.test, include: ['tests/resilience/**/*.test.ts'], testTimeout: 180_000, hookTimeout: 120_000 },
});
