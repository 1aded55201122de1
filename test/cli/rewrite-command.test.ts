import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

describe('treebridge rewrite', () => {
  it('writes one tree per line that validates again to the same counts', async () => {
    const file = join(projectRoot, 'demo-data', 'harbour.psd');
    const rewritten = await cli(['rewrite', file]);
    expect(rewritten.code).toBe(0);
    expect(rewritten.stdout.trimEnd().split('\n')).toHaveLength(25);
    const again = await cli(['validate', '-'], { stdin: rewritten.stdout });
    expect(again.stdout).toBe('1 file, 25 trees, 216 words: 0 errors, 0 warnings\n');
  });

  it('writes the indented layout and reports skipped trees on standard error with exit 1', async () => {
    const { code, stdout, stderr } = await cli(['rewrite', '--layout', 'indented', '-'], {
      stdin: '(S (NP (N Fog)) (VP (V lifted)))\n(S (NP (D the) fog))\n',
    });
    expect(code).toBe(1);
    expect(stdout).toBe('(S (NP (N Fog)) (VP (V lifted)))\n\n');
    expect(stderr).toMatch(/^-:2:\d+: error: .+ \[[a-z-]+\]\ntreebridge: 1 tree read: 1 written, 0 skipped; 1 error, 0 warnings\n$/);
  });

  it('rejects an unknown layout with exit 2', async () => {
    const { code, stderr } = await cli(['rewrite', '--layout', 'wide', '-']);
    expect(code).toBe(2);
    expect(stderr).toMatch(/Allowed choices are line, indented/);
  });
});
