import type { DependencySentence, DependencyWord } from '../model/dependency.js';

/**
 * The basic tree of a sentence as a head vector: `heads[i]` is the head of
 * word i (1-based; index 0 unused), 0 for the root. Multiword-token lines and
 * empty nodes are left out. Undefined when a HEAD is not a number.
 */
export function headVector(sentence: DependencySentence): number[] | undefined {
  const heads = [0];
  for (const line of sentence.lines) {
    if (line.type !== 'word') continue;
    const head = Number(line.head);
    if (!Number.isInteger(head) || line.head === '' || line.head === '_') return undefined;
    heads.push(head);
  }
  return heads;
}

/** The word lines of a sentence, in order (multiword tokens and empty nodes left out). */
export function wordsOf(sentence: DependencySentence): DependencyWord[] {
  return sentence.lines.filter((line): line is DependencyWord => line.type === 'word');
}
