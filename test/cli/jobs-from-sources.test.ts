import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';

// Run from the TypeScript sources (as here) there is no built worker module: --jobs still gives
// the output of one job, the main thread doing all the work.
describe('--jobs without a built worker', () => {
  it('converts as --jobs 1 does', async () => {
    const args = ['to-deps', '--heads', 'en-content', '--labels', 'en-ud', '--pos-map', 'en-ptb', 'demo-data/harbour.psd', 'demo-data/broken.psd'];
    const one = await cli([...args, '--jobs', '1']);
    const four = await cli([...args, '--jobs', '4']);
    expect(one.code).toBe(1);
    expect(four).toEqual(one);
  });
});
