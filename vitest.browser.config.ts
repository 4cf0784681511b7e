import { defineConfig } from 'vitest/config';

// Browser tests: the built app, the real server and Debian's Chromium. `npm test` builds the app first.
export default defineConfig({
  resolve: { tsconfigPaths: true },
  test: {
    globals: true,
    include: ['tests/browser/**/*.spec.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
