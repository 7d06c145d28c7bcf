import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: { include: ['tests/heavy/**/*.test.ts'], testTimeout: 1_800_000, pool: 'forks', maxWorkers: 2 },
});
