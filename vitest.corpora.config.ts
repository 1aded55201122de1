import { defineConfig } from 'vitest/config';

// The corpus tier: reads ../shared/corpora (or TREEBRIDGE_CORPORA) and runs the
// NLTK cross-checks. Missing corpora or libraries fail, never skip.
export default defineConfig({
  test: {
    include: ['test/corpora/**/*.test.ts'],
    testTimeout: 600_000,
    hookTimeout: 600_000,
    fileParallelism: false,
    // Commands run in the test process from the TypeScript sources, where there is no built worker
    // to start: one job. Tests of worker threads run the built command with --jobs.
    env: { TREEBRIDGE_JOBS: '1' },
  },
});
