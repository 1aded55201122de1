import type { Report } from '../diagnostics/diagnostic.js';
import { decodeStream, readBracketedBatches } from '../formats/bracketed/read-bracketed.js';
import type { BracketedReadOptions } from '../formats/bracketed/read-options.js';
import { readConllu } from '../formats/conllu/read-conllu.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence } from '../model/dependency.js';
import { readXmlGraphs } from '../formats/xml-graph/read-xml-graph.js';
import { formatOf, type InputFormat, type TreeFormat } from './input-format.js';
import type { ParallelBatches } from '../api/parallel/parallel-batches.js';
import type { CliIO, Input } from './io.js';
import { startProgress } from './progress.js';

/**
 * Reads several inputs in turn with a reader for their format, handing out
 * what it reads one item at a time, and drawing a progress bar when the run
 * is long. The next input opens while the current one is read, so no time is
 * lost waiting for the disk between files. `onInput` hears each input as it starts.
 */
export async function* readInputs<T>(
  inputs: Input[],
  read: (pieces: AsyncIterable<string>, name: string) => AsyncIterable<T>,
  io: CliIO,
  onInput?: (input: Input) => void,
): AsyncGenerator<T> {
  const total = inputs.reduce((sum, input) => sum + (input.size ?? 0), 0);
  const progress = startProgress(io, total, 'reading');
  try {
    let next = inputs[0]?.open();
    for (let k = 0; k < inputs.length; k++) {
      const input = inputs[k]!;
      const bytes = next!;
      next = inputs[k + 1]?.open();
      onInput?.(input);
      yield* read(decodeStream(bytes, (read) => progress.advance(read)), input.name);
      progress.nextInput();
    }
  } finally {
    progress.stop();
  }
}

/** How trees are read: the bracketed reader's options, and the format when not by extension. */
export type TreeReadOptions = BracketedReadOptions & { from?: TreeFormat };

/** The constituency trees of several inputs, each read as bracketed trees or the XML graph encoding (see formatOf). */
export async function* readTreesOf(
  inputs: Input[],
  options: TreeReadOptions,
  report: Report,
  io: CliIO,
  onInput?: (input: Input) => void,
): AsyncGenerator<Tree> {
  for await (const batch of readTreeBatchesOf(inputs, options, report, io, onInput)) yield* batch;
}

/**
 * As {@link readTreesOf}, in batches: the trees one stretch of input
 * completes, together, so that a consumer spends no promise per tree.
 */
export function readTreeBatchesOf(
  inputs: Input[],
  options: TreeReadOptions,
  report: Report,
  io: CliIO,
  onInput?: (input: Input) => void,
): AsyncGenerator<Tree[]> {
  const formats = new Map(inputs.map((input) => [input.name, formatOf(input, options.from)]));
  const read = async function* (pieces: AsyncIterable<string>, name: string): AsyncGenerator<Tree[]> {
    if (formats.get(name) === 'xml') {
      for await (const tree of readXmlGraphs(pieces, { file: name }, report)) yield [tree];
      return;
    }
    yield* readBracketedBatches(pieces, { ...options, file: name }, report);
  };
  return readInputs(inputs, read, io, onInput);
}

/** The CoNLL-U sentences of several inputs. */
export function readSentencesOf(
  inputs: Input[],
  report: Report,
  io: CliIO,
  onInput?: (input: Input) => void,
): AsyncGenerator<DependencySentence> {
  return readInputs(inputs, (pieces, name) => readConllu(pieces, { file: name }, report), io, onInput);
}

/**
 * A reader for {@link readInputs} that hands bracketed inputs to worker
 * threads and reads an XML graph input here, once everything before it is
 * done: `xml` gives what the command makes of the input's graphs.
 */
export function bracketedOnThreads<T>(
  parallel: ParallelBatches,
  inputs: Input[],
  from: InputFormat | undefined,
  xml: (pieces: AsyncIterable<string>, name: string) => AsyncIterable<T>,
): (pieces: AsyncIterable<string>, name: string) => AsyncGenerator<string | T> {
  return async function* (pieces, name) {
    if (formatOf(inputs.find((input) => input.name === name)!, from) !== 'xml') {
      yield* parallel.run(pieces, name);
      return;
    }
    yield* parallel.drain();
    yield* xml(pieces, name);
  };
}
