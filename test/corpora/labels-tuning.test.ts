// Learning a label table from gold (heads suggest --labels, the library's suggestLabels) on one half
// of the documents and scoring it on the other, beside the shipped label table, with the shipped head
// table: GUM (CC BY 4.0) against its gold dependencies, IcePaHC against its UD version
// (../shared/corpora/icepahc-ud, CC BY-SA 4.0). LAS by universal relations, punctuation left out.
import { describe, expect, it } from 'vitest';
import { scoreHeads, suggestLabels } from '../../src/api/evaluate.js';
import { compileLabelTable } from '../../src/tables/load-table.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { readConlluFile } from '../../src/formats/conllu/read-conllu.js';
import { corpusFiles } from '../support/corpora.js';

const corpora = {
  GUM: {
    files: corpusFiles('gum/const', '.ptb'),
    gold: (file: string) => file.replace('/const/', '/dep/').replace(/\.ptb$/, '.conllu'),
    read: {},
    heads: 'en-content',
    labels: 'en-ud',
    unscored: undefined,
  },
  IcePaHC: {
    files: corpusFiles('icepahc', '.psd'),
    gold: (file: string) => file.replace('/icepahc/', '/icepahc-ud/').replace(/\.psd$/, '.conllu'),
    read: { splitLemmas: true },
    heads: 'penn-historical',
    labels: 'penn-historical',
    unscored: { key: 'Align', values: ['absorbed', 'extra'] },
  },
} as const;

describe.each(Object.keys(corpora) as Array<keyof typeof corpora>)('%s: a label table learned on one half', (name) => {
  const corpus = corpora[name];
  async function* trees(files: string[]) {
    for (const file of files) yield* readBracketedFile(file, { ...corpus.read, file }, () => undefined);
  }
  async function* gold(files: string[]) {
    for (const file of files) yield* readConlluFile(corpus.gold(file), {}, () => undefined);
  }
  const halves = [corpus.files.filter((_, i) => i % 2 === 0), corpus.files.filter((_, i) => i % 2 === 1)];
  const extra = corpus.unscored ? { unscored: { key: corpus.unscored.key, values: [...corpus.unscored.values] } } : {};

  it.each([
    [0, 1],
    [1, 0],
  ])('learned on half %i, scored on half %i: LAS within 3 points of the shipped table', async (train, test) => {
    const learned = await suggestLabels(trees(halves[train]!), gold(halves[train]!), { heads: corpus.heads, name: 'learned', ...extra });
    const table = compileLabelTable(learned.text);
    const withLearned = await scoreHeads(trees(halves[test]!), gold(halves[test]!), { heads: corpus.heads, labels: table, ...extra });
    const withShipped = await scoreHeads(trees(halves[test]!), gold(halves[test]!), { heads: corpus.heads, labels: corpus.labels, ...extra });
    console.log(`${name}: learned labels ${learned.learned.rules.length} rules, LAS ${withLearned.scorer.las.toFixed(4)}; shipped LAS ${withShipped.scorer.las.toFixed(4)}`);
    expect(withLearned.scorer.las).toBeGreaterThanOrEqual(withShipped.scorer.las - 0.03);
  });
});
