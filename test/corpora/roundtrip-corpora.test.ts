// Round trips on the shared corpora: GUM (CC BY 4.0) with en-function and IcePaHC
// (CC BY 4.0) with penn-historical, brackets → dependencies → brackets; the
// figures go into the issue note. Words and tags never change, and the loss
// table adds up.
import { describe, expect, it } from 'vitest';
import { BracketRoundTrip } from '../../src/evaluate/roundtrip.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { loadCategoryTable } from '../../src/tables/load-category-table.js';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { loadPosMap } from '../../src/tables/load-pos-map.js';
import { corpusFiles } from '../support/corpora.js';
import { cli } from '../support/cli.js';
import { writeTree } from '../../src/traces/write-tree.js';

describe.each([
  ['GUM with en-function', 'gum/const', '.ptb', 'en-function', false],
  ['IcePaHC with penn-historical', 'icepahc', '.psd', 'penn-historical', true],
] as const)('round trip of %s', (name, folder, extension, heads, lemmas) => {
  it('changes no word and no tag, and puts every lost or added bracket in one kind', async () => {
    const trip = new BracketRoundTrip(
      { heads: loadHeadTable(heads), traces: 'keep', coordination: 'first', punctuation: 'phrase', upos: loadPosMap(folder === 'gum/const' ? 'en-ptb' : 'penn-historical') },
      { categories: loadCategoryTable('ud'), shape: 'flat', pos: 'xpos' },
    );
    let n = 0;
    for (const file of corpusFiles(folder, extension)) {
      for await (const tree of readBracketedFile(file, { splitLemmas: lemmas }, () => undefined)) trip.add(tree, tree.id ?? String(++n));
    }
    const report = trip.report();
    const { gold, test, matched } = report.counts!;
    const b = report.brackets!;
    console.log(`${name}: ${report.sentences} sentences, F1 ${b.f1.toFixed(4)}, labelled F1 ${b.labelledF1.toFixed(4)}; losses ${JSON.stringify(report.losses)}`);
    expect(report.losses.wordsOrPos).toBe(0);
    const { unary, nesting, punctuation, other } = report.losses;
    expect(unary + nesting + punctuation + other).toBe(gold - matched + (test - matched));
  });
});

describe.each([
  ['GUM with en-content', 'gum/const', '.ptb', 'en-content', false],
  ['IcePaHC with penn-historical', 'icepahc', '.psd', 'penn-historical', true],
] as const)('lossless round trip of %s', (name, folder, extension, heads, lemmas) => {
  it('gives back every tree exactly: function tags, empty elements and coindices included, trees without words in comments', async () => {
    const trip = new BracketRoundTrip(
      { heads: loadHeadTable(heads), traces: 'keep', coordination: 'first', punctuation: 'phrase' },
      { categories: loadCategoryTable('ud'), shape: 'flat', pos: 'xpos' },
      5,
      0,
      true,
      true,
    );
    let trees = 0;
    let exact = 0;
    for (const file of corpusFiles(folder, extension)) {
      for await (const tree of readBracketedFile(file, { splitLemmas: lemmas }, () => undefined)) {
        trees++;
        const back = trip.add(tree, tree.id ?? String(trees));
        if (back && writeTree(back) === writeTree(tree)) exact++;
      }
    }
    console.log(`${name}, lossless: ${exact} of ${trees} trees exact`);
    expect(trees).toBeGreaterThan(0);
    expect(exact).toBe(trees);
    expect(trip.report().sentences).toBe(trees);
    expect(trip.report().losses.other).toBe(0);
  });
});

describe('lossless mode from the command line on IcePaHC', () => {
  it('to-deps --lossless, then to-brackets --lossless, writes what rewrite writes, byte for byte', async () => {
    const files = corpusFiles('icepahc', '.psd');
    const deps = await cli(['to-deps', '--lossless', '--lemmas', '--heads', 'penn-historical', ...files]);
    expect(deps.code).toBe(0);
    const back = await cli(['to-brackets', '--lossless', '-'], { stdin: deps.stdout });
    const original = await cli(['rewrite', '--lemmas', ...files]);
    expect(original.stdout.length).toBeGreaterThan(0);
    expect(back.stdout === original.stdout).toBe(true);
  });
});
