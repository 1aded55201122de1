import { z } from 'zod';
import { diagnoseItem, itemName, type Report } from '../diagnostics/diagnostic.js';
import { reportWordlessTree } from '../convert/report-wordless-tree.js';
import { emptyTally, type PairingTally } from '../evaluate/pair-with-gold.js';
import { BracketRoundTrip, DependencyRoundTrip, type RoundTripReport, type RoundTripSample } from '../evaluate/roundtrip.js';
import { scoreConversion, type ConversionScore } from '../evaluate/score-conversion.js';
import { collectPhrases, suggestBlocks, suggestLateConjuncts, writeSuggestedTable, type LearnedBlock } from '../evaluate/suggest-heads.js';
import { learnRaising, raisesObservation, type LearnedRaising, type RaisingObservation } from '../evaluate/learn-raising.js';
import { collectLabelSamples, learnLabels, writeLearnedLabels, type LearnedLabels } from '../evaluate/suggest-labels.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { insertTraces } from '../traces/insert-traces.js';
import { bracketOptionsSchema, resolveBracketOptions } from './brackets.js';
import { checkOptions, conversionOptionsSchema, resolveConversionOptions, type ConversionOptions } from './options.js';

/** Items that come one at a time: an array, a generator, or an async one (a reader). */
export type Stream<T> = AsyncIterable<T> | Iterable<T>;

async function* asAsync<T>(items: Stream<T>): AsyncGenerator<T> {
  yield* items;
}

/** How a round trip is scored and what it keeps, besides the conversion and bracketing options. */
export const roundTripSchema = z.strictObject({
  /** Example sentence ids per kind of loss. */
  examples: z.number().int().min(0).default(5),
  /** Sentences with losses kept for drawing (for the HTML report), drawn evenly from the whole input. */
  samples: z.number().int().min(0).default(0),
  /** The seed of that drawing: the same seed draws the same sentences. */
  seed: z.number().int().default(1),
  /** Count punctuation in the scores (true), or leave it out (common practice). */
  countPunctuation: z.boolean().default(true),
});

/** The result of a round trip: the report, and the sentences kept for drawing. */
export interface RoundTrip {
  report: RoundTripReport;
  samples: RoundTripSample[];
  /** Items that could not make the trip (trees without words, sentences that are not trees), by id. */
  leftOut: string[];
}

/**
 * Takes trees to dependencies and back (PARSEVAL scores and a taxonomy of
 * what was lost), or dependency sentences to brackets and back (attachment
 * scores), as `treebridge roundtrip` does. Trees need conversion options
 * (`heads` at least); sentences are read back with `heads` (default `ud`) and
 * traces resolved.
 */
export async function roundTrip(
  items: { trees: Stream<Tree> } | { sentences: Stream<DependencySentence> },
  options: Partial<ConversionOptions> & z.input<typeof bracketOptionsSchema> & z.input<typeof roundTripSchema>,
  report: Report = () => undefined,
): Promise<RoundTrip> {
  const { examples, samples, seed, countPunctuation, categories, shape, pos, ...conversionInput } = options;
  const trip = checkOptions(roundTripSchema, { examples, samples, seed, countPunctuation });
  const leftOut: string[] = [];
  if ('trees' in items) {
    const runner = bracketRoundTrip({ categories, shape, pos, ...conversionInput }, trip.examples, trip.samples, trip.countPunctuation, trip.seed);
    let number = 0;
    for await (const tree of asAsync(items.trees)) tripTree(runner, tree, itemName(tree, ++number), leftOut, report);
    return { report: runner.report(), samples: runner.samples, leftOut };
  }
  const runner = dependencyRoundTrip({ categories, shape, pos, heads: conversionInput.heads, labels: conversionInput.labels }, trip.examples, trip.samples, trip.countPunctuation, trip.seed);
  let number = 0;
  for await (const sentence of asAsync(items.sentences)) tripSentence(runner, sentence, itemName(sentence, ++number), leftOut, report);
  return { report: runner.report(), samples: runner.samples, leftOut };
}

/** The runner of round trips of dependency sentences: brackets built with the bracketing options, read back with `heads` (default `ud`) and traces resolved. */
export function dependencyRoundTrip(
  options: Pick<Partial<ConversionOptions>, 'heads' | 'labels'> & z.input<typeof bracketOptionsSchema>,
  examples: number,
  samples: number,
  countPunctuation: boolean,
  seed: number,
): DependencyRoundTrip {
  const bracketing = resolveBracketOptions({ categories: options.categories, shape: options.shape, pos: options.pos ?? 'upos' });
  const resolved = resolveConversionOptions({ heads: options.heads ?? 'ud', labels: options.labels, traces: 'resolve', coordination: 'table' });
  return new DependencyRoundTrip(bracketing, resolved.settings, examples, samples, countPunctuation, seed);
}

/** Takes one sentence there and back, as {@link roundTrip} does: a sentence that is not a tree is reported and its id added to `leftOut`. */
export function tripSentence(runner: DependencyRoundTrip, sentence: DependencySentence, id: string, leftOut: string[], report: Report): void {
  const problem = runner.add(sentence, id);
  if (!problem) return;
  leftOut.push(id);
  report(diagnoseItem('not-a-tree', `sentence ${id}: ${problem}; left out`, sentence));
}

/** The runner of round trips of trees, with the conversion and bracketing options resolved. */
export function bracketRoundTrip(
  options: Partial<ConversionOptions> & z.input<typeof bracketOptionsSchema>,
  examples: number,
  samples: number,
  countPunctuation: boolean,
  seed: number,
): BracketRoundTrip {
  const { categories, shape, pos, ...conversionInput } = options;
  const bracketing = resolveBracketOptions({ categories, shape, pos: pos ?? 'xpos' });
  const resolved = resolveConversionOptions(checkOptions(conversionOptionsSchema, conversionInput));
  return new BracketRoundTrip(resolved.settings, bracketing, examples, samples, countPunctuation, resolved.lossless, seed);
}

/** Takes one tree there and back, as {@link roundTrip} does: a tree without words is reported and its id added to `leftOut`. */
export function tripTree(runner: BracketRoundTrip, tree: Tree, id: string, leftOut: string[], report: Report): void {
  const wordless = runner.wordless;
  // A graph with discontinuous phrases is compared as its bracketing with *ICH* traces.
  runner.add(tree.discontinuous ? insertTraces(tree).tree : tree, id);
  if (runner.wordless > wordless) {
    leftOut.push(id);
    reportWordlessTree(tree, report);
  }
}

/** What heads are scored with, besides the conversion options. */
export const scoreSchema = z.strictObject({
  /** Count punctuation in UAS and LAS; left out by default (common practice). */
  countPunctuation: z.boolean().default(false),
  /** Gold words not to score, by a MISC key and its values (`{ key: 'Align', values: ['absorbed', 'extra'] }`). */
  unscored: z.strictObject({ key: z.string().min(1), values: z.array(z.string()).min(1) }).optional(),
  /** Sentences with wrong heads to keep for a report, drawn evenly from the whole input. */
  samples: z.number().int().min(0).default(0),
  /** The seed of that drawing: the same seed draws the same sentences. */
  seed: z.number().int().default(1),
});

/** The scores of a conversion against gold dependencies, and how trees and gold were paired. */
export interface HeadScore extends ConversionScore {
  pairing: PairingTally;
}

/**
 * Converts trees and scores them against gold dependency sentences given in
 * the same order: UAS, LAS, UPOS and features, beside the oracle of head
 * percolation, with the errors by phrase and table step, as `treebridge heads
 * score` does. Trees and gold are paired in order (trees without words take
 * none); pairs whose words differ are reported and left out.
 */
export async function scoreHeads(
  trees: Stream<Tree>,
  gold: Stream<DependencySentence>,
  options: ConversionOptions & z.input<typeof scoreSchema>,
  report: Report = () => undefined,
): Promise<HeadScore> {
  const { countPunctuation, unscored, samples, seed, ...conversion } = options;
  const score = checkOptions(scoreSchema, { countPunctuation, unscored, samples, seed });
  const { settings } = resolveConversionOptions(conversion);
  const pairing = emptyTally();
  const skip = score.unscored ? unscoredTest(score.unscored.key, score.unscored.values) : undefined;
  const result = await scoreConversion(asAsync(trees), asAsync(gold), settings, report, score.countPunctuation, pairing, skip, { size: score.samples, seed: score.seed });
  return { ...result, pairing };
}

/** A test for gold words whose MISC has `key` with one of the values. */
export function unscoredTest(key: string, values: readonly string[]): (word: DependencyWord) => boolean {
  const wanted = new Set(values);
  const prefix = key + '=';
  // Most words have no such key: they are told apart without taking MISC to pieces.
  return (word) => word.misc.includes(prefix) && word.misc.split('|').some((part) => part.startsWith(prefix) && wanted.has(part.slice(prefix.length)));
}

/** What a head table is learned with. */
export const suggestSchema = z.strictObject({
  /** The table to build on, and keep where the data does not improve on it. */
  base: z.string().min(1).default('generic'),
  /** The new table's name. */
  name: z.string().regex(/^[A-Za-z0-9._-]+$/).default('suggested'),
  /** Fewest phrases of a category to change its block. */
  minimumPhrases: z.number().int().min(1).default(30),
  /** Least gain, as a share of the phrases, to change a block. */
  minimumGain: z.number().min(0).max(1).default(0.01),
  /** How the base table is written in the new one (`builds-on …`); default its name as given. */
  baseReference: z.string().optional(),
  /** The base table's text, when the new table replaces its base's file and so cannot build on it. */
  inlineBase: z.string().optional(),
});

/** A learned head table: its text, ready to write, and the blocks it changed or kept. */
export interface SuggestedTable {
  text: string;
  sentences: number;
  changed: LearnedBlock[];
  kept: LearnedBlock[];
  pairing: PairingTally;
}

/**
 * Learns from gold dependencies which child heads each phrase, and writes a
 * head table that builds on a base and replaces the blocks the data
 * improves, each with its support, as `treebridge heads suggest` does.
 */
export async function suggestHeads(
  trees: Stream<Tree>,
  gold: Stream<DependencySentence>,
  options: z.input<typeof suggestSchema> & Pick<ConversionOptions, 'traces' | 'coordination'>,
  report: Report = () => undefined,
): Promise<SuggestedTable> {
  const { traces, coordination, ...rest } = options;
  const learning = checkOptions(suggestSchema, rest);
  const { settings } = resolveConversionOptions({ heads: learning.base, traces, coordination, punctuation: 'phrase' });
  const pairing = emptyTally();
  const collected = await collectPhrases(asAsync(trees), asAsync(gold), settings, report, pairing);
  // A subject raising rule first: the clauses it raises hold their gold head in the subject and are left out of head learning.
  const raising = learnRaising(collected.raising, learning.minimumPhrases);
  const samples = raising ? withoutRaised(collected.samples, collected.raising, raising) : collected.samples;
  const { changed, kept } = suggestBlocks(samples, settings.heads, { minimumPhrases: learning.minimumPhrases, minimumGain: learning.minimumGain });
  const late = suggestLateConjuncts(collected.late, learning.minimumPhrases);
  const text = writeSuggestedTable(learning.name, learning.baseReference ?? learning.base, collected.sentences, changed, kept, learning.inlineBase, late, raising) + '\n';
  return { text, sentences: collected.sentences, changed, kept, pairing };
}

/** What a label table is learned with: the head table whose attachments it labels, and what to leave out. */
export const suggestLabelsSchema = z.strictObject({
  /** The new table's name. */
  name: z.string().regex(/^[A-Za-z0-9._-]+$/).default('suggested'),
  /** Fewest attachments a refined rule must decide better than the rule above it. */
  minimumSupport: z.number().int().min(1).default(5),
  /** Gold words not to learn from, by a MISC key and its values. */
  unscored: z.strictObject({ key: z.string().min(1), values: z.array(z.string()).min(1) }).optional(),
});

/** A learned label table: its text, ready to write, the rules, and how trees and gold were paired. */
export interface SuggestedLabels {
  text: string;
  learned: LearnedLabels;
  pairing: PairingTally;
}

/**
 * Learns a label table from gold dependencies, as `treebridge heads suggest
 * --labels` does: the trees are converted with the given head table, and
 * every word whose head is the gold head teaches which relation its
 * attachment takes (by the dependent's label, the phrase it attaches in, its
 * side, the head's category, and its part in coordination).
 */
export async function suggestLabels(
  trees: Stream<Tree>,
  gold: Stream<DependencySentence>,
  options: z.input<typeof suggestLabelsSchema> & Pick<ConversionOptions, 'heads' | 'traces' | 'coordination'>,
  report: Report = () => undefined,
): Promise<SuggestedLabels> {
  const { heads, traces, coordination, ...rest } = options;
  const learning = checkOptions(suggestLabelsSchema, rest);
  const { settings } = resolveConversionOptions({ heads, traces, coordination, punctuation: 'phrase' });
  const pairing = emptyTally();
  const skip = learning.unscored ? unscoredTest(learning.unscored.key, learning.unscored.values) : undefined;
  const { samples, sentences } = await collectLabelSamples(asAsync(trees), asAsync(gold), settings, report, pairing, skip);
  const learned = learnLabels(samples, sentences, learning.minimumSupport);
  return { text: writeLearnedLabels(learning.name, learned), learned, pairing };
}

/** The samples without the clauses a learned raising rule raises. */
function withoutRaised<T extends object>(samples: Map<string, T[]>, observations: readonly RaisingObservation[], rule: LearnedRaising): Map<string, T[]> {
  const raised = new Set<object>();
  for (const o of observations) if (o.sample && raisesObservation(rule, o)) raised.add(o.sample);
  return new Map([...samples].map(([category, list]) => [category, list.filter((sample) => !raised.has(sample))]));
}
