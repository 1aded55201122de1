import type { Report } from '../diagnostics/diagnostic.js';
import { TreeConverter, type ConversionTally, type NamingOptions } from '../api/convert.js';
import type { ResolvedConversion } from '../api/options.js';
import { ParallelBatches } from '../api/parallel/parallel-batches.js';
import { writeSentence } from '../formats/conllu/write-conllu.js';
import { readXmlGraphs } from '../formats/xml-graph/read-xml-graph.js';
import { bracketedReadOptions } from './bracketed-options.js';
import { conversionOptionsOf } from './conversion-options.js';
import type { InputFormat } from './input-format.js';
import type { CliIO, Input } from './io.js';
import { bracketedOnThreads, readInputs, readTreeBatchesOf } from './read-trees.js';

/** The conversion options with tables as the user named them, for worker threads to load. */
export function namedConversion(options: Record<string, unknown>) {
  const { heads, labels, posMap, traces, coordination, punctuation } = conversionOptionsOf(options);
  return { heads: heads as string, labels: labels as string | undefined, posMap: posMap as string | undefined, traces, coordination, punctuation };
}

/**
 * The CoNLL-U text of the inputs' trees, in input order, as to-deps writes it:
 * on `jobs` threads (bracketed input cut into batches for worker threads,
 * XML graphs converted here after all before them), or a batch at a time on
 * this one. Problems and counts are the same at any number of jobs.
 */
export async function* convertedText(
  inputs: Input[],
  options: Record<string, unknown>,
  resolved: ResolvedConversion,
  naming: NamingOptions,
  jobs: number,
  report: Report,
  tally: ConversionTally,
  io: CliIO,
): AsyncGenerator<string> {
  const converter = new TreeConverter(
    { ...conversionOptionsOf(options), heads: resolved.settings.heads, labels: resolved.settings.labels, posMap: resolved.settings.upos, lossless: resolved.lossless, ...naming },
    report,
    tally,
  );
  // Lossless mode carries trees without words across batches: it runs on one thread.
  if (jobs > 1 && !resolved.lossless) {
    const parallel = new ParallelBatches(jobs, bracketedReadOptions(options), { kind: 'convert', conversion: namedConversion(options), naming }, report, tally);
    try {
      // An XML input is converted here, after everything before it.
      const read = bracketedOnThreads(parallel, inputs, options.from as InputFormat | undefined, async function* (pieces, name) {
        for await (const tree of readXmlGraphs(pieces, { file: name }, report)) yield converter.convertToText(tree);
      });
      yield* readInputs(inputs, read, io);
      yield* parallel.drain();
    } finally {
      await parallel.close();
    }
  } else {
    // A batch at a time: the trees one stretch of input completes are converted and given out without waiting between them.
    for await (const trees of readTreeBatchesOf(inputs, bracketedReadOptions(options), report, io)) {
      let text = '';
      for (const tree of trees) text += converter.convertToText(tree);
      yield text;
    }
  }
  for (const sentence of converter.finish()) yield writeSentence(sentence);
}

