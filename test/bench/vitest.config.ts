import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/bench/bench.test.ts'],
    environment: 'node',
    testTimeout: 120_000,
    silent: false,
  },
});
