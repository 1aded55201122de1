/**
 * The worker thread of parallel runs: builds the trees of cut batches and
 * does to them what the task asks, with the library's own functions, so that
 * a batch gives here exactly what it gives on the main thread.
 */
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import { buildCutBatch } from '../../formats/bracketed/tree-batches.js';
import type { Tree } from '../../model/constituency.js';
import { emptyConversionTally, TreeConverter } from '../convert.js';
import { resolveConversionOptions, type ResolvedConversion } from '../options.js';
import { emptyRewriteTally, TreeRewriter } from '../rewrite.js';
import type { CheckedTree, DoneBatch, NamedConversionOptions, PairTask, PairWork, Task, TaskResult, TripWork, Work } from './tasks.js';
import type { GoldPair } from '../../evaluate/pair-with-gold.js';
import { readBracketedText } from '../../formats/bracketed/read-bracketed.js';
import { ConversionScorer, type ScorePart } from '../../evaluate/score-conversion.js';
import { BracketedValidator } from '../../validate/validate-bracketed.js';
import { treeIdOf } from '../../validate/check-sentence-ids.js';
import { itemName } from '../../diagnostics/diagnostic.js';
import { tripTree, unscoredTest } from '../evaluate.js';
import { BracketRoundTrip } from '../../evaluate/roundtrip.js';
import { resolveBracketOptions } from '../brackets.js';
import type { BracketSettings } from '../../reverse/build-brackets.js';
import { SentenceWorker, type StretchEvent, type StretchTask } from './sentence-work.js';

/** Tables are loaded once per worker and options: a run sends the same names with every task. */
const resolved = new Map<string, ResolvedConversion>();

function conversionOf(conversion: NamedConversionOptions & { lossless?: boolean }): ResolvedConversion {
  const key = JSON.stringify(conversion);
  let found = resolved.get(key);
  if (!found) {
    found = resolveConversionOptions(conversion);
    resolved.set(key, found);
  }
  return found;
}

/** The work on the trees of one task: each tree in turn, then what the batch gives beside the problems. */
interface Worker {
  add(tree: Tree): void;
  /** What the trees added since the last call gave: text, checked trees, a share of a round trip. */
  take(last: boolean): Pick<DoneBatch, 'text' | 'checked' | 'trip' | 'leftOut'>;
  tally: object;
}

/** Work whose product is text, one tree at a time. */
function textWorker(write: (tree: Tree) => string, tally: object): Worker {
  let text = '';
  return {
    add: (tree) => void (text += write(tree)),
    take: () => {
      const done = { text };
      text = '';
      return done;
    },
    tally,
  };
}

function workerFor(work: Work, report: (diagnostic: Diagnostic) => void, sink: () => Diagnostic[]): Worker {
  if (work.kind === 'rewrite') {
    const rewriter = new TreeRewriter({ traces: work.traces, layout: work.layout }, report, emptyRewriteTally());
    return textWorker((tree) => rewriter.rewrite(tree), rewriter.tally);
  }
  if (work.kind === 'validate') return validationWorker(report, sink);
  if (work.kind === 'roundtrip') return tripWorker(work, report);
  const { settings } = conversionOf(work.conversion);
  const options = { heads: settings.heads, labels: settings.labels, posMap: settings.upos, traces: settings.traces, coordination: settings.coordination, punctuation: settings.punctuation, ...work.naming };
  const converter = new TreeConverter(options, report, emptyConversionTally());
  return textWorker((tree) => converter.convertToText(tree), converter.tally);
}

/** Each tree checked on its own, its problems kept with it: the main thread checks identifiers across trees. */
function validationWorker(report: (diagnostic: Diagnostic) => void, sink: () => Diagnostic[]): Worker {
  const validator = new BracketedValidator(report);
  let checked: CheckedTree[] = [];
  return {
    add: (tree) => {
      const problems = sink();
      const words = validator.checkWithin(tree);
      checked.push({ start: tree.position?.start ?? 0, words, problems: problems.splice(0), id: treeIdOf(tree) });
    },
    take: () => {
      const done = { text: '', checked };
      checked = [];
      return done;
    },
    tally: {},
  };
}

/** Bracketing settings of round trips, resolved once per worker and options, as conversion settings are. */
const bracketSettings = new Map<string, BracketSettings>();

/** Trees taken there and back by a runner of this task's own; its counts go with the task's last batch, and the main thread adds up the parts in order. */
function tripWorker(work: TripWork, report: (diagnostic: Diagnostic) => void): Worker {
  const conversion = conversionOf({ ...work.conversion, lossless: work.lossless });
  const key = JSON.stringify([work.categories, work.shape, work.pos]);
  let bracketing = bracketSettings.get(key);
  if (!bracketing) bracketSettings.set(key, (bracketing = resolveBracketOptions({ categories: work.categories, shape: work.shape, pos: work.pos })));
  const runner = new BracketRoundTrip(conversion.settings, bracketing, work.examples, 0, work.countPunctuation, conversion.lossless);
  const leftOut: string[] = [];
  const tally = { read: 0 };
  return {
    // A bracketed tree is named by its file and line; the number is not needed.
    add: (tree) => tripTree(runner, tree, itemName(tree, ++tally.read), leftOut, report),
    take: (last) => (last ? { text: '', trip: runner.part(), leftOut } : { text: '' }),
    tally,
  };
}

/** Sentence workers, one per kind of work and settings (tables loaded once per thread). */
const sentenceWorkers = new Map<string, SentenceWorker>();

/** A stretch of CoNLL-U read and worked on (see sentence-work.ts). */
function runStretch(task: StretchTask): StretchEvent[] {
  const key = JSON.stringify(task.work);
  let worker = sentenceWorkers.get(key);
  if (!worker) sentenceWorkers.set(key, (worker = new SentenceWorker(task.work)));
  return worker.stretch(task);
}

/** Pairs of a tree and its gold sentence scored by a scorer of this task's own; the main thread adds up the parts. */
export function scoreGoldPairs(work: PairWork, pairs: Iterable<GoldPair>): ScorePart {
  const { unscored } = work;
  const scorer = new ConversionScorer(conversionOf(work.conversion).settings, work.countPunctuation, unscored ? unscoredTest(unscored.key, unscored.values) : undefined);
  for (const pair of pairs) scorer.add(pair);
  return scorer.part();
}

/**
 * Pairs that travelled: their trees read again from their text, all in one
 * reading (a reader costs something to set up); their problems were reported
 * where they were first read. Each text was one tree there, so it is one here.
 */
function scorePairs(task: PairTask): ScorePart {
  const ignore = () => undefined;
  let trees = readBracketedText(task.pairs.map((pair) => pair.tree).join('\n'), task.work.read, ignore);
  if (trees.length !== task.pairs.length) trees = task.pairs.map((pair) => readBracketedText(pair.tree, task.work.read, ignore)[0]!);
  return scoreGoldPairs(
    task.work,
    task.pairs.map((pair, k) => ({ id: pair.id, tree: trees[k]!, gold: pair.gold })),
  );
}

/** The entry point the pool calls with each task; the main thread calls it too, for its share. */
export default function run(task: Task | StretchTask | PairTask): TaskResult | StretchEvent[] | ScorePart {
  if ('kind' in task && task.kind === 'stretch') return runStretch(task);
  if ('kind' in task && task.kind === 'pairs') return scorePairs(task);
  return runBatches(task as Task);
}

function runBatches(task: Task): TaskResult {
  let sink: Diagnostic[] = [];
  const report = (diagnostic: Diagnostic) => sink.push(diagnostic);
  const worker = workerFor(task.work, report, () => sink);
  const batches = task.batches.map((batch, k) => {
    const built: Diagnostic[] = (sink = []);
    const trees = buildCutBatch(batch, task.read, report);
    const done: Diagnostic[] = (sink = []);
    for (const tree of trees) worker.add(tree);
    return { built, done, ...worker.take(k === task.batches.length - 1) };
  });
  return { batches, tally: { ...worker.tally } as Record<string, number> };
}
