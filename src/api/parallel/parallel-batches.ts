import type { Diagnostic, Report } from '../../diagnostics/diagnostic.js';
import type { BracketedReadOptions } from '../../formats/bracketed/read-options.js';
import { TreeCutter, type CutBatch } from '../../formats/bracketed/tree-batches.js';
import { InOrder, SharedJobs } from './pool.js';
import run from './worker.js';
import type { DoneBatch, TaskResult, Work } from './tasks.js';

/**
 * Characters of input per task: enough that posting a task costs little
 * beside the work, and few enough that a task's trees and text are done with
 * before the young generation is collected twice: what lives longer is moved
 * to the old generation, which grows until a full collection (64 KiB tasks
 * took the peak memory of two jobs from 160 MB to over 200 MB).
 */
const TASK_SIZE = 8 * 1024;
/** Characters handed to the cutter at a time, as the reader does (see read-bracketed.ts), so that problems come in the same order. */
const SLICE = 4 * 1024;

/** What happened, in input order: a problem of the cutting, a batch built, a batch converted. */
type Event = { kind: 'file'; file: string } | { kind: 'problem'; diagnostic: Diagnostic } | { kind: 'built'; batch: number } | { kind: 'done'; batch: number };

/** A run of events and what the task converting their batches gave (no task for a run without batches). */
interface Group {
  events: Event[];
  result: TaskResult | undefined;
}

/**
 * Does work on the trees of bracketed input (converting them to CoNLL-U,
 * writing them again) on worker threads, giving the text, the problems and
 * the tally that doing it on one thread gives, in the same order. The main
 * thread reads and cuts the input into batches of trees (the reader's first
 * half); workers build the trees of the batches and do the work; results come
 * back in input order. At most a few tasks per worker are in flight, so
 * memory does not grow with the input.
 */
export class ParallelBatches {
  /** The main thread and the worker threads, which start when a second task comes: a small input never pays for starting threads. */
  private readonly shared: SharedJobs;
  private readonly queue = new InOrder<Group>();
  private readonly inFlight: number;
  /** Files whose word without a lemma part has been reported: once per file, as when reading on one thread. */
  private readonly lemmaWarned = new Set<string>();

  constructor(
    jobs: number,
    private readonly read: BracketedReadOptions,
    private readonly work: Work,
    private readonly report: Report,
    /** Counts of what became of the trees, summed over the tasks; the keys are the work's. */
    private readonly tally: object,
    /**
     * Takes each batch done, in input order, after the problems before it and
     * its own: gives the text to hand out (by default the batch's text).
     */
    private readonly take: (batch: DoneBatch) => string = (batch) => batch.text,
    /** Hears each input start, in order with the batches (after every batch of the inputs before). */
    private readonly onFile?: (file: string) => void,
  ) {
    // The main thread is one of the jobs: it converts a task itself, between reading and writing,
    // when no worker is free, so that N jobs start N - 1 worker threads (each a heap and a copy of the tables).
    this.shared = new SharedJobs(jobs, 8);
    this.inFlight = jobs * 8;
  }

  /** Works through one input given in pieces; yields text as it is ready, in order. Results may lag behind the input until {@link drain}. */
  async *run(pieces: AsyncIterable<string>, file: string): AsyncGenerator<string> {
    let events: Event[] = [{ kind: 'file', file }];
    let batches: CutBatch[] = [];
    let size = 0;
    let pushBatches = 0;
    const cutter = new TreeCutter({ ...this.read, file }, (diagnostic) => events.push({ kind: 'problem', diagnostic }), (batch) => {
      events.push({ kind: 'built', batch: batches.length });
      batches.push(batch);
      pushBatches++;
      for (const tree of batch.trees) size += tree.text.length;
    });
    const step = (push: () => void) => {
      pushBatches = 0;
      const first = batches.length;
      push();
      // As on one thread: the trees a push completes are converted after every problem of that push.
      for (let k = 0; k < pushBatches; k++) events.push({ kind: 'done', batch: first + k });
    };
    const submit = () => {
      if (events.length === 0) return;
      const task = { work: this.work, read: { ...this.read, file }, batches };
      const done = events;
      const taken = batches.length === 0 ? undefined : this.shared.take(() => run(task) as TaskResult, (pool) => pool.run(task));
      this.queue.push(taken instanceof Promise ? taken.then((result) => ({ events: done, result })) : { events: done, result: taken });
      events = [];
      batches = [];
      size = 0;
    };
    for await (const piece of pieces) {
      for (let at = 0; at < piece.length; at += SLICE) {
        step(() => cutter.push(piece.length <= SLICE ? piece : piece.slice(at, at + SLICE)));
        if (size >= TASK_SIZE) {
          await this.shared.settle();
          submit();
          while (this.queue.length > this.inFlight || this.queue.firstReady) yield* await this.emitFirst();
        }
      }
    }
    step(() => cutter.end());
    submit();
    while (this.queue.length > this.inFlight) yield* await this.emitFirst();
  }

  /** Waits for every task still running and yields their text, in order. */
  async *drain(): AsyncGenerator<string> {
    while (this.queue.length > 0) yield* await this.emitFirst();
  }

  /** Stops the workers. */
  async close(): Promise<void> {
    await this.shared.close();
  }

  /**
   * Reports the problems of the first group in order and gives its text, a
   * piece per batch: joined, the text of a group would be one string large
   * enough to be made in the old generation, which only a full collection frees.
   */
  private async emitFirst(): Promise<string[]> {
    const { events, result } = await this.queue.shift();
    const text: string[] = [];
    for (const event of events) {
      if (event.kind === 'file') this.onFile?.(event.file);
      else if (event.kind === 'problem') this.emit(event.diagnostic);
      else if (event.kind === 'built') for (const diagnostic of result!.batches[event.batch]!.built) this.emit(diagnostic);
      else {
        const done = result!.batches[event.batch]!;
        for (const diagnostic of done.done) this.emit(diagnostic);
        text.push(this.take(done));
      }
    }
    const tally = this.tally as Record<string, number>;
    if (result) for (const [key, count] of Object.entries(result.tally)) tally[key] = (tally[key] ?? 0) + count;
    return text;
  }

  private emit(diagnostic: Diagnostic): void {
    if (diagnostic.code === 'missing-lemma') {
      if (this.lemmaWarned.has(diagnostic.file)) return;
      this.lemmaWarned.add(diagnostic.file);
    }
    this.report(diagnostic);
  }
}
