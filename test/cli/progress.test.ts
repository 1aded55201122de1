import { PassThrough, Readable } from 'node:stream';
import { describe, expect, it } from 'vitest';
import { startProgress } from '../../src/cli/progress.js';

function streams(isTTY: boolean) {
  const stderr = Object.assign(new PassThrough(), { isTTY, columns: 80 });
  let written = '';
  stderr.on('data', (chunk) => (written += chunk));
  return { io: { stdin: Readable.from([]), stdout: new PassThrough(), stderr }, written: () => written };
}

describe('the progress bar', () => {
  it('draws on a terminal for a long run', () => {
    const { io, written } = streams(true);
    const progress = startProgress(io, 100 * 1024 * 1024, 'reading');
    progress.advance(50 * 1024 * 1024);
    progress.stop();
    expect(written()).toMatch(/reading/);
  });

  it('stays silent when standard error is not a terminal, or the run is short', () => {
    for (const [isTTY, size] of [[false, 100 * 1024 * 1024], [true, 1024]] as const) {
      const { io, written } = streams(isTTY);
      const progress = startProgress(io, size, 'reading');
      progress.advance(size);
      progress.stop();
      expect(written()).toBe('');
    }
  });
});
