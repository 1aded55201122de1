import { wordIndicesUnder, type ConversionNode, type PhraseNode } from './conversion-tree.js';

/**
 * Head choice by a gold tree, for measuring the ceiling of head percolation:
 * in every phrase, the child holding the phrase's gold head, that is the word
 * of the phrase whose gold head lies outside it (the first, if several do).
 * `goldHeads[i]` is the gold head of word i (1-based). Phrases are asked
 * innermost first (find-heads does so), so each child's words are known when
 * its phrase is asked; nothing recurses over depth.
 */
export function oracleChooser(goldHeads: readonly number[]): (phrase: PhraseNode) => number | undefined {
  const wordsOf = new Map<ConversionNode, number[]>();
  const words = (node: ConversionNode): number[] => {
    if (node.kind === 'word') return [node.index];
    const known = wordsOf.get(node);
    if (known) return known;
    // A phrase asked before its children (not the find-heads order) gathers them with a stack.
    return wordIndicesUnder(node);
  };
  return (phrase) => {
    const byChild = phrase.children.map(words);
    const inside = new Set<number>();
    for (const list of byChild) for (const word of list) inside.add(word);
    wordsOf.set(phrase, [...inside]);
    let headWord: number | undefined;
    for (const word of [...inside].sort((a, b) => a - b)) {
      if (!inside.has(goldHeads[word] ?? 0)) {
        headWord = word;
        break;
      }
    }
    if (headWord === undefined) return undefined;
    return byChild.findIndex((list) => list.includes(headWord!));
  };
}
