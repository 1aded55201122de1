import { ParallelSentences } from '../api/parallel/parallel-sentences.js';
import type { SentenceWork, StretchEvent } from '../api/parallel/sentence-work.js';
import type { CliIO, Input } from './io.js';
import { readInputs } from './read-trees.js';

/**
 * The events of working on the CoNLL-U sentences of several inputs (problems
 * of the reading, sentences done), in input order, on `jobs` threads; the
 * same events at any number of jobs. Each input's events are all given before
 * the next input starts, so a command can tell files apart.
 */
export async function* sentenceEvents(inputs: Input[], work: SentenceWork, jobs: number, io: CliIO, onInput?: (input: Input) => void): AsyncGenerator<StretchEvent> {
  const parallel = new ParallelSentences(jobs, work);
  try {
    const read = async function* (pieces: AsyncIterable<string>, name: string): AsyncGenerator<StretchEvent> {
      yield* parallel.run(pieces, name);
      yield* parallel.drain();
    };
    yield* readInputs(inputs, read, io, onInput);
  } finally {
    await parallel.close();
  }
}
