import { describe, expect, it } from 'vitest';
import { validate, where } from '../../support/read.js';

// Each case puts one broken tree between two good ones, on line 2, and names
// the code and line:col the problem must be reported at.
const before = '( (S (NP-SBJ (N Gulls)) (VP (V cried))) (ID good.1))\n';
const after = '\n( (S (NP-SBJ (N Terns)) (VP (V dived))) (ID good.2))\n';

const cases: Array<[kind: string, broken: string, expected: string[], readBroken: boolean]> = [
  ['a tree never closed', '( (S (NP (N Fog)) (ID b.1))', ['unclosed-bracket@2:1'], false],
  ['a bracket inside never closed', '( (S (NP (N Fog) (ID b.1))', ['unclosed-bracket@2:3'], false],
  ['a closing bracket with no tree open', '( (S (N Fog)) (ID b.1)))', ['unmatched-close@2:24'], true],
  ['text between trees', 'the fog lifted ( (S (N Fog)) (ID b.1))', ['text-outside-tree@2:1'], true],
  ['empty brackets', '( (S () (N Fog)) (ID b.1))', ['empty-brackets@2:6'], false],
  ['a bracket without a label', '( (S ( (N Fog))) (ID b.1))', ['empty-label@2:6'], false],
  ['a label with nothing inside', '( (S (NP) (N Fog)) (ID b.1))', ['childless-node@2:6'], false],
  ['a word beside brackets', '( (S (NP (D the) fog)) (ID b.1))', ['word-outside-preterminal@2:18'], false],
  ['two words under one tag', '( (S (N sea fog)) (ID b.1))', ['several-words@2:13'], false],
  ['an outer bracket with only an identifier', '( (ID b.1))', ['empty-tree@2:1'], false],
  ['an identifier node holding a bracket', '( (S (N Fog)) (ID (X b.1)))', ['misplaced-id@2:15'], false],
  ['two identifier nodes', '( (S (N Fog)) (ID b.1) (ID b.2))', ['misplaced-id@2:24'], false],
  ['a word directly under the outer bracket', '( (S (N Fog)) fog (ID b.1))', ['word-outside-preterminal@2:15'], false],
  ['invalid UTF-8, decoded as U+FFFD', '( (S (N F\uFFFDg)) (ID b.1))', ['invalid-encoding@2:10'], false],
  ['nesting deeper than the limit', '( ' + '(X '.repeat(40) + '(N Fog)' + ')'.repeat(40) + ' (ID b.1))', ['tree-too-large@2:1'], false],
  ['two sentence nodes under one wrapper', '( (S (N Fog)) (S (N Rain)) (ID b.1))', ['several-roots@2:1'], true],
  ['a trace pointing nowhere', '( (S (NP-SBJ (N Fog)) (VP (V lifted) (NP (-NONE- *T*-4)))) (ID b.1))', ['trace-without-antecedent@2:42'], true],
  ['a gapping index with no antecedent', '( (S (NP-SBJ=3 (N Fog)) (VP (V lifted))) (ID b.1))', ['gap-without-antecedent@2:6'], true],
  ['two antecedents for one index', '( (S (NP-1 (N Fog)) (NP-1 (N Rain)) (VP (V came) (NP *T*-1))) (ID b.1))', ['duplicate-antecedent@2:21'], true],
  ['a coindex nothing points to', '( (S (NP-SBJ-5 (N Fog)) (VP (V lifted))) (ID b.1))', ['unreferenced-coindex@2:6'], true],
  ['an identifier used twice', '( (S (N Fog)) (ID good.1))', ['duplicate-id@2:19'], true],
  ['a tree without identifier among trees with one', '( (S (N Fog)))', ['missing-id@2:1'], true],
  ['a tree of empty elements only', '( (S (NP-SBJ *pro*) (VP (VB *))) (ID b.1))', ['no-words@2:1'], true],
];

describe('broken input', () => {
  it.each(cases)('reports %s with its code and line:col, and reads the trees around it', (_kind, broken, expected, readBroken) => {
    const { trees, problems } = validate(before + broken + after, { maxDepth: 30 });
    expect(where(problems)).toEqual(expected);
    const ids = trees.map((tree) => tree.id);
    expect(ids[0]).toBe('good.1');
    expect(ids[ids.length - 1]).toBe('good.2');
    expect(trees).toHaveLength(readBroken ? 3 : 2);
  });

  it('covers at least fifteen kinds of problem', () => {
    expect(new Set(cases.map(([, , [code]]) => code!.split('@')[0])).size).toBeGreaterThanOrEqual(15);
  });

  it('reports a warning for a word without lemma once per file when lemmas are split', () => {
    const { problems } = validate('( (S (N fog-fog) (V lifted)) (ID a.1))\n( (S (N rain)) (ID a.2))\n', { splitLemmas: true });
    expect(where(problems)).toEqual(['missing-lemma@1:21']);
  });

  it('with tree breaks by brackets only, an unclosed tree runs to the end of the input', () => {
    const { trees, problems } = validate(before + '( (S (NP (N Fog)) (ID b.1))' + after, { treeBreaks: 'brackets' });
    expect(where(problems)).toEqual(['unclosed-bracket@2:1']);
    expect(trees.map((t) => t.id)).toEqual(['good.1']);
  });

  it('points a tree too long for the reader at its start and goes on after it', () => {
    const long = '( (S ' + '(N fog) '.repeat(50) + ') (ID b.1))';
    const { trees, problems } = validate(before + long + after, { maxTreeLength: 100 });
    expect(where(problems)).toEqual(['tree-too-large@2:1']);
    expect(trees.map((t) => t.id)).toEqual(['good.1', 'good.2']);
  });
});
