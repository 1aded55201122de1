import { convertTree, type ConversionSettings } from '../convert/convert-tree.js';
import type { ConstituentNode, Tree } from '../model/constituency.js';
import { nodesBottomUp, nodesTopDown, preterminalsOf } from '../model/traverse.js';
import type { DependencySentence } from '../model/dependency.js';
import { buildBrackets, type BracketSettings } from '../reverse/build-brackets.js';
import { treeHeads } from '../analysis/heads.js';
import { decodeBrackets, decodeCarriedTrees, isBrokenCarry } from '../lossless/decode-brackets.js';
import { carryBrackets } from '../lossless/carry-brackets.js';
import { carryComment } from '../lossless/carry-wordless-trees.js';
import { writeTree } from '../traces/write-tree.js';
import type { HeadTable } from '../tables/table-model.js';
import { AttachmentScorer, type AttachmentScore } from './score-attachments.js';
import { EvenSample } from './sample-evenly.js';
import { formatLabel } from '../model/label.js';
import { bracketScores, emptyTotals, scoreBrackets, type BracketTotals, type Span } from './parseval.js';

/** What a round trip can lose; bracket kinds take every lost or added bracket exactly once. */
export const lossKinds = ['unary', 'nesting', 'label', 'functionTags', 'emptyElements', 'coindexing', 'punctuation', 'wordsOrPos', 'other'] as const;
export type LossKind = (typeof lossKinds)[number];

/** A sentence kept for the report, in either direction. */
export type RoundTripSample = BracketSample | DependencySample;

/** Brackets direction: the trees there and back, the dependencies between, what differs. */
export interface BracketSample {
  direction: 'brackets';
  id: string;
  kinds: LossKind[];
  original: Tree;
  dependencies: DependencySentence;
  rebuilt: Tree;
  /** Spans (`start:end`) lost from the original, added in the rebuilt tree, and kept with another label. */
  lost: Set<string>;
  added: Set<string>;
  relabelled: Set<string>;
  /** Empty elements and traces of the original, which no dependency tree holds: `NP-SBJ *T*-1`. */
  emptyElements: string[];
}

/** Dependencies direction: the sentence there and back, the bracketing between, what differs. */
export interface DependencySample {
  direction: 'dependencies';
  id: string;
  kinds: LossKind[];
  original: DependencySentence;
  rebuilt: Tree;
  back: DependencySentence;
  /** Word numbers (1-based) whose head or relation came back different. */
  changed: Set<number>;
}

/**
 * A round trip's counts over some of the trees, as plain data: a worker
 * thread takes a batch there and back and the main thread adds the parts up
 * in input order ({@link BracketRoundTrip.merge}), which gives what one
 * runner over all the trees gives.
 */
export interface TripPart {
  totals: BracketTotals;
  losses: Record<LossKind, number>;
  examples: Record<LossKind, string[]>;
  wordless: number;
}

/** The dependencies direction's counts over some sentences, as plain data (see {@link DependencyRoundTrip.merge}). */
export interface DependencyTripPart {
  scorer: { score: AttachmentScore; confusions: Map<string, number> };
  exact: number;
  sentences: number;
  losses: Record<LossKind, number>;
  examples: Record<LossKind, string[]>;
}

/** Adds examples of later items to the first ones, each id once, up to `max` per kind: the first examples of the whole. */
function mergeExamples(ours: Record<LossKind, string[]>, theirs: Record<LossKind, string[]>, max: number): void {
  for (const kind of lossKinds) for (const id of theirs[kind]) if (ours[kind].length < max && !ours[kind].includes(id)) ours[kind].push(id);
}

/** Totals of a round trip over a corpus. */
export interface RoundTripReport {
  direction: 'brackets' | 'dependencies';
  sentences: number;
  exactMatch: number;
  brackets?: ReturnType<typeof bracketScores>;
  attachment?: { uas: number; las: number };
  losses: Record<LossKind, number>;
  examples: Record<LossKind, string[]>;
  /** What the shares are of: gold brackets, or words. */
  base: number;
  /** Brackets direction: gold and round-tripped brackets, and those matched (unlabelled). */
  counts?: { gold: number; test: number; matched: number };
}

interface Word {
  index: number;
  pos: string;
  form: string;
}

/**
 * The brackets of a tree as spans over its words (empty elements and notes left
 * out), with its words; words that `leaveOut` names (punctuation, when scores
 * ignore it) are left out too.
 */
export function spansOf(tree: Tree, leaveOut?: (pos: string) => boolean): { spans: Array<Span & { functions: number }>; words: Word[] } {
  const words: Word[] = [];
  const spans: Array<Span & { functions: number }> = [];
  // Bottom-up: a phrase's span runs from the first to the last word of its children's spans.
  const ranges = new Map<ConstituentNode, [number, number]>();
  for (const node of nodesBottomUp(tree.children)) {
    if (node.type === 'preterminal') {
      if (leaveOut?.(node.pos)) continue;
      const index = words.length;
      words.push({ index, pos: node.pos, form: node.word.form });
      ranges.set(node, [index, index + 1]);
      continue;
    }
    if (node.type !== 'phrase') continue;
    let start = Infinity;
    let end = -Infinity;
    for (const child of node.children) {
      const range = ranges.get(child);
      if (!range) continue;
      start = Math.min(start, range[0]);
      end = Math.max(end, range[1]);
      ranges.delete(child);
    }
    if (start === Infinity) continue;
    spans.push({ label: node.label.category, start, end, functions: node.label.functions.length });
    ranges.set(node, [start, end]);
  }
  return { spans, words };
}

function countNodes(tree: Tree, test: (node: ConstituentNode) => boolean): number {
  let count = 0;
  for (const node of nodesTopDown(tree.children)) if (test(node)) count++;
  return count;
}

/**
 * Brackets → dependencies → brackets, tree by tree: the original and the
 * round-tripped bracketing are scored (PARSEVAL, function tags removed) and
 * every difference is put in one kind.
 */
export class BracketRoundTrip {
  private readonly totals: BracketTotals = emptyTotals();
  private readonly losses = Object.fromEntries(lossKinds.map((k) => [k, 0])) as Record<LossKind, number>;
  private readonly examples = Object.fromEntries(lossKinds.map((k) => [k, [] as string[]])) as Record<LossKind, string[]>;
  /** Sentences with losses kept for drawing, drawn evenly from the whole input. */
  private readonly sampled: EvenSample<BracketSample>;

  get samples(): BracketSample[] {
    return this.sampled.items();
  }
  /** Trees left out because they hold no words (plain mode; lossless mode carries them). */
  wordless = 0;

  constructor(
    private readonly conversion: ConversionSettings,
    private readonly bracketing: BracketSettings,
    private readonly maxExamples = 5,
    /** Sentences with losses to keep for drawing, and the seed of their drawing. */
    samples = 0,
    /** False: punctuation words are left out of the spans before scoring (common practice). */
    private readonly countPunctuation = true,
    /** Lossless mode: the bracketing is carried through the dependencies and must come back exactly. */
    private readonly lossless = false,
    seed = 1,
  ) {
    this.sampled = new EvenSample(samples, seed);
  }

  add(tree: Tree, id: string): Tree | undefined {
    const dependencies = convertTree(tree, this.conversion, id, id);
    if (!dependencies) {
      if (this.lossless) return this.carryWordless(tree, id);
      this.wordless++;
      return undefined;
    }
    if (this.lossless) carryBrackets(tree, dependencies, this.conversion);
    const decoded = this.lossless ? decodeBrackets(dependencies.sentence) : undefined;
    if (isBrokenCarry(decoded)) {
      this.note('other', id);
      return undefined;
    }
    const carried = decoded;
    const rebuilt = carried ? { tree: carried } : buildBrackets(dependencies.sentence, this.bracketing);
    if (!rebuilt) {
      this.note('other', id);
      return undefined;
    }
    if (carried && writeTree(carried) !== writeTree(tree)) this.note('other', id);
    const leaveOut = this.countPunctuation ? undefined : (pos: string) => this.conversion.heads.punctuation({ category: pos, functions: [] });
    const gold = spansOf(tree, leaveOut);
    const test = spansOf(rebuilt.tree, leaveOut);
    scoreBrackets(this.totals, gold.spans, test.spans);
    // In lossless mode the tree itself must come back: function tags, empty elements and coindices are then not lost.
    if (carried) return rebuilt.tree;
    const lossesBefore = { ...this.losses };
    const note = (kind: LossKind, count = 1) => this.note(kind, id, count);
    this.classify(gold.spans, test.spans, gold.words, this.conversion.heads, note);
    // Same span on both sides, different category.
    const labelOf = (spans: Span[]) => new Map(spans.map((s) => [`${s.start}:${s.end}`, s.label]));
    const testLabels = labelOf(test.spans);
    let changed = 0;
    for (const [span, label] of labelOf(gold.spans)) if (testLabels.has(span) && testLabels.get(span) !== label) changed++;
    note('label', changed);
    note('functionTags', gold.spans.filter((s) => s.functions > 0).length);
    note('emptyElements', countNodes(tree, (n) => n.type === 'empty'));
    note('coindexing', countNodes(tree, (n) => (n.type === 'phrase' || n.type === 'empty') && (n.label.coindex !== undefined || n.label.gapIndex !== undefined)));
    // A word comes back when it reads as the leaf did, or as the conversion wrote it: a word table
    // that joins clitic pieces into a multiword token (dropping their `$` marks) changes how a word
    // is written, not which word it is; escapes such as -LRB- are written back as they were read.
    const written = dependencies.sentence.lines.filter((line) => line.type === 'word').map((line) => line.form);
    const before = preterminalsOf(tree);
    const after = preterminalsOf(rebuilt.tree);
    const sameWord = (i: number) => {
      const form = after[i]?.word.form;
      return form === before[i]!.word.form || (written.length === before.length && form === written[i]);
    };
    const differing = before.filter((p, i) => !sameWord(i) || p.pos !== after[i]?.pos).length + Math.abs(before.length - after.length);
    note('wordsOrPos', differing);
    this.keepSample(id, tree, dependencies.sentence, rebuilt.tree, gold.spans, test.spans, lossesBefore);
    return rebuilt.tree;
  }

  /** Lossless mode: a tree without words rides in a comment (see carry-wordless-trees) and must come back whole. */
  private carryWordless(tree: Tree, id: string): Tree | undefined {
    const carrier: DependencySentence = { type: 'dependency-sentence', comments: [carryComment(tree, 'before')], lines: [], file: tree.file };
    const [back] = decodeCarriedTrees(carrier, 'before');
    this.totals.sentences++;
    if (back && writeTree(back) === writeTree(tree)) this.totals.exact++;
    else this.note('other', id);
    return back;
  }

  private keepSample(id: string, original: Tree, dependencies: DependencySentence, rebuilt: Tree, gold: Span[], test: Span[], before: Record<LossKind, number>): void {
    const kinds = lossKinds.filter((kind) => this.losses[kind] > before[kind]);
    if (kinds.length === 0) return;
    this.sampled.offer(() => {
      const key = (s: Span) => `${s.start}:${s.end}`;
      const testLabels = new Map(test.map((s) => [key(s), s.label]));
      const goldLabels = new Map(gold.map((s) => [key(s), s.label]));
      const lost = new Set([...goldLabels.keys()].filter((k) => !testLabels.has(k)));
      const added = new Set([...testLabels.keys()].filter((k) => !goldLabels.has(k)));
      const relabelled = new Set([...goldLabels].filter(([k, label]) => testLabels.has(k) && testLabels.get(k) !== label).map(([k]) => k));
      const emptyElements: string[] = [];
      for (const node of nodesTopDown(original.children)) if (node.type === 'empty') emptyElements.push(`${formatLabel(node.label)} ${node.text}`);
      return { direction: 'brackets' as const, id, kinds, original, dependencies, rebuilt, lost, added, relabelled, emptyElements };
    });
  }

  private note(kind: LossKind, id: string, count = 1): void {
    if (count <= 0) return;
    this.losses[kind] += count;
    if (this.examples[kind].length < this.maxExamples && !this.examples[kind].includes(id)) this.examples[kind].push(id);
  }

  /** Every lost and every added bracket goes to exactly one of unary, punctuation, nesting. */
  private classify(gold: Span[], test: Span[], words: Word[], table: HeadTable, note: (kind: LossKind, count?: number) => void): void {
    const key = (s: Span) => `${s.start}:${s.end}`;
    const unmatched = (from: Span[], against: Span[]) => {
      const pool = new Map<string, number>();
      for (const s of against) pool.set(key(s), (pool.get(key(s)) ?? 0) + 1);
      return from.filter((s) => {
        const left = pool.get(key(s)) ?? 0;
        if (left > 0) {
          pool.set(key(s), left - 1);
          return false;
        }
        return true;
      });
    };
    const punctuation = (i: number) => {
      const word = words[i];
      return word !== undefined && table.punctuation({ category: word.pos, functions: [] });
    };
    // A span differs from another only by punctuation at its edges.
    const trimmed = (s: Span) => {
      let { start, end } = s;
      while (start < end && punctuation(start)) start++;
      while (end > start && punctuation(end - 1)) end--;
      return `${start}:${end}`;
    };
    for (const [side, other] of [
      [gold, test],
      [test, gold],
    ] as const) {
      const sameSide = new Map<string, number>();
      for (const s of side) sameSide.set(key(s), (sameSide.get(key(s)) ?? 0) + 1);
      const otherTrimmed = new Set(other.map(trimmed));
      for (const s of unmatched(side, other)) {
        if ((sameSide.get(key(s)) ?? 0) > 1) note('unary');
        else if (otherTrimmed.has(trimmed(s))) note('punctuation');
        else note('nesting');
      }
    }
  }

  /** The counts so far, as plain data (see TripPart). */
  part(): TripPart {
    return { totals: this.totals, losses: this.losses, examples: this.examples, wordless: this.wordless };
  }

  /** Adds the counts of the trees after those seen so far, as another runner took them there and back. */
  merge(part: TripPart): void {
    for (const key of Object.keys(this.totals) as Array<keyof BracketTotals>) this.totals[key] += part.totals[key];
    for (const kind of lossKinds) this.losses[kind] += part.losses[kind];
    mergeExamples(this.examples, part.examples, this.maxExamples);
    this.wordless += part.wordless;
  }

  report(): RoundTripReport {
    return {
      direction: 'brackets',
      sentences: this.totals.sentences,
      exactMatch: this.totals.exact,
      brackets: bracketScores(this.totals),
      losses: this.losses,
      examples: this.examples,
      base: this.totals.gold,
      counts: { gold: this.totals.gold, test: this.totals.test, matched: this.totals.matched },
    };
  }
}

/** Dependencies → brackets → dependencies, sentence by sentence: attachment scores and differences. */
export class DependencyRoundTrip {
  private readonly scorer: AttachmentScorer;
  private exact = 0;
  private sentences = 0;
  private readonly losses = Object.fromEntries(lossKinds.map((k) => [k, 0])) as Record<LossKind, number>;
  private readonly examples = Object.fromEntries(lossKinds.map((k) => [k, [] as string[]])) as Record<LossKind, string[]>;
  /** Sentences with losses kept for drawing, drawn evenly from the whole input. */
  private readonly sampled: EvenSample<DependencySample>;

  get samples(): DependencySample[] {
    return this.sampled.items();
  }

  constructor(
    private readonly bracketing: BracketSettings,
    private readonly conversion: ConversionSettings,
    private readonly maxExamples = 5,
    /** Sentences with losses to keep for drawing. */
    samples = 0,
    /** False: words attached as punct are left out of UAS and LAS (common practice). */
    countPunctuation = true,
    seed = 1,
  ) {
    this.scorer = new AttachmentScorer(countPunctuation);
    this.sampled = new EvenSample(samples, seed);
  }

  /**
   * Takes one sentence there and back. A sentence whose heads do not form a
   * tree cannot make the trip: it is not counted, and the reason is returned
   * for the caller to report.
   */
  add(sentence: DependencySentence, id: string): string | undefined {
    const checked = treeHeads(sentence);
    if ('problem' in checked) return checked.problem;
    this.sentences++;
    const rebuilt = buildBrackets(sentence, this.bracketing);
    const back = rebuilt && convertTree(rebuilt.tree, { ...this.conversion, traces: 'resolve' }, id, id);
    if (!back) {
      this.note('other', id);
      return;
    }
    const before = this.scorer.score.labelsRight;
    const wordsBefore = this.scorer.score.words;
    if (!this.scorer.add(back.sentence, sentence)) {
      this.note('wordsOrPos', id);
      return;
    }
    const scored = this.scorer.score.words - wordsBefore;
    if (this.scorer.score.labelsRight - before === scored) {
      this.exact++;
      return;
    }
    this.note('other', id, scored - (this.scorer.score.labelsRight - before));
    this.sampled.offer(() => {
      const relations = (s: DependencySentence) => new Map(s.lines.filter((l) => l.type === 'word').map((l) => [l.id, `${l.head}:${l.deprel}`]));
      const there = relations(sentence);
      const changed = new Set([...relations(back.sentence)].filter(([word, arc]) => there.get(word) !== arc).map(([word]) => Number(word)));
      return { direction: 'dependencies' as const, id, kinds: ['other' as LossKind], original: sentence, rebuilt: rebuilt.tree, back: back.sentence, changed };
    });
  }

  private note(kind: LossKind, id: string, count = 1): void {
    this.losses[kind] += count;
    if (this.examples[kind].length < this.maxExamples && !this.examples[kind].includes(id)) this.examples[kind].push(id);
  }

  /** The counts so far, as plain data. */
  part(): DependencyTripPart {
    return { scorer: { score: this.scorer.score, confusions: this.scorer.confusions }, exact: this.exact, sentences: this.sentences, losses: this.losses, examples: this.examples };
  }

  /** Adds the counts of the sentences after those seen so far, as another runner took them there and back. */
  merge(part: DependencyTripPart): void {
    this.scorer.merge(part.scorer);
    this.exact += part.exact;
    this.sentences += part.sentences;
    for (const kind of lossKinds) this.losses[kind] += part.losses[kind];
    mergeExamples(this.examples, part.examples, this.maxExamples);
  }

  report(): RoundTripReport {
    return {
      direction: 'dependencies',
      sentences: this.sentences,
      exactMatch: this.exact,
      attachment: { uas: this.scorer.uas, las: this.scorer.las },
      losses: this.losses,
      examples: this.examples,
      base: this.scorer.score.words,
    };
  }
}
