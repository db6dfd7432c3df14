import { defineConfig } from 'vitest/config';

export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
    globalSetup: ['tests/helpers/global-setup.ts'],
    testTimeout: 20_000,
    hookTimeout: 30_000,
    // Two cores: more workers only make argon2 hashing in parallel tests slower.
    maxWorkers: 2,
  },
});
