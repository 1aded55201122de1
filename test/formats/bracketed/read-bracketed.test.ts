import { describe, expect, it } from 'vitest';
import { readBracketed } from '../../../src/formats/bracketed/read-bracketed.js';
import type { Tree } from '../../../src/model/constituency.js';
import { preterminalsOf } from '../../../src/model/traverse.js';
import { read } from '../../support/read.js';

const forms = (tree: Tree) => preterminalsOf(tree).map((p) => p.word.form);

describe('reading bracketed trees', () => {
  it('reads many trees per file whatever the layout', () => {
    const text = '(S (NP (N Gulls)) (VP (V cried)))(S (NP (N Terns)) (VP (V dived)))\n\n\n   (S\n(NP (N Seals))\n (VP (V slept)))';
    const { trees, problems } = read(text, { treeBreaks: 'brackets' });
    expect(problems).toEqual([]);
    expect(trees.map(forms)).toEqual([['Gulls', 'cried'], ['Terns', 'dived'], ['Seals', 'slept']]);
  });

  it('treats the empty outer bracket, ROOT and TOP as wrappers', () => {
    const { trees } = read('( (S (N Fog)) )\n(ROOT (S (N Fog)))\n(TOP (S (N Fog)))\n(S (N Fog))');
    expect(trees.map((t) => t.wrapper?.label)).toEqual(['', 'ROOT', 'TOP', undefined]);
    for (const tree of trees) expect(tree.children).toHaveLength(1);
  });

  it('takes the identifier from an ID node beside the tree', () => {
    const { trees } = read('( (IP-MAT (NP-SBJ (N-N fog-fog))) (ID harbour.log,.12))');
    expect(trees[0]!.id).toBe('harbour.log,.12');
    expect(trees[0]!.children).toHaveLength(1);
  });

  it('splits phrase labels into category, function tags, coindex and gapping index', () => {
    const { trees } = read('( (IP-MAT (NP-SBJ-1 (N x)) (PP-LOC-PRD (P y)) (IP-SUB=2 (V z))))');
    const top = trees[0]!.children[0]!;
    expect(top.type === 'phrase' && top.children.map((c) => (c.type === 'phrase' ? c.label : null))).toEqual([
      { category: 'NP', functions: ['SBJ'], coindex: 1 },
      { category: 'PP', functions: ['LOC', 'PRD'] },
      { category: 'IP', functions: ['SUB'], gapIndex: 2 },
    ]);
  });

  it('keeps part-of-speech tags whole, punctuation and bracket tags included', () => {
    const { trees } = read('(S (N-N a) (. .) (, ,) (-LRB- -LRB-) (NPR$ b))');
    expect(preterminalsOf(trees[0]!).map((p) => p.pos)).toEqual(['N-N', '.', ',', '-LRB-', 'NPR$']);
  });

  it('reads both kinds of empty element with their kind and index (bracketing conventions, Bies et al. 1995, from memory)', () => {
    const { trees } = read('(S (NP (-NONE- *T*-1)) (NP-SBJ *pro*) (C 0) (NP (-NONE- *ICH*-12)) (NP-SBJ *-3) (VB *))');
    const top = trees[0]!.children[0]!;
    const empties = top.type === 'phrase' ? top.children.flatMap((c) => (c.type === 'phrase' ? c.children : [c])) : [];
    expect(empties.map((e) => (e.type === 'empty' ? [e.kind, e.refIndex, e.label.category] : e.type))).toEqual([
      ['*T*', 1, '-NONE-'],
      ['*pro*', undefined, 'NP'],
      ['0', undefined, 'C'],
      ['*ICH*', 12, '-NONE-'],
      ['*', 3, 'NP'],
      ['*', undefined, 'VB'],
    ]);
    expect(preterminalsOf(trees[0]!)).toEqual([]);
  });

  it('keeps an asterisk tagged SYM and a zero tagged CD as words', () => {
    const { trees } = read('(S (SYM *) (CD 0) (NUM-N 0))');
    expect(forms(trees[0]!)).toEqual(['*', '0', '0']);
  });

  it('undoes escaped brackets in leaves', () => {
    const { trees } = read('(S (-LRB- \\() (SYM a\\)b) (-RRB- \\)))');
    expect(forms(trees[0]!)).toEqual(['(', 'a)b', ')']);
  });

  it('splits word-lemma leaves at the last hyphen only when asked', () => {
    const text = '( (IP-MAT (NPR-N Holm-holm) (ADJ-N sea-green-green) (. ---)) (ID a.1))';
    expect(forms(read(text).trees[0]!)).toEqual(['Holm-holm', 'sea-green-green', '---']);
    const split = preterminalsOf(read(text, { splitLemmas: true }).trees[0]!).map((p) => [p.word.form, p.word.lemma]);
    expect(split).toEqual([['Holm', 'holm'], ['sea-green', 'green'], ['-', '-']]);
  });

  it('never splits empty elements, even with lemma splitting on', () => {
    const { trees } = read('(IP (NP-SBJ *T*-1) (N-N x-y))', { splitLemmas: true });
    const top = trees[0]!.children[0]!;
    expect(top.type === 'phrase' && top.children[0]).toMatchObject({ type: 'empty', text: '*T*-1', refIndex: 1 });
  });

  it('keeps CODE and META brackets apart from the words of the sentence, and drops nested ones on request', () => {
    const text = '( (IP-MAT (NP-SBJ (N-N fog)) (CODE {COM:unsure}) (VBD lifted)) (ID a.1))\n( (META (CODE <heading>) (NP (N-N day)) (CODE </heading>)) (ID a.2))';
    const kept = read(text).trees;
    expect(kept.map(forms)).toEqual([['fog', 'lifted'], []]);
    const top = kept[0]!.children[0]!;
    expect(top.type === 'phrase' && top.children.map((c) => c.type)).toEqual(['phrase', 'meta', 'preterminal']);
    const dropped = read(text, { keepMeta: false }).trees;
    const droppedTop = dropped[0]!.children[0]!;
    expect(droppedTop.type === 'phrase' && droppedTop.children.map((c) => c.type)).toEqual(['phrase', 'preterminal']);
    expect(dropped[1]!.children[0]!.type).toBe('meta'); // a heading between sentences stays: it is not inside a sentence
  });

  it('reads UTF-8 with a byte-order mark and CRLF line ends, with the same positions as without', () => {
    const plain = read('(S (N Sjór))\n(S (N Æðarfugl))\n');
    const windows = read('\uFEFF(S (N Sjór))\r\n(S (N Æðarfugl))\r\n');
    expect(windows.trees.map(forms)).toEqual([['Sjór'], ['Æðarfugl']]);
    expect(windows.problems).toEqual([]);
    expect(windows.trees[1]!.source!.pointAt(windows.trees[1]!.position!.start)).toMatchObject({ line: 2, column: 1 });
    expect(plain.trees[1]!.source!.pointAt(plain.trees[1]!.position!.start)).toMatchObject({ line: 2, column: 1 });
  });

  it('gives every node its source span', () => {
    const text = '( (S (NP-SBJ (N Fog))\n     (VP (V lifted))) (ID x.1))';
    const tree = read(text).trees[0]!;
    const top = tree.children[0]!;
    expect(text.slice(top.position!.start, top.position!.end)).toBe('(S (NP-SBJ (N Fog))\n     (VP (V lifted)))');
    const lifted = preterminalsOf(tree)[1]!;
    expect(text.slice(lifted.word.position!.start, lifted.word.position!.end)).toBe('lifted');
    expect(tree.source!.pointAt(lifted.position!.start)).toMatchObject({ line: 2, column: 10 });
    expect(text.slice(tree.idPosition!.start, tree.idPosition!.end)).toBe('x.1');
  });

  it('gives the same trees and problems however the input is cut into pieces', async () => {
    const text = '( (S (NP (N Gulls\\))) (VP (V cried))) (ID a.1))\n)\n( (S (NP (N Terns)) (ID a.2))\n( (S (N Seals)) (ID a.3))\n';
    const whole = read(text);
    for (const size of [1, 2, 3, 7, 16]) {
      const pieces: string[] = [];
      for (let i = 0; i < text.length; i += size) pieces.push(text.slice(i, i + size));
      const problems: unknown[] = [];
      const trees: Tree[] = [];
      for await (const tree of readBracketed(pieces, { file: 't.psd' }, (d) => problems.push(d))) trees.push(tree);
      expect(trees.map((t) => [t.id, forms(t), t.position])).toEqual(whole.trees.map((t) => [t.id, forms(t), t.position]));
      expect(problems.map((p) => (p as { code: string; line: number; column: number }))).toEqual(
        whole.problems.map((p) => expect.objectContaining({ code: p.code, line: p.line, column: p.column })),
      );
    }
  });
});
