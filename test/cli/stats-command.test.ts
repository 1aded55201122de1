import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';

const fixture = join(projectRoot, 'test/fixtures/conllu/harbour.conllu');

describe('treebridge stats', () => {
  it('names each bracketed tree without words that it cannot measure', async () => {
    const { code, stdout, stderr } = await cli(['stats', '--heads', 'penn-historical', '--lemmas', join(projectRoot, 'demo-data/ferry-log.psd')]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/sentences\s+7\n/);
    expect(stderr.match(/\[nothing-to-convert\]/g)).toHaveLength(2);
  });

  it('prints the figures as JSON with the agreed keys', async () => {
    const { code, stdout } = await cli(['stats', '--json', fixture]);
    expect(code).toBe(0);
    const figures = JSON.parse(stdout);
    expect(Object.keys(figures)).toEqual([
      'sentences', 'words', 'arcs', 'nonProjectiveSentences', 'nonProjectiveArcs', 'gapDegree', 'gappedWords', 'edgeDegree', 'wellNestedSentences', 'arcLength',
    ]);
    expect(figures).toMatchObject({ sentences: 3, words: 21, arcs: 18, nonProjectiveSentences: 0, gapDegree: { 0: 3 } });
  });

  it('lists the non-projective arcs of each sentence with their gaps on request', async () => {
    // Word 4 hangs from word 2 across word 3, which hangs from the root word 1 (a shape of our own).
    const text = '# sent_id = x1\n# text = a b c d\n1\ta\ta\tX\t_\t_\t0\troot\t_\t_\n2\tb\tb\tX\t_\t_\t1\tdep\t_\t_\n3\tc\tc\tX\t_\t_\t1\tdep\t_\t_\n4\td\td\tX\t_\t_\t2\tdep\t_\t_\n\n';
    const { code, stdout } = await cli(['stats', '--arcs', '--from', 'conllu', '-'], { stdin: text });
    expect(code).toBe(0);
    expect(stdout.split('\n')[0]).toBe('x1: 2→4 (gap 3)');
    expect(stdout).toMatch(/non-projective sentences\s+1 \(100\.00%\)/);
  });

  it('converts bracketed input first with --heads, and asks for a head table without it', async () => {
    const demo = join(projectRoot, 'demo-data/harbour.psd');
    const surface = JSON.parse((await cli(['stats', '--json', '--heads', 'en-content', demo])).stdout);
    const restored = JSON.parse((await cli(['stats', '--json', '--heads', 'en-content', '--traces', 'resolve', demo])).stdout);
    expect([surface.sentences, surface.words, surface.nonProjectiveSentences]).toEqual([25, 216, 0]);
    expect(restored.nonProjectiveSentences).toBeGreaterThan(0);
    const without = await cli(['stats', demo]);
    expect([without.code, without.stderr]).toEqual([2, 'treebridge: constituency trees (bracketed or XML graphs) need a head table to convert them first: --heads NAME\n']);
  });

  it('reports a sentence that is not a tree on standard error, leaves it out and exits 1', async () => {
    const text = '# sent_id = x1\n# text = a b\n1\ta\ta\tX\t_\t_\t2\tdep\t_\t_\n2\tb\tb\tX\t_\t_\t1\tdep\t_\t_\n\n';
    const { code, stdout, stderr } = await cli(['stats', '--json', '--from', 'conllu', '-'], { stdin: text });
    expect(code).toBe(1);
    expect(JSON.parse(stdout).sentences).toBe(0);
    expect(stderr).toMatch(/^-:3:\d+: error: .*\[(no-root|cycle)\]/m);
    expect(stderr).toMatch(/1 sentence read: 0 measured, 1 left out \(not trees\); 2 errors, 0 warnings/);
  });
});
