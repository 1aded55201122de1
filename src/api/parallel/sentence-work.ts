/**
 * Work on CoNLL-U sentences one at a time, the same on the main thread and on
 * worker threads: a stretch of text (cut at sentence boundaries) is read, and
 * each sentence checked, measured or rebuilt as a bracketing. Results are
 * plain data, in input order, with the problems reported on the way.
 */
import type { Diagnostic, Report } from '../../diagnostics/diagnostic.js';
import { itemName } from '../../diagnostics/diagnostic.js';
import { readConlluStretch, type ConlluStart } from '../../formats/conllu/read-conllu.js';
import type { Layout } from '../../formats/bracketed/write-bracketed.js';
import type { DependencySentence } from '../../model/dependency.js';
import type { TreeStructure } from '../../analysis/structure.js';
import { loadFeatureInventory, type FeatureInventory } from '../../tables/load-feature-inventory.js';
import { ConlluValidator, sentIdOf, type SentIdAt } from '../../validate/validate-conllu.js';
import { emptyBracketTally, rebuildSentence, resolveBracketOptions, type BracketTally } from '../brackets.js';
import { TreeRewriter } from '../rewrite.js';
import { measureSentence } from '../structure.js';
import { DependencyRoundTrip, type DependencyTripPart } from '../../evaluate/roundtrip.js';
import { resolveConversionOptions } from '../options.js';
import { tripSentence } from '../evaluate.js';

/** What to do with each sentence, with settings named so that a worker thread can load them. */
export type SentenceWork =
  | { kind: 'validate'; relations?: string[]; features: string[] }
  | { kind: 'structure' }
  | { kind: 'brackets'; categories: string; shape: 'flat' | 'layered'; pos: 'upos' | 'xpos'; lossless: boolean; layout: Layout }
  | { kind: 'trip'; heads: string; labels?: string; categories: string; shape: 'flat' | 'layered'; examples: number; countPunctuation: boolean };

/** A stretch of one file's CoNLL-U, and the work to do on its sentences. */
export interface StretchTask {
  kind: 'stretch';
  work: SentenceWork;
  file: string;
  text: string;
  start: ConlluStart;
  /** The stretch ends the file (the reader checks how the file ends). */
  last: boolean;
}

/** What one sentence gave: the problems its work reported, and the work's result. */
export interface SentenceResult {
  problems: Diagnostic[];
  /** Its offset in the file, and its name in messages. */
  start: number;
  name: string;
  /** validate: its words and where its sent_id stands. */
  words?: number;
  sentId?: SentIdAt;
  /** structure: its figures; none when it is not a tree. */
  structure?: TreeStructure;
  /** brackets: the bracketings written for it (a sentence may carry trees without words), counts, and its lifted arcs. */
  text?: string;
  written?: number;
  tally?: BracketTally;
  inserted?: number;
  /** Its lifted arcs, for the line a run with --lifts prints, and how many of `problems` come before that line. */
  lifts?: string;
  liftsAt?: number;
  /** trip: its counts there and back, and whether it was left out (not a tree). */
  trip?: DependencyTripPart;
  leftOut?: boolean;
}

/** A problem of the reading, or a sentence done, in the order the work on one thread gives them. */
export type StretchEvent = { kind: 'problem'; diagnostic: Diagnostic } | { kind: 'sentence'; result: SentenceResult };

/** Does the work on sentences one at a time; built once per thread and kind of work, as it loads tables. */
export class SentenceWorker {
  private readonly validator?: ConlluValidator;
  private readonly brackets?: ReturnType<typeof resolveBracketOptions>;
  private readonly rewriter?: TreeRewriter;
  /** A fresh runner per sentence, from settings resolved once. */
  private readonly trip?: () => DependencyRoundTrip;
  private sink: Diagnostic[] = [];
  private readonly report: Report = (diagnostic) => this.sink.push(diagnostic);

  constructor(work: SentenceWork) {
    if (work.kind === 'validate') {
      let features: FeatureInventory | undefined = loadFeatureInventory('ud');
      for (const file of work.features) features = loadFeatureInventory(file, features);
      this.validator = new ConlluValidator(this.report, work.relations, features);
    } else if (work.kind === 'brackets') {
      this.brackets = resolveBracketOptions({ categories: work.categories, shape: work.shape, pos: work.pos, lossless: work.lossless });
      this.rewriter = new TreeRewriter({ traces: 'keep', layout: work.layout }, this.report);
    } else if (work.kind === 'trip') {
      const bracketing = resolveBracketOptions({ categories: work.categories, shape: work.shape, pos: 'upos' });
      const { settings } = resolveConversionOptions({ heads: work.heads, labels: work.labels, traces: 'resolve', coordination: 'table' });
      this.trip = () => new DependencyRoundTrip(bracketing, settings, work.examples, 0, work.countPunctuation);
    }
  }

  /** Reads a stretch and works on its sentences, giving the events in order. */
  stretch(task: Pick<StretchTask, 'text' | 'start' | 'last' | 'file'>): StretchEvent[] {
    const events: StretchEvent[] = [];
    const report: Report = (diagnostic) => events.push({ kind: 'problem', diagnostic });
    readConlluStretch(task.text, task.start, task.last, task.file, report, (sentence) => events.push({ kind: 'sentence', result: this.sentence(sentence) }));
    return events;
  }

  /** The work on one sentence. */
  sentence(sentence: DependencySentence): SentenceResult {
    const problems: Diagnostic[] = (this.sink = []);
    const result: SentenceResult = { problems, start: sentence.position?.start ?? 0, name: itemName(sentence) };
    if (this.validator) {
      result.words = this.validator.checkWithin(sentence);
      const at = sentIdOf(sentence);
      if (at) result.sentId = at;
    } else if (this.brackets) {
      const tally = emptyBracketTally();
      const rewriter = this.rewriter!;
      const inserted = rewriter.tally.inserted;
      let text = '';
      let written = 0;
      for (const rebuilt of rebuildSentence(sentence, this.brackets, this.report, tally)) {
        // As the command writes them: the line of lifted arcs, then the bracketing (whose problems follow it).
        if (rebuilt.sentence && rebuilt.lifts.length > 0) {
          result.lifts = rebuilt.lifts.map((l) => `${l.dependent}: ${l.from}→${l.to}`).join(', ');
          result.liftsAt = problems.length;
        }
        const bracketing = rewriter.toBrackets(rebuilt.tree);
        text += bracketing;
        if (bracketing !== '' && rebuilt.sentence) written++;
      }
      Object.assign(result, { text, written, tally, inserted: rewriter.tally.inserted - inserted });
    } else if (this.trip) {
      const runner = this.trip();
      const leftOut: string[] = [];
      tripSentence(runner, sentence, result.name, leftOut, this.report);
      result.trip = runner.part();
      if (leftOut.length > 0) result.leftOut = true;
    } else {
      const structure = measureSentence(sentence, this.report);
      if (structure) result.structure = structure;
    }
    return result;
  }
}
