import { defineConfig } from 'vitest/config';

// Engine, CLI and server tests. The Angular app's specs run through `ng test` (its own builder).
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    globals: true,
    include: ['libs/**/*.spec.ts', 'apps/server/**/*.spec.ts', 'tests/**/*.spec.ts'],
    // end-to-end specs need the built app and Chromium, and run under @playwright/test (playwright.config.ts)
    exclude: ['tests/e2e/**', '**/node_modules/**'],
    testTimeout: 30_000,
    // a test database is migrated once per process (several seconds on a busy machine) in a beforeAll/beforeEach
    hookTimeout: 60_000,
  },
});
