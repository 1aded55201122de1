// Hardening, part 4: properties over random trees (fast-check). Every path from a reader through a
// writer back to a reader, and every conversion, must hold for any labels and words, brackets,
// spaces, unicode and deep chains included: no exception; the words that go in come out, or the
// tree is refused with a reason (which the commands report as unwritable-tree); what is written
// reads back with no error.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { ConstituentNode, Preterminal, Tree } from '../../src/model/constituency.js';
import type { DependencySentence } from '../../src/model/dependency.js';
import { parseLabel } from '../../src/model/label.js';
import type { Diagnostic } from '../../src/diagnostics/diagnostic.js';
import { readBracketedText } from '../../src/formats/bracketed/read-bracketed.js';
import { unwritableReason } from '../../src/formats/bracketed/write-bracketed.js';
import { writeTree } from '../../src/traces/write-tree.js';
import { readXmlGraphText } from '../../src/formats/xml-graph/read-xml-graph.js';
import { writeXmlSentence, xmlDocumentEnd, xmlDocumentStart } from '../../src/formats/xml-graph/write-xml-graph.js';
import { readConlluText } from '../../src/formats/conllu/read-conllu.js';
import { unwritableSentenceReason, writeSentence } from '../../src/formats/conllu/write-conllu.js';
import { convertTree, type ConversionSettings } from '../../src/convert/convert-tree.js';
import { buildBrackets } from '../../src/reverse/build-brackets.js';
import { loadCategoryTable } from '../../src/tables/load-category-table.js';
import { loadHeadTable, loadLabelTable } from '../../src/tables/load-table.js';
import { treeHeads } from '../../src/analysis/heads.js';
import { preterminalsOf } from '../../src/model/traverse.js';
import { terminalsInOrder } from '../../src/model/terminal-order.js';

/** Text a corpus or a hostile file may put in a label, a tag or a word. */
const awkward = fc.oneof(
  { weight: 6, arbitrary: fc.constantFrom('gull', 'pier', 'Þóra', 'naïve', 'ferry', 'x', 'NP', 'N-N', 'ADV') },
  { weight: 2, arbitrary: fc.constantFrom('(a)', 'a b', ')', '(', '\\', '*', '0', '*T*-1', '', '-LRB-', 'x\ty', 'né\u00a0ma', '#', '$', '=', 'ID', 'CODE', 'ROOT', '-NONE-', '\u2028', '\u0000', '𝔉', '&amp;', '<t/>', '"', 'N\uFEFFNS', 'a\u00a0b', '\u000b') },
  { weight: 2, arbitrary: fc.string({ maxLength: 6 }) },
  { weight: 1, arbitrary: fc.string({ unit: 'grapheme', maxLength: 4 }) },
);

const preterminal: fc.Arbitrary<Preterminal> = fc.record({ pos: awkward, form: awkward }).map(({ pos, form }) => ({ type: 'preterminal', pos, word: { type: 'word', form } }));
const empty: fc.Arbitrary<ConstituentNode> = fc.constantFrom('*T*-1', '*pro*', '0', '*ICH*-2').map((text) => ({
  type: 'empty',
  label: parseLabel('-NONE-'),
  text,
  kind: text.replace(/-\d+$/, ''),
  ...(/-\d+$/.test(text) ? { refIndex: Number(text.split('-').pop()) } : {}),
}));
const { node } = fc.letrec<{ node: ConstituentNode }>((tie) => ({
  node: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    preterminal,
    empty,
    fc.record({ label: awkward, children: fc.array(tie('node'), { minLength: 1, maxLength: 4 }) }).map(({ label, children }) => ({ type: 'phrase', label: parseLabel(label), children }) as ConstituentNode),
  ),
}));
/** A tree: one or two top nodes under the empty outer bracket, perhaps an identifier. */
const tree: fc.Arbitrary<Tree> = fc.record({ children: fc.array(node, { minLength: 1, maxLength: 2 }), id: fc.option(awkward, { nil: undefined }) }).map(({ children, id }) => ({
  type: 'tree',
  wrapper: { label: '' },
  children,
  ...(id === undefined ? {} : { id }),
}));
/** A chain of phrases as deep as a bracketing may be, over one word. */
const deepChain: fc.Arbitrary<Tree> = fc.integer({ min: 1, max: 1998 }).map((depth) => {
  let current: ConstituentNode = { type: 'preterminal', pos: 'N', word: { type: 'word', form: 'keel' } };
  for (let i = 0; i < depth; i++) current = { type: 'phrase', label: parseLabel('NP'), children: [current] };
  return { type: 'tree', wrapper: { label: '' }, children: [current], id: 'deep' };
});

const forms = (t: Tree) => preterminalsOf(t).map((p) => p.word.form);
const errorsOf = (problems: Diagnostic[]) => problems.filter((d) => d.severity === 'error').map((d) => `${d.code}: ${d.message}`);
const runs = { numRuns: 400, seed: 20261202 };

// Long runs get their own time budget: the default 5 s is for unit tests on a loaded machine.
const BUDGET = 120_000;

describe('bracketed: written trees read back with their words', () => {
  it('holds for any labels and words (or the tree is refused with a reason)', () => {
    fc.assert(
      fc.property(tree, (t) => {
        if (unwritableReason(t)) return;
        const problems: Diagnostic[] = [];
        const back = readBracketedText(writeTree(t), {}, (d) => problems.push(d));
        expect(errorsOf(problems)).toEqual([]);
        expect(back).toHaveLength(1);
        expect(forms(back[0]!)).toEqual(forms(t));
      }),
      runs,
    );
  }, BUDGET);

  it('holds for chains up to the depth limit, in both layouts', () => {
    fc.assert(
      fc.property(deepChain, fc.constantFrom('line', 'indented' as const), (t, layout) => {
        expect(unwritableReason(t)).toBeUndefined();
        const problems: Diagnostic[] = [];
        const back = readBracketedText(writeTree(t, { layout }), {}, (d) => problems.push(d));
        expect(errorsOf(problems)).toEqual([]);
        expect(forms(back[0]!)).toEqual(['keel']);
      }),
      { numRuns: 20, seed: 20261202 },
    );
  }, BUDGET);
});

describe('XML graphs: written trees read back with their words', () => {
  it('holds for any labels and words (or the writer refuses the tree)', () => {
    fc.assert(
      fc.property(tree, (t) => {
        let sentence: string;
        try {
          sentence = writeXmlSentence(t, 1);
        } catch {
          return; // refused: a character XML 1.0 cannot carry (the commands report it)
        }
        const problems: Diagnostic[] = [];
        const back = readXmlGraphText(xmlDocumentStart() + sentence + xmlDocumentEnd(), {}, (d) => problems.push(d));
        expect(errorsOf(problems)).toEqual([]);
        expect(back).toHaveLength(1);
        const words = (x: Tree) => terminalsInOrder(x).flatMap((n) => (n.type === 'preterminal' ? [n.word.form] : []));
        expect(words(back[0]!)).toEqual(words(t));
      }),
      runs,
    );
  }, BUDGET);
});

describe('conversion: every tree converts to a dependency tree over its words', () => {
  const settings: ConversionSettings = { heads: loadHeadTable('en-content'), labels: loadLabelTable('en-ud'), traces: 'keep', coordination: 'first', punctuation: 'phrase' };
  it('holds in both trace modes, and the CoNLL-U written reads back (or is refused with a reason)', () => {
    fc.assert(
      fc.property(tree, fc.constantFrom('keep', 'resolve' as const), (t, traces) => {
        const result = convertTree(t, { ...settings, traces }, 'x', 'x');
        const words = forms(t);
        if (!result) {
          expect(words).toEqual([]);
          return;
        }
        // CoNLL-U is written in Unicode form C (UD v2 format specification, CHECK-VALUES §6).
        expect(result.sentence.lines.map((l) => l.form).sort()).toEqual(words.map((w) => w.normalize('NFC')).sort());
        expect('heads' in treeHeads(result.sentence)).toBe(true);
        if (unwritableSentenceReason(result.sentence)) return;
        const problems: Diagnostic[] = [];
        const back = readConlluText(writeSentence(result.sentence), {}, (d) => problems.push(d));
        expect(errorsOf(problems).filter((e) => !e.startsWith('text-differs'))).toEqual([]);
        expect(back[0]!.lines.map((l) => l.form)).toEqual(result.sentence.lines.map((l) => l.form));
      }),
      runs,
    );
  }, BUDGET);
});

describe('to-brackets: any dependency tree becomes a bracketing that reads back with its words', () => {
  const categories = loadCategoryTable('ud');
  const sentence = fc
    .array(fc.record({ form: awkward, upos: awkward, deprel: fc.constantFrom('nsubj', 'obj', 'acl:relcl', 'dep', 'punct') }), { minLength: 1, maxLength: 12 })
    .chain((words) =>
      fc.array(fc.nat(), { minLength: words.length, maxLength: words.length }).map((picks): DependencySentence => {
        // A random tree: each word after the first placed hangs from one placed before it, in a shuffled order.
        const order = words.map((_, i) => i + 1).sort((a, b) => ((picks[a - 1]! * 7919) % 13) - ((picks[b - 1]! * 7919) % 13));
        const heads = new Array<number>(words.length + 1).fill(0);
        order.forEach((w, i) => (heads[w] = i === 0 ? 0 : order[picks[w - 1]! % i]!));
        return {
          type: 'dependency-sentence',
          comments: [],
          id: 'r1',
          lines: words.map((word, i) => ({ type: 'word', id: String(i + 1), form: word.form, lemma: '_', upos: word.upos, xpos: '_', feats: '_', head: String(heads[i + 1]), deprel: heads[i + 1] === 0 ? 'root' : word.deprel, deps: '_', misc: '_' })),
        };
      }),
    );
  it('holds in both shapes', () => {
    fc.assert(
      fc.property(sentence, fc.constantFrom('flat', 'layered' as const), (s, shape) => {
        const built = buildBrackets(s, { categories, shape, pos: 'upos' });
        expect(built).toBeDefined();
        if (unwritableReason(built!.tree)) return;
        const problems: Diagnostic[] = [];
        const back = readBracketedText(writeTree(built!.tree), {}, (d) => problems.push(d));
        expect(errorsOf(problems)).toEqual([]);
        expect(preterminalsOf(back[0]!)).toHaveLength(s.lines.length);
      }),
      runs,
    );
  }, BUDGET);
});
