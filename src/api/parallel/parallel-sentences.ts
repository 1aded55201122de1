import { openConlluReader, type ConlluReader } from '../../formats/conllu/read-conllu.js';
import { SentenceCutter, type Stretch } from '../../formats/conllu/sentence-cutter.js';
import { InOrder, SharedJobs } from './pool.js';
import { SentenceWorker, type SentenceWork, type StretchEvent, type StretchTask } from './sentence-work.js';

/**
 * Does work on the sentences of CoNLL-U input (checking, measuring, rebuilding
 * as bracketings) on worker threads, giving the events that doing it on one
 * thread gives, in the same order. The main thread cuts the text into
 * stretches at sentence boundaries (SentenceCutter); each stretch is read and
 * worked on whole, by a free worker or else by the main thread, and
 * the events come back in input order. At most a few stretches per job are in
 * flight, so memory does not grow with the input. Where no sentence boundary
 * comes for longer than a sentence may be, the rest of that file is read here.
 */
export class ParallelSentences {
  /** Sentence work allocates less than conversion: workers with an 8 MB young generation keep two jobs within 150 MB. */
  private readonly shared: SharedJobs;
  private readonly local: SentenceWorker;
  private readonly queue = new InOrder<StretchEvent[]>();
  private readonly inFlight: number;

  constructor(
    jobs: number,
    private readonly work: SentenceWork,
  ) {
    this.shared = new SharedJobs(jobs, 8);
    this.inFlight = jobs * 4;
    this.local = new SentenceWorker(work);
  }

  /** The events of one file given in pieces, in order; they may lag behind the input until {@link drain}. */
  async *run(pieces: AsyncIterable<string>, file: string): AsyncGenerator<StretchEvent> {
    const cutter = new SentenceCutter();
    let reader: ConlluReader | undefined;
    /** Where the reader's problems go: the events of the stretch it is reading. */
    let current: StretchEvent[] = [];
    const take = (stretch: Stretch, last: boolean) => {
      if (!reader && stretch.clean && (stretch.endsClean || last)) return this.submit({ kind: 'stretch', work: this.work, file, text: stretch.text, start: stretch.start, last });
      // A stretch that ends inside a sentence, and every one after it in the file, is read by one reader, here.
      const events: StretchEvent[] = (current = []);
      reader ??= openConlluReader(file, (diagnostic) => current.push({ kind: 'problem', diagnostic }), stretch.start);
      const heard = (sentences: ReturnType<ConlluReader['push']>) => {
        for (const sentence of sentences) events.push({ kind: 'sentence', result: this.local.sentence(sentence) });
      };
      heard(reader.push(stretch.text));
      if (last) heard(reader.end());
      this.queue.push(events);
    };
    for await (const piece of pieces) {
      for (const stretch of cutter.push(piece)) {
        await this.shared.settle();
        take(stretch, false);
        while (this.queue.length > this.inFlight || this.queue.firstReady) yield* await this.queue.shift();
      }
    }
    take(cutter.end(), true);
    while (this.queue.length > this.inFlight) yield* await this.queue.shift();
  }

  /** The events of every stretch still in flight, in order. */
  async *drain(): AsyncGenerator<StretchEvent> {
    while (this.queue.length > 0) yield* await this.queue.shift();
  }

  async close(): Promise<void> {
    await this.shared.close();
  }

  /** A stretch is worked on by a free worker thread, else here at once (see SharedJobs). */
  private submit(task: StretchTask): void {
    this.queue.push(this.shared.take(() => this.local.stretch(task), (pool) => pool.run(task)));
  }
}
