import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BracketRoundTrip, spansOf } from '../../src/evaluate/roundtrip.js';
import { loadCategoryTable } from '../../src/tables/load-category-table.js';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { cli } from '../support/cli.js';
import { projectRoot } from '../support/corpora.js';
import { read } from '../support/read.js';

const demo = join(projectRoot, 'demo-data/harbour.psd');

describe('treebridge roundtrip', () => {
  it('reports brackets → dependencies → brackets with the agreed JSON keys', async () => {
    const { code, stdout } = await cli(['roundtrip', '--json', '--heads', 'en-content', '--pos-map', 'en-ptb', demo]);
    expect(code).toBe(0);
    const report = JSON.parse(stdout);
    expect(Object.keys(report)).toEqual(['direction', 'sentences', 'exactMatch', 'brackets', 'losses', 'examples']);
    expect(Object.keys(report.brackets)).toEqual(['precision', 'recall', 'f1', 'labelledF1', 'crossing']);
    expect(Object.keys(report.losses)).toEqual(['unary', 'nesting', 'label', 'functionTags', 'emptyElements', 'coindexing', 'punctuation', 'wordsOrPos', 'other']);
    expect(report).toMatchObject({ direction: 'brackets', sentences: 25, losses: { wordsOrPos: 0, emptyElements: 15 } });
  });

  it('puts every lost and every added bracket in exactly one kind', () => {
    const trip = new BracketRoundTrip(
      { heads: loadHeadTable('en-content'), traces: 'keep', coordination: 'first', punctuation: 'phrase' },
      { categories: loadCategoryTable('ud'), shape: 'flat', pos: 'xpos' },
    );
    read(readFileSync(demo, 'utf8')).trees.forEach((tree) => trip.add(tree, tree.id!));
    const report = trip.report();
    const { gold, test, matched } = report.counts!;
    const { unary, nesting, punctuation, other } = report.losses;
    expect(unary + nesting + punctuation + other).toBe(gold - matched + (test - matched));
  });

  it('reports dependencies → brackets → dependencies as exact for CoNLL-U input', async () => {
    const { code, stdout } = await cli(['roundtrip', '--json', join(projectRoot, 'test/fixtures/conllu/harbour.conllu')]);
    expect(code).toBe(0);
    expect(JSON.parse(stdout)).toMatchObject({ direction: 'dependencies', sentences: 3, exactMatch: 3, attachment: { uas: 1, las: 1 } });
  });

  it('leaves punctuation out of the spans when scores ignore it', () => {
    const tree = read('( (S (NP-SBJ (NNS Gulls)) (VP (VBD circled)) (. .)))').trees[0]!;
    const table = loadHeadTable('en-content');
    const all = spansOf(tree);
    const some = spansOf(tree, (pos) => table.punctuation({ category: pos, functions: [] }));
    expect(all.words.map((w) => w.form)).toEqual(['Gulls', 'circled', '.']);
    expect(some.words.map((w) => w.form)).toEqual(['Gulls', 'circled']);
    expect(all.spans.find((s) => s.label === 'S')).toMatchObject({ start: 0, end: 3 });
    expect(some.spans.find((s) => s.label === 'S')).toMatchObject({ start: 0, end: 2 });
  });

  it('scores the demo trees with punctuation counted or ignored, over the same sentences', async () => {
    const counted = JSON.parse((await cli(['roundtrip', '--json', '--heads', 'en-content', demo])).stdout);
    const ignored = JSON.parse((await cli(['roundtrip', '--json', '--score-punctuation', 'ignore', '--heads', 'en-content', demo])).stdout);
    expect(ignored.sentences).toBe(counted.sentences);
    expect(ignored.losses.punctuation).toBe(0);
    expect(counted.losses.punctuation).toBeGreaterThan(0);
  });

  it('reports every tree it leaves out: a tree without words is named on standard error, never dropped unsaid', async () => {
    const log = join(projectRoot, 'demo-data/ferry-log.psd');
    const { code, stdout, stderr } = await cli(['roundtrip', '--heads', 'penn-historical', '--lemmas', log]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/: 7 sentences,/);
    expect(stderr.match(/\[nothing-to-convert\]/g)).toHaveLength(2);
    expect(stderr).toContain('ferry-log.psd:1:1: warning: tree has no words');
  });

  it('fails a pipeline with exit 1 when a kind of loss passes its limit', async () => {
    const over = await cli(['roundtrip', '--heads', 'en-content', demo, '--fail-above', 'nesting=10', '--fail-above', 'wordsOrPos=0']);
    expect(over.code).toBe(1);
    expect(over.stderr).toMatch(/^treebridge: 25 trees read: 25 round-tripped, 0 left out\ntreebridge: nesting losses \d+\.\d\d% exceed 10%\n$/);
    const under = await cli(['roundtrip', '--heads', 'en-content', demo, '--fail-above', 'wordsOrPos=0']);
    expect(under.code).toBe(0);
    const wrong = await cli(['roundtrip', '--heads', 'en-content', demo, '--fail-above', 'colour=5']);
    expect(wrong.code).toBe(2);
    const notANumber = await cli(['roundtrip', '--heads', 'en-content', '--report-limit', 'abc', '--report', 'x.html', demo]);
    expect(notANumber.code).toBe(2);
    expect(notANumber.stderr).toContain('expected a whole number');
  });
});

describe('lossless mode', () => {
  it('carries each bracketing through to-deps --lossless and back through to-brackets --lossless exactly', async () => {
    for (const [file, extra] of [
      ['harbour.psd', ['--heads', 'en-content']],
      ['ferry-log.psd', ['--heads', 'penn-historical', '--lemmas']],
    ] as const) {
      const path = join(projectRoot, 'demo-data', file);
      const deps = await cli(['to-deps', '--lossless', ...extra, path]);
      expect((await cli(['validate', '--from', 'conllu', '-'], { stdin: deps.stdout })).code, file).toBe(0);
      const back = await cli(['to-brackets', '--lossless', '-'], { stdin: deps.stdout });
      const original = await cli(['rewrite', ...((extra as readonly string[]).includes('--lemmas') ? ['--lemmas'] : []), path]);
      // Trees without words (a heading, a note) ride in comments on a neighbouring sentence.
      expect(back.stdout, file).toBe(original.stdout);
    }
  });

  it('carries trees without words before the first sentence and after the last one', async () => {
    const text = '( (CODE {opening%note}) (ID w.0))\n( (S (NP-SBJ (NN Gulls)) (VP (VBD circled))) (ID w.1))\n( (CODE <closing>) (ID w.2))\n( (CODE <really_closing>))\n';
    const deps = await cli(['to-deps', '--lossless', '--heads', 'en-content', '-'], { stdin: text });
    expect(deps.stdout).toContain('# brackets-before = ( (CODE {opening%25note}) (ID w.0))');
    expect(deps.stdout.match(/# brackets-after = /g)).toHaveLength(2);
    const back = await cli(['to-brackets', '--lossless', '-'], { stdin: deps.stdout });
    expect(back.stdout).toBe(text);
  });

  it('reports the round trip as exact', async () => {
    const { stdout } = await cli(['roundtrip', '--json', '--lossless', '--heads', 'en-content', demo]);
    expect(JSON.parse(stdout)).toMatchObject({ sentences: 25, exactMatch: 25, brackets: { f1: 1, labelledF1: 1 }, losses: { other: 0 } });
  });
});
