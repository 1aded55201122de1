import type { ConversionNode, PhraseNode } from './conversion-tree.js';

/**
 * Head choice by a gold tree, for measuring the ceiling of head percolation:
 * in every phrase, the child holding the phrase's gold head, that is the word
 * of the phrase whose gold head lies outside it (the first, if several do).
 * `goldHeads[i]` is the gold head of word i (1-based).
 */
export function oracleChooser(goldHeads: readonly number[]): (phrase: PhraseNode) => number | undefined {
  return (phrase) => {
    const inside = new Set<number>();
    const collect = (node: ConversionNode) => {
      if (node.kind === 'word') inside.add(node.index);
      else node.children.forEach(collect);
    };
    collect(phrase);
    let headWord: number | undefined;
    for (const word of [...inside].sort((a, b) => a - b)) {
      if (!inside.has(goldHeads[word] ?? 0)) {
        headWord = word;
        break;
      }
    }
    if (headWord === undefined) return undefined;
    return phrase.children.findIndex((child) => {
      const words = new Set<number>();
      const gather = (node: ConversionNode) => (node.kind === 'word' ? words.add(node.index) : node.children.forEach(gather));
      gather(child);
      return words.has(headWord!);
    });
  };
}
