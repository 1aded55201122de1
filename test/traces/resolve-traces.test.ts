// Worked examples of trace resolution on invented sentences. The trace kinds and
// their reading ("interpret the antecedent where the trace stands" for *T*, *ICH*,
// *EXP*, *RNR*) follow the bracketing conventions (Bies et al. 1995, from memory).
import { describe, expect, it } from 'vitest';
import { resolveTraces } from '../../src/traces/resolve-traces.js';
import { writeNode } from '../../src/formats/bracketed/write-bracketed.js';
import type { ConstituentNode, Phrase, Tree } from '../../src/model/constituency.js';
import { countDiscontinuousPhrases, orderOf, terminalsInOrder } from '../../src/model/terminal-order.js';
import { read } from '../support/read.js';

/** The tree drawn as brackets in tree order, each word followed by its place in the sentence. */
function outline(tree: Tree): string {
  const draw = (node: ConstituentNode): string => {
    if (node.type === 'preterminal') return `${node.word.form}@${node.word.order}`;
    if (node.type === 'empty') return `${node.text}@${node.order}`;
    if (node.type === 'meta') return `{${node.label}}`;
    return `(${[node.label.category + (node.label.coindex ? `-${node.label.coindex}` : ''), ...node.children.map(draw)].join(' ')})`;
  };
  return tree.children.map(draw).join(' ');
}

const resolve = (text: string) => resolveTraces(read(text).trees[0]!);

describe('resolving traces into discontinuous phrases', () => {
  it('moves a fronted wh-phrase into the verb phrase where its *T* trace stood', () => {
    const { tree, moved } = resolve('( (SBARQ (WHNP-1 (WDT Which) (NN boat)) (SQ (VBD did) (NP-SBJ (NNS crews)) (VP (VB mend) (NP (-NONE- *T*-1)))) (. ?)))');
    expect(moved).toBe(1);
    expect(tree.discontinuous).toBe(true);
    // The trace is gone, the words keep their places, and the children stand in the order of their first word.
    expect(outline(tree)).toBe('(SBARQ (SQ (VP (NP (WHNP Which@1 boat@2)) mend@5) did@3 (NP crews@4)) ?@6)');
    // VP now covers words 1, 2 and 5; SQ covers 1 to 5 without a gap.
    expect(countDiscontinuousPhrases(tree)).toBe(1);
  });

  it('puts an extraposed clause back into its noun phrase for *ICH*', () => {
    const { tree } = resolve('( (S (NP-SBJ (DT A) (NN rumour) (SBAR (-NONE- *ICH*-2))) (VP (VBD spread) (SBAR-2 (IN that) (S (NP-SBJ (NNS ferries)) (VP (VBD stopped))))) (. .)))');
    const np = (tree.children[0] as Phrase).children[0] as Phrase;
    expect(writeNode({ ...np, children: np.children.slice(0, 2) })).toBe('(NP-SBJ (DT A) (NN rumour))');
    expect(terminalsInOrder(tree).map((t) => orderOf(t))).toEqual([1, 2, 3, 4, 5, 6, 7]);
    expect(countDiscontinuousPhrases(tree)).toBe(1);
  });

  it('moves a right-node-raised phrase to its first trace only, as a word has one parent', () => {
    const { tree, moved, leftover } = resolve(
      '( (S (NP-SBJ (NNS Crews)) (VP (VP (VBD loaded) (NP (-NONE- *RNR*-1))) (CC and) (VP (VBD unloaded) (NP (-NONE- *RNR*-1))) (NP-1 (DT the) (NNS crates))) (. .)))',
    );
    expect([moved, leftover]).toEqual([1, 1]);
    // The phrase that held the trace now holds the antecedent; the second trace stays, so the coindex does too.
    expect(outline(tree)).toBe('(S (NP Crews@1) (VP (VP loaded@2 (NP (NP-1 the@6 crates@7))) and@3 (VP unloaded@4 (NP *RNR*-1@5))) .@8)');
  });

  it('keeps the coindex only while another trace still points to it', () => {
    const { tree } = resolve('( (S (NP-TPC-1 (NNS Nets)) (NP-SBJ (PRO we)) (VP (VBD mended) (NP (-NONE- *T*-1))) (. .)))');
    expect(outline(tree)).toBe('(S (VP (NP (NP Nets@1)) mended@3) (NP we@2) .@4)');
  });

  it('leaves traces without an antecedent with words, and *pro*, as empty elements', () => {
    const { tree, moved } = resolve('( (S (SBAR (WHNP-1 (-NONE- 0)) (C that)) (NP-SBJ (-NONE- *pro*)) (VP (VBD sailed) (NP (-NONE- *T*-1))) (. .)))');
    expect(moved).toBe(0);
    expect(outline(tree)).toBe('(S (SBAR (WHNP-1 0@1) that@2) (NP *pro*@3) (VP sailed@4 (NP *T*-1@5)) .@6)');
  });

  it('changes nothing in the tree it was given', () => {
    const original = read('( (S (NP-TPC-1 (NNS Nets)) (NP-SBJ (PRO we)) (VP (VBD mended) (NP (-NONE- *T*-1))) (. .)))').trees[0]!;
    const before = JSON.stringify(original, (key, value) => (key === 'source' ? undefined : value));
    resolveTraces(original);
    expect(JSON.stringify(original, (key, value) => (key === 'source' ? undefined : value))).toBe(before);
  });
});
