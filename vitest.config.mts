import { defineConfig } from 'vitest/config';
import path from 'node:path';

const alias = {
  '@': path.resolve(__dirname),
  'server-only': path.resolve(__dirname, 'tests/support/empty.ts'),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.{ts,tsx}'],
          environment: 'node',
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        resolve: { alias },
        test: {
          // Real child processes killed with SIGKILL against PGlite directories (tests/crash).
          name: 'crash',
          include: ['tests/crash/**/*.test.ts'],
          environment: 'node',
          testTimeout: 120_000,
          hookTimeout: 60_000,
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/integration/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // One built server is shared by every file: run files one after another.
          fileParallelism: false,
        },
      },
      {
        resolve: { alias },
        test: {
          // Two `next start` processes on one PostgreSQL server and one fake S3 bucket
          // (tests/support/cluster.ts, the same cluster as `npm run demo:cluster`).
          name: 'cluster',
          include: ['tests/cluster/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/cluster/global-setup.ts'],
          testTimeout: 120_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
