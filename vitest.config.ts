import { defineConfig } from 'vitest/config';

// The self-contained tier: nothing outside the project is read.
export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    exclude: ['test/corpora/**', 'node_modules/**'],
    // Commands run in the test process from the TypeScript sources, where there is no built worker
    // to start: one job. Tests of worker threads run the built command with --jobs.
    env: { TREEBRIDGE_JOBS: '1' },
  },
});
