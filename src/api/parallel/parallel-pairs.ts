import type { GoldPair } from '../../evaluate/pair-with-gold.js';
import type { ConversionScorer, ScorePart } from '../../evaluate/score-conversion.js';
import type { DependencySentence } from '../../model/dependency.js';
import { InOrder, SharedJobs } from './pool.js';
import { scoreGoldPairs } from './worker.js';
import type { PairWork, TravellingPair } from './tasks.js';

/** Gold words per task: enough that sending a task costs little beside converting its trees twice. */
const TASK_WORDS = 4096;

/**
 * Scores pairs of a bracketed tree and its gold sentence on worker threads,
 * adding the parts to `scorer` in input order, which gives what scoring them
 * all on one thread gives. Pairing stays with the caller (it reads trees and
 * gold in order, and reports what does not pair). A task is scored by a free
 * worker, else here (see SharedJobs); at most a few tasks per job are in flight. Trees
 * must come from bracketed text (see TravellingPair).
 */
export async function scorePairsOnThreads(pairs: AsyncIterable<GoldPair>, scorer: ConversionScorer, work: PairWork, jobs: number): Promise<void> {
  const shared = new SharedJobs(jobs);
  const queue = new InOrder<ScorePart>();
  let batch: GoldPair[] = [];
  let words = 0;
  const submit = () => {
    if (batch.length === 0) return;
    const pairs = batch;
    queue.push(shared.take(() => scoreGoldPairs(work, pairs), (pool) => pool.run({ kind: 'pairs', work, pairs: pairs.map(travelling) })));
    batch = [];
    words = 0;
  };
  try {
    for await (const pair of pairs) {
      batch.push(pair);
      words += pair.gold.lines.length;
      if (words < TASK_WORDS) continue;
      await shared.settle();
      submit();
      while (queue.length > shared.jobs * 2 || queue.firstReady) scorer.merge(await queue.shift());
    }
    submit();
    while (queue.length > 0) scorer.merge(await queue.shift());
  } finally {
    await shared.close();
  }
}

/** A pair as it travels: the tree's bracketed text, the gold sentence without what scoring does not read. */
function travelling(pair: GoldPair): TravellingPair {
  const { tree } = pair;
  const from = tree.source!.start.offset;
  return { id: pair.id, tree: tree.source!.text.slice(tree.position!.start - from, tree.position!.end - from), gold: bare(pair.gold) };
}

/** A sentence without its line index and positions, which are for messages. */
function bare(sentence: DependencySentence): DependencySentence {
  return {
    type: sentence.type,
    comments: [],
    lines: sentence.lines.map(({ position: _, ...line }) => line) as DependencySentence['lines'],
    ...(sentence.id === undefined ? {} : { id: sentence.id }),
  };
}
