// Conversion on the shared corpora. IcePaHC (CC BY 4.0) with penn-historical in
// both trace modes; GUM (CC BY 4.0) with en-content + en-ud against the gold
// dependencies, and with en-function for the arc-length rule of thumb.
import { describe, expect, it } from 'vitest';
import { headVector } from '../../src/analysis/heads.js';
import { analyseTree } from '../../src/analysis/structure.js';
import { convertTree, type ConversionSettings } from '../../src/convert/convert-tree.js';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { scoreConversion } from '../../src/evaluate/score-conversion.js';
import { readBracketedFile } from '../../src/formats/bracketed/read-bracketed.js';
import { readConlluFile } from '../../src/formats/conllu/read-conllu.js';
import { preterminalsOf } from '../../src/model/traverse.js';
import { loadHeadTable, loadLabelTable } from '../../src/tables/load-table.js';
import { checkDependencyTree } from '../../src/validate/check-dependency-tree.js';
import { corpusFiles } from '../support/corpora.js';

const settings = (heads: string, extra: Partial<ConversionSettings> = {}): ConversionSettings => ({
  heads: loadHeadTable(heads),
  traces: 'keep',
  coordination: 'first',
  punctuation: 'phrase',
  ...extra,
});

describe.each(['keep', 'resolve'] as const)('IcePaHC with penn-historical, traces %s', (traces) => {
  it('converts every tree with words into a tree over exactly its words', async () => {
    const conversion = settings('penn-historical', { traces });
    let trees = 0;
    let converted = 0;
    let nonProjective = 0;
    for (const file of corpusFiles('icepahc', '.psd')) {
      for await (const tree of readBracketedFile(file, { splitLemmas: true }, () => undefined)) {
        trees++;
        const words = preterminalsOf(tree);
        const result = convertTree(tree, conversion, tree.id ?? String(trees), file);
        if (!result) {
          expect(words, `${file} tree ${trees} has words but did not convert`).toEqual([]);
          continue;
        }
        converted++;
        expect(result.sentence.lines.map((line) => line.form)).toEqual(words.map((word) => word.word.form));
        const problems: Diagnostic[] = [];
        checkDependencyTree(result.sentence, (d) => problems.push(d));
        expect(problems.filter((d) => d.code !== 'text-differs'), tree.id).toEqual([]);
        if (analyseTree(headVector(result.sentence)!).nonProjectiveArcs.length > 0) nonProjective++;
      }
    }
    expect(trees).toBe(36_946);
    // With traces kept, attachment keeps every phrase where it stands, so no arc can cross.
    console.log(`IcePaHC, traces ${traces}: ${converted} of ${trees} trees converted, ${nonProjective} non-projective`);
    if (traces === 'keep') expect(nonProjective).toBe(0);
    else expect(nonProjective).toBeGreaterThan(0);
  });
});

async function* gumTrees() {
  for (const file of corpusFiles('gum/const', '.ptb')) yield* readBracketedFile(file, {}, () => undefined);
}
async function* gumGold() {
  for (const file of corpusFiles('gum/dep', '.conllu')) yield* readConlluFile(file, {}, () => undefined);
}

describe('GUM', () => {
  it('converts with en-content + en-ud to UAS ≥ 0.91 (issue 13) and LAS ≥ 0.85 against the gold (punctuation left out), beside the oracle', async () => {
    const result = await scoreConversion(gumTrees(), gumGold(), settings('en-content', { labels: loadLabelTable('en-ud') }), () => undefined);
    const { uas, las } = result.scorer;
    console.log(`GUM en-content + en-ud: UAS ${uas.toFixed(4)}, LAS ${las.toFixed(4)}; oracle UAS ${result.oracle.uas.toFixed(4)}; ${result.scorer.score.words} words`);
    expect(result.scorer.score.misaligned).toBe(0);
    expect(uas).toBeGreaterThanOrEqual(0.91);
    expect(las).toBeGreaterThanOrEqual(0.85);
    expect(result.oracle.uas).toBeGreaterThan(uas);
  });

  it('with en-function has 40–60% of arcs between neighbours and 70–90% within three words (common practice, CHECK-VALUES §3)', async () => {
    const conversion = settings('en-function');
    let arcs = 0;
    let one = 0;
    let three = 0;
    let n = 0;
    for await (const tree of gumTrees()) {
      const result = convertTree(tree, conversion, String(++n), 'gum');
      if (!result) continue;
      for (const length of analyseTree(headVector(result.sentence)!).arcLengths) {
        arcs++;
        if (length === 1) one++;
        if (length <= 3) three++;
      }
    }
    expect(one / arcs).toBeGreaterThanOrEqual(0.4);
    expect(one / arcs).toBeLessThanOrEqual(0.6);
    expect(three / arcs).toBeGreaterThanOrEqual(0.7);
    expect(three / arcs).toBeLessThanOrEqual(0.9);
  });
});
