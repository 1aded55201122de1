import { defineConfig } from 'vitest/config';

// The self-contained tier: nothing outside the project is read.
export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/corpora/**', 'node_modules/**'],
  },
});
