import { defineConfig } from 'vitest/config';

/**
 * Test tiers (DEVELOPERS.md "Test tiers"):
 * - unit: everything without a simulator or browser (`*.test.ts` beside the code and in tests/);
 * - engine: `*.engine.test.ts` (system ngspice and the embedded wasm engine) and the browser test;
 *   its global setup stops with one line when ngspice or chromium is missing;
 * - heavy: the long sweeps in tests/heavy/, only when asked for (`--project heavy`), so that a
 *   bare `vitest run` stays the default suite.
 */
const ENGINE = ['src/**/*.engine.test.ts', 'tests/**/*.engine.test.ts', 'tests/browser/**/*.test.ts'];
const HEAVY = ['tests/heavy/**/*.test.ts'];
const wantsHeavy = process.argv.some((a, i) => a === '--project=heavy' || (a === '--project' && process.argv[i + 1] === 'heavy'));

export default defineConfig({
  test: {
    testTimeout: 120_000,
    hookTimeout: 120_000,
    pool: 'forks',
    maxWorkers: 2,
    projects: [
      { extends: true, test: { name: 'unit', include: ['src/**/*.test.ts', 'tests/**/*.test.ts'], exclude: [...ENGINE, ...HEAVY, 'node_modules/**'] } },
      { extends: true, test: { name: 'engine', include: ENGINE, globalSetup: ['tests/support/systemCheck.ts'] } },
      ...(wantsHeavy ? [{ extends: true as const, test: { name: 'heavy', include: HEAVY, testTimeout: 1_800_000 } }] : []),
    ],
  },
});
