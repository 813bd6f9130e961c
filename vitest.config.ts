import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    projects: [
      // tests/src holds unit tests of the console's plain logic (type-checked with the client config).
      { test: { name: 'unit', include: ['tests/unit/**/*.test.ts', 'tests/src/**/*.test.ts'], environment: 'node' } },
      { test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', env: { NODE_ENV: 'test' }, testTimeout: 20_000 } },
      // The instrument-PC agent as its own process against a live server and a real folder.
      {
        test: {
          name: 'agent',
          include: ['tests/agent/**/*.test.ts'],
          environment: 'node',
          env: { NODE_ENV: 'test' },
          testTimeout: 60_000,
          hookTimeout: 30_000,
          fileParallelism: false,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          env: { NODE_ENV: 'test' },
          testTimeout: 60_000,
          hookTimeout: 60_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
