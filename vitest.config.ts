import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// One config, several projects: unit tests need nothing; api/ifc/e2e tests need the
// database that scripts/test.ts starts (it exports DB_* before vitest runs).
const shared = fileURLToPath(new URL('./shared', import.meta.url));

export default defineConfig({
  resolve: { alias: { '@shared': shared } },
  test: {
    projects: [
      {
        resolve: { alias: { '@shared': shared } },
        test: { name: 'unit', include: ['shared/**/*.test.ts', 'tests/unit/**/*.test.ts', 'server/**/*.test.ts', 'client/src/**/*.test.ts'], environment: 'node', testTimeout: 60_000 },
      },
      {
        resolve: { alias: { '@shared': shared } },
        test: { name: 'ifc', include: ['tests/ifc/**/*.test.ts'], environment: 'node', testTimeout: 120_000, hookTimeout: 120_000 },
      },
      {
        resolve: { alias: { '@shared': shared } },
        test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', testTimeout: 30_000, hookTimeout: 60_000, fileParallelism: false },
      },
      {
        resolve: { alias: { '@shared': shared } },
        test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', testTimeout: 120_000, hookTimeout: 120_000, fileParallelism: false },
      },
    ],
  },
});
