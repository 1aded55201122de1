/**
 * The tree the conversion passes work on: the words of a bracketed tree with
 * their phrases, empty elements and notes taken out (and, when traces are
 * restored, antecedents moved to where their traces stood). Built by
 * prepare-tree; find-heads fills `head`.
 */
import type { Phrase, Preterminal } from '../model/constituency.js';
import { postOrder, preOrder } from '../model/traverse.js';

/** A word of the sentence. */
export interface WordNode {
  kind: 'word';
  /** Position in the sentence, from 1. */
  index: number;
  /** Category and function tags of its tag, for patterns (`N-N` is category N, tag N). */
  category: string;
  functions: readonly string[];
  /** The tag as written. */
  pos: string;
  form: string;
  lemma: string | undefined;
  /** The bracket it was read from. */
  source: Preterminal;
}

/** The parts of a coordinated phrase, as child indices (found by handle-coordination). */
export interface Coordination {
  conjuncts: number[];
  coordinators: number[];
  /** Punctuation children between the first and the last conjunct. */
  separators: number[];
  /** Set when the step attach-late-conjuncts drew it, with the table line that switched it on. */
  late?: { file: string; line: number };
}

/** A phrase over at least one word. */
export interface PhraseNode {
  kind: 'phrase';
  category: string;
  functions: readonly string[];
  /** The label as written. */
  label: string;
  children: ConversionNode[];
  /** Filled by find-heads: which child heads the phrase, and why. */
  head?: HeadChoice;
  /** Filled by find-heads: the word its heads lead down to. */
  headWord?: WordNode;
  /** Filled by find-heads when the phrase is a coordination drawn in a style. */
  coordination?: Coordination;
  /** The bracket it was read from; absent for the sentence-level group of several top nodes. */
  source?: Phrase;
}

/** Why a child heads its phrase: the step of the table (or the rule) that chose it. */
export interface HeadChoice {
  /** Index of the head child. */
  child: number;
  /** How it was chosen, for `heads explain`: `VP (line 12): left each TO VBD … [matched TO]`. */
  readonly reason: string;
  /** The table line of the step, when a step chose it. */
  line?: number;
}

export type ConversionNode = WordNode | PhraseNode;

/** The word a node's heads lead down to. */
export function headWordOf(node: ConversionNode): WordNode {
  if (node.kind === 'word') return node;
  if (node.headWord) return node.headWord;
  let current: ConversionNode = node;
  while (current.kind === 'phrase') current = current.children[current.head?.child ?? 0]!;
  return current;
}

/** The positions (from 1) of the words under a node, gathered with a stack (no recursion over depth). */
export function wordIndicesUnder(node: ConversionNode): number[] {
  const indices: number[] = [];
  const stack: ConversionNode[] = [node];
  while (stack.length > 0) {
    const next = stack.pop()!;
    if (next.kind === 'word') indices.push(next.index);
    else stack.push(...next.children);
  }
  return indices;
}

function childrenOf(node: ConversionNode): ConversionNode[] | undefined {
  return node.kind === 'phrase' ? node.children : undefined;
}

/** The phrases under (and including) a node, innermost first, left to right. */
export function phrasesBottomUp(root: ConversionNode): PhraseNode[] {
  return postOrder([root], childrenOf).filter((node): node is PhraseNode => node.kind === 'phrase');
}

/** The phrases under (and including) a node, outermost first, left to right. */
export function phrasesTopDown(root: ConversionNode): PhraseNode[] {
  return preOrder([root], childrenOf).filter((node): node is PhraseNode => node.kind === 'phrase');
}
