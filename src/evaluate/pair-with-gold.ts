import { diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import { reportWordlessTree } from '../convert/report-wordless-tree.js';
import { prepareTree, type TraceMode } from '../convert/prepare-tree.js';
import type { WordNode } from '../convert/conversion-tree.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { sameForm } from './score-attachments.js';

/** A tree and its gold sentence, whose words line up one for one. */
export interface GoldPair {
  tree: Tree;
  gold: DependencySentence;
  /** The tree's id, else the gold sentence's, else its number among the pairs. */
  id: string;
}

/** How the pairing went: every tree and every gold sentence is in exactly one of these counts. */
export interface PairingTally {
  /** Pairs whose words line up. */
  paired: number;
  /** Pairs whose words do not line up (each reported, naming both ids). */
  misaligned: number;
  /** Trees with words left over when the gold ran out. */
  treesWithoutGold: number;
  /** Gold sentences left over when the trees ran out. */
  goldWithoutTree: number;
  /** Trees without words: they take no gold sentence. */
  wordless: number;
}

export function emptyTally(): PairingTally {
  return { paired: 0, misaligned: 0, treesWithoutGold: 0, goldWithoutTree: 0, wordless: 0 };
}

/**
 * Pairs trees with gold sentences, the one way `heads score` and `heads
 * suggest` both use: in order, a tree without words taking none (it is
 * reported); a pair counts when the words line up by number and form (bracket
 * tokens such as `-LRB-` read as brackets). A pair that does not line up is
 * reported with both ids and left out; trees or gold sentences left over at
 * the end are counted and reported once, at the first of them.
 */
export async function* pairWithGold(
  trees: AsyncIterable<Tree>,
  gold: AsyncIterable<DependencySentence>,
  traces: TraceMode,
  report: Report,
  tally: PairingTally,
  optional?: (word: DependencyWord) => boolean,
): AsyncGenerator<GoldPair> {
  const goldIterator = gold[Symbol.asyncIterator]();
  const treeIterator = trees[Symbol.asyncIterator]();
  try {
    for (;;) {
      const nextTree = await treeIterator.next();
      if (nextTree.done) break;
      const tree = nextTree.value;
      const prepared = prepareTree(tree, traces);
      if (!prepared) {
        tally.wordless++;
        reportWordlessTree(tree, report);
        continue;
      }
      const nextGold = await goldIterator.next();
      if (nextGold.done) {
        let left = 1;
        for (;;) {
          const more = await treeIterator.next();
          if (more.done) break;
          if (prepareTree(more.value, 'keep')) left++;
          else tally.wordless++;
        }
        tally.treesWithoutGold += left;
        report(diagnoseItem('unpaired', `the gold ran out: tree ${itemName(tree)} and ${left - 1} more tree${left - 1 === 1 ? '' : 's'} after it have no gold sentence; left out`, tree));
        break;
      }
      let goldSentence = nextGold.value;
      const id = tree.id ?? goldSentence.id ?? String(tally.paired + tally.misaligned + 1);
      let problem = alignmentProblem(prepared.words, goldSentence);
      if (problem && optional) {
        // Gold words marked as not scored may be words the trees do not have: the gold is read without them.
        const reduced = withoutMissing(prepared.words, goldSentence, optional);
        if (reduced) {
          goldSentence = reduced;
          problem = undefined;
        }
      }
      if (problem) {
        tally.misaligned++;
        report(diagnoseItem('misaligned', `tree ${itemName(tree)} and gold sentence ${itemName(goldSentence)} do not line up: ${problem}; left out`, tree));
        continue;
      }
      tally.paired++;
      yield { tree, gold: goldSentence, id };
    }
    const extra = await goldIterator.next();
    if (!extra.done) {
      let left = 1;
      while (!(await goldIterator.next()).done) left++;
      tally.goldWithoutTree += left;
      report(diagnoseItem('unpaired', `the trees ran out: gold sentence ${itemName(extra.value)} and ${left - 1} more after it have no tree; left out`, extra.value));
    }
  } finally {
    await goldIterator.return?.();
    await treeIterator.return?.();
  }
}

/** Why a tree's words and a gold sentence's words do not line up, or undefined when they do. */
function alignmentProblem(words: WordNode[], gold: DependencySentence): string | undefined {
  const goldWords = gold.lines.filter((line): line is DependencyWord => line.type === 'word');
  if (words.length !== goldWords.length) return `${words.length} words against ${goldWords.length}`;
  const at = words.findIndex((word, i) => !sameForm(word.form, goldWords[i]!.form));
  if (at !== -1) return `word ${at + 1} is "${words[at]!.form}" against "${goldWords[at]!.form}"`;
  return undefined;
}

/**
 * The gold sentence without the optional words the tree lacks, lined up by
 * form, or undefined when the words do not line up even so. A left-out word's
 * dependents hang from its head instead, and the words are numbered anew.
 */
function withoutMissing(words: WordNode[], gold: DependencySentence, optional: (word: DependencyWord) => boolean): DependencySentence | undefined {
  const goldWords = gold.lines.filter((line): line is DependencyWord => line.type === 'word');
  const keep = new Array<boolean>(goldWords.length).fill(false);
  let j = 0;
  for (const word of words) {
    while (j < goldWords.length && !sameForm(word.form, goldWords[j]!.form) && optional(goldWords[j]!)) j++;
    if (j >= goldWords.length || !sameForm(word.form, goldWords[j]!.form)) return undefined;
    keep[j++] = true;
  }
  for (; j < goldWords.length; j++) if (!optional(goldWords[j]!)) return undefined;
  const number = new Array<number>(goldWords.length + 1).fill(0);
  let next = 0;
  goldWords.forEach((_, i) => (number[i + 1] = keep[i] ? ++next : 0));
  // The nearest kept word up the chain of heads (0 for the root), with a bound against cycles in a broken gold.
  const keptHead = (word: number): number => {
    let head = Number(goldWords[word - 1]!.head);
    for (let steps = 0; head > 0 && !keep[head - 1] && steps < goldWords.length; steps++) head = Number(goldWords[head - 1]!.head);
    return head > 0 && keep[head - 1] ? number[head]! : 0;
  };
  const lines = goldWords.flatMap((word, i) => (keep[i] ? [{ ...word, id: String(number[i + 1]), head: /^\d+$/.test(word.head) ? String(keptHead(i + 1)) : word.head }] : []));
  return { ...gold, lines };
}

/** A line for people: how many pairs, and what was left out. */
export function describePairing(tally: PairingTally): string {
  const count = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;
  const parts = [count(tally.paired, 'sentence pair')];
  if (tally.misaligned) parts.push(`${tally.misaligned.toLocaleString('en-US')} misaligned`);
  if (tally.treesWithoutGold) parts.push(`${count(tally.treesWithoutGold, 'tree')} without gold`);
  if (tally.goldWithoutTree) parts.push(`${count(tally.goldWithoutTree, 'gold sentence')} without tree`);
  if (tally.wordless) parts.push(`${count(tally.wordless, 'tree')} without words`);
  return parts.join(', ');
}

/** True when something was left out of the pairing (for --strict). */
export function pairingIncomplete(tally: PairingTally): boolean {
  return tally.misaligned + tally.treesWithoutGold + tally.goldWithoutTree > 0;
}
