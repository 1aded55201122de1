import type { DependencySentence, DependencyWord } from '../model/dependency.js';

/** A HEAD as the CoNLL-U format writes it: 0 or a word number, no sign, no leading zero, no decimals. */
const HEAD_SYNTAX = /^(0|[1-9]\d*)$/;

/**
 * The basic layer of a sentence as a head vector: `heads[i]` is the head of
 * word i (1-based; index 0 unused), 0 for the root. Multiword-token lines and
 * empty nodes are left out. Undefined when a HEAD is not written as 0 or a word
 * number of the sentence (`1.0`, `+1`, `-1`, `_`, a number past the last word).
 * The vector may still hold a cycle or several roots: {@link treeHeads} checks that.
 */
export function headVector(sentence: DependencySentence): number[] | undefined {
  const heads = [0];
  let count = 0;
  for (const line of sentence.lines) if (line.type === 'word') count++;
  for (const line of sentence.lines) {
    if (line.type !== 'word') continue;
    if (!HEAD_SYNTAX.test(line.head)) return undefined;
    const head = Number(line.head);
    if (head > count) return undefined;
    heads.push(head);
  }
  return heads;
}

/** Why a head vector is not a tree, in words; undefined when it is one. */
export function whyNotATree(heads: readonly number[]): string | undefined {
  const n = heads.length - 1;
  if (n === 0) return 'the sentence has no words';
  let roots = 0;
  for (let w = 1; w <= n; w++) if (heads[w] === 0) roots++;
  if (roots === 0) return 'no word has HEAD 0';
  if (roots > 1) return `${roots} words have HEAD 0`;
  // With one root, the vector is a tree exactly when every word reaches it; walks are marked so each word is passed once.
  const state = new Uint8Array(n + 1); // 0 unseen, 1 on the current walk, 2 reaches the root
  for (let start = 1; start <= n; start++) {
    let word = start;
    const walk: number[] = [];
    while (word !== 0 && state[word] === 0) {
      state[word] = 1;
      walk.push(word);
      word = heads[word]!;
    }
    if (word !== 0 && state[word] === 1) return `heads go round in a circle through word ${word}`;
    for (const passed of walk) state[passed] = 2;
  }
  return undefined;
}

/**
 * The head vector of a sentence whose basic layer is a tree: every HEAD a word
 * number or 0, exactly one root, no cycle. Otherwise `problem` says why, and
 * the sentence cannot be measured, bracketed or round-tripped.
 */
export function treeHeads(sentence: DependencySentence): { heads: number[] } | { problem: string } {
  const heads = headVector(sentence);
  if (!heads) return { problem: 'a HEAD is not 0 or the number of a word of the sentence' };
  const problem = whyNotATree(heads);
  return problem ? { problem } : { heads };
}

/** The word lines of a sentence, in order (multiword tokens and empty nodes left out). */
export function wordsOf(sentence: DependencySentence): DependencyWord[] {
  return sentence.lines.filter((line): line is DependencyWord => line.type === 'word');
}
