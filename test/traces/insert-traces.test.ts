// insert-traces is the inverse of resolve-traces: a discontinuous tree becomes a
// bracketing with coindexed *ICH* traces ("interpret constituent here", bracketing
// conventions, Bies et al. 1995, from memory), and resolving those traces gives the
// discontinuous tree back. Checked on invented trees and on seeded random
// dependency trees, whose non-projective subtrees (Nivre & Nilsson 2005) are
// exactly the discontinuous phrases.
import { describe, expect, it } from 'vitest';
import { analyseTree } from '../../src/analysis/structure.js';
import { convertTree } from '../../src/convert/convert-tree.js';
import { resolveTraces } from '../../src/traces/resolve-traces.js';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { writeTree } from '../../src/traces/write-tree.js';
import { countDiscontinuousPhrases } from '../../src/model/terminal-order.js';
import { buildBrackets } from '../../src/reverse/build-brackets.js';
import { insertTraces } from '../../src/traces/insert-traces.js';
import { loadCategoryTable } from '../../src/tables/load-category-table.js';
import { loadHeadTable } from '../../src/tables/load-table.js';
import { random, randomTree } from '../support/random-trees.js';
import { read } from '../support/read.js';

const categories = loadCategoryTable('ud');
const heads = loadHeadTable('ud');

/** A CoNLL-U sentence over invented words for a head vector, every relation `dep`. */
function sentenceFor(vector: number[]) {
  const lines = vector.slice(1).map((head, i) => `${i + 1}\tw${i + 1}\t_\tNOUN\t_\t_\t${head}\t${head === 0 ? 'root' : 'dep'}\t_\t_`);
  return readConlluText(`# sent_id = r\n# text = x\n${lines.join('\n')}\n\n`, {}, () => undefined)[0]!;
}

describe('inserting *ICH* traces for discontinuous phrases', () => {
  // Resolution dropped the coindices nothing points to any more, so the new traces number from 1 again.
  it('cuts an extraposed clause out of its noun phrase, leaving the trace beside the words that stay', () => {
    const resolved = resolveTraces(read('( (S (NP-SBJ (DT A) (NN rumour) (SBAR (-NONE- *ICH*-2))) (VP (VBD spread) (SBAR-2 (IN that) (S (NP-SBJ (NNS ferries)) (VP (VBD stopped))))) (. .)))').trees[0]!).tree;
    const { tree, traces } = insertTraces(resolved);
    expect(traces).toBe(1);
    expect(writeTree(tree)).toBe('( (S (NP-SBJ (DT A) (NN rumour) (-NONE- *ICH*-1)) (VP (VBD spread)) (SBAR-1 (SBAR (IN that) (S (NP-SBJ (NNS ferries)) (VP (VBD stopped))))) (. .)))\n');
  });

  it('keeps the run that holds a word of the phrase itself and moves the others out', () => {
    const resolved = resolveTraces(read('( (SBARQ (WHNP-1 (WDT Which) (NN boat)) (SQ (VBD did) (NP-SBJ (NNS crews)) (VP (VB mend) (NP (-NONE- *T*-1)))) (. ?)))').trees[0]!).tree;
    expect(writeTree(insertTraces(resolved).tree)).toBe(
      '( (SBARQ (SQ (NP-1 (WHNP (WDT Which) (NN boat))) (VBD did) (NP-SBJ (NNS crews)) (VP (-NONE- *ICH*-1) (VB mend))) (. ?)))\n',
    );
  });

  it('gives back a tree that is not discontinuous as it is', () => {
    const tree = read('( (S (NP-SBJ (NNS Gulls)) (VP (VBD circled)) (. .)))').trees[0]!;
    expect(insertTraces(tree)).toEqual({ tree, traces: 0 });
  });

  it('round-trips 2,000 seeded random dependency trees: discontinuous phrases → traces → the same heads', () => {
    const next = random(20051231);
    let nonProjective = 0;
    for (let round = 0; round < 2000; round++) {
      const vector = randomTree(next, 2 + Math.floor(next() * 11));
      const sentence = sentenceFor(vector);
      const built = buildBrackets(sentence, { categories, shape: 'flat', pos: 'upos', discontinuous: true })!;
      const structure = analyseTree(vector);
      if (structure.nonProjectiveArcs.length > 0) nonProjective++;
      expect(countDiscontinuousPhrases(built.tree), JSON.stringify(vector)).toBe(structure.gappedWords);
      // Written as a bracketing and read again, the *ICH* traces lead back to the same heads.
      const bracketed = read(writeTree(built.tree)).trees[0]!;
      const back = convertTree(bracketed, { heads, traces: 'resolve', coordination: 'table', punctuation: 'phrase' }, 'r', 'r')!;
      expect(back.sentence.lines.map((l) => Number(l.head)), JSON.stringify(vector)).toEqual(vector.slice(1));
    }
    expect(nonProjective).toBeGreaterThan(500);
    // A long test gets its own time budget: the default 5 s is for unit tests on a loaded machine.
  }, 120_000);
});
