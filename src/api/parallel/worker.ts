/**
 * The worker thread of parallel runs: builds the trees of cut batches and
 * does to them what the task asks, with the library's own functions, so that
 * a batch gives here exactly what it gives on the main thread.
 */
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import { buildCutBatch } from '../../formats/bracketed/tree-batches.js';
import { emptyConversionTally, TreeConverter } from '../convert.js';
import { resolveConversionOptions, type ResolvedConversion } from '../options.js';
import type { ConvertResult, ConvertTask, Task } from './tasks.js';

/** Tables are loaded once per worker and options: a run sends the same names with every task. */
const resolved = new Map<string, ResolvedConversion>();

function conversionOf(task: ConvertTask): ResolvedConversion {
  const key = JSON.stringify(task.conversion);
  let found = resolved.get(key);
  if (!found) {
    found = resolveConversionOptions(task.conversion);
    resolved.set(key, found);
  }
  return found;
}

function convert(task: ConvertTask): ConvertResult {
  const { settings } = conversionOf(task);
  const tally = emptyConversionTally();
  let sink: Diagnostic[] = [];
  const report = (diagnostic: Diagnostic) => sink.push(diagnostic);
  const converter = new TreeConverter(
    { heads: settings.heads, labels: settings.labels, posMap: settings.upos, traces: settings.traces, coordination: settings.coordination, punctuation: settings.punctuation, ...task.naming },
    report,
    tally,
  );
  const batches = task.batches.map((batch) => {
    const built: Diagnostic[] = (sink = []);
    const trees = buildCutBatch(batch, task.read, report);
    const converted: Diagnostic[] = (sink = []);
    let text = '';
    for (const tree of trees) text += converter.convertToText(tree);
    return { built, converted, text };
  });
  return { batches, tally };
}

/** The entry point the pool calls with each task. */
export default function run(task: Task): ConvertResult {
  switch (task.kind) {
    case 'convert':
      return convert(task);
  }
}
