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
import type { Task, TaskResult, Work } from './tasks.js';
import { SentenceWorker, type StretchEvent, type StretchTask } from './sentence-work.js';

/** Tables are loaded once per worker and options: a run sends the same names with every task. */
const resolved = new Map<string, ResolvedConversion>();

function conversionOf(work: Extract<Work, { kind: 'convert' }>): ResolvedConversion {
  const key = JSON.stringify(work.conversion);
  let found = resolved.get(key);
  if (!found) {
    found = resolveConversionOptions(work.conversion);
    resolved.set(key, found);
  }
  return found;
}

/** One tree to its text, with the counts of what became of the trees. */
interface Worker {
  write(tree: Tree): string;
  tally: object;
}

function workerFor(work: Work, report: (diagnostic: Diagnostic) => void): Worker {
  if (work.kind === 'rewrite') {
    const rewriter = new TreeRewriter({ traces: work.traces, layout: work.layout }, report, emptyRewriteTally());
    return { write: (tree) => rewriter.rewrite(tree), tally: rewriter.tally };
  }
  const { settings } = conversionOf(work);
  const options = { heads: settings.heads, labels: settings.labels, posMap: settings.upos, traces: settings.traces, coordination: settings.coordination, punctuation: settings.punctuation, ...work.naming };
  const converter = new TreeConverter(options, report, emptyConversionTally());
  return { write: (tree) => converter.convertToText(tree), tally: converter.tally };
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

/** The entry point the pool calls with each task; the main thread calls it too, for its share. */
export default function run(task: Task | StretchTask): TaskResult | StretchEvent[] {
  if ('kind' in task && task.kind === 'stretch') return runStretch(task);
  return runBatches(task as Task);
}

function runBatches(task: Task): TaskResult {
  let sink: Diagnostic[] = [];
  const report = (diagnostic: Diagnostic) => sink.push(diagnostic);
  const worker = workerFor(task.work, report);
  const batches = task.batches.map((batch) => {
    const built: Diagnostic[] = (sink = []);
    const trees = buildCutBatch(batch, task.read, report);
    const done: Diagnostic[] = (sink = []);
    let text = '';
    for (const tree of trees) text += worker.write(tree);
    return { built, done, text };
  });
  return { batches, tally: { ...worker.tally } as Record<string, number> };
}
