import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    // The CLI tests spawn bin/skeinproof.js, which runs the compiled dist/: build it first.
    globalSetup: ['test/support/compile-cli.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
  },
});
