import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

const alias = {
  '~': fileURLToPath(new URL('./src', import.meta.url)),
  '@models': fileURLToPath(new URL('./models', import.meta.url)),
};

// Two projects: pure units, and integration tests against a real PostgreSQL.
export default defineConfig({
  resolve: { alias },
  test: {
    // Integration files share one database; unit files are quick enough to run one at a time too.
    fileParallelism: false,
    projects: [
      { resolve: { alias }, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node' } },
      {
        resolve: { alias },
        test: {
          name: 'integration',
          include: ['tests/integration/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/integration/helpers/server.ts'],
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
    ],
  },
});
