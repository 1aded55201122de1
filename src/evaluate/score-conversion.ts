import type { Report } from '../diagnostics/diagnostic.js';
import { convertTree, type ConversionSettings } from '../convert/convert-tree.js';
import { headVector, wordsOf } from '../analysis/heads.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { AttachmentScorer, isPunctuation, universalPart } from './score-attachments.js';
import { emptyTally, pairWithGold, type GoldPair, type PairingTally } from './pair-with-gold.js';
import { EvenSample } from './sample-evenly.js';

/** One word the conversion attached wrongly, for the error tables. */
export interface AttachmentError {
  sentence: string;
  /** Category of the phrase where the word was attached (`ROOT` for the root). */
  parent: string;
  /** The gold relation's universal part. */
  goldRelation: string;
  /** The table line of the step that chose the wrong head, when a step did. */
  stepLine: number | undefined;
  /** The step as the table writes it (`VP (line 12): left each TO VBD …`), when a step chose. */
  step: string | undefined;
  /** The word, its head as converted and its gold head (positions). */
  word: number;
  form: string;
  head: number;
  goldHead: number;
  /** Whether the oracle attached this word right: if so, a better head table could too. */
  oracleRight: boolean;
}

/** Scored words and wrong heads by the category of the phrase where words attach. */
export interface ParentTally {
  category: string;
  words: number;
  errors: number;
  /** Sentence ids of the first few errors. */
  examples: string[];
}

/** Scores of a conversion against gold dependencies, with the oracle's beside them. */
export interface ConversionScore {
  scorer: AttachmentScorer;
  oracle: AttachmentScorer;
  errors: AttachmentError[];
  /** Per parent category, most errors first. */
  byParent: ParentTally[];
  /** Trees that did not convert, and pairs whose words did not line up. */
  skipped: number;
  /** Sentences with wrong heads drawn evenly from the whole input, for the report. */
  samples: HeadSample[];
}

/** A phrase whose head child differs from the one that holds the gold head. */
export interface WrongChoice {
  label: string;
  /** Its words, 0-based from `start`, up to `end` exclusive. */
  start: number;
  end: number;
  /** The child the table chose and the child the oracle chose, each as label and head word. */
  chosen: string;
  better: string;
  /** Why the table chose as it did. */
  reason: string;
}

/** A sentence with wrong heads, kept for drawing: the tree, both dependency trees, what went wrong. */
export interface HeadSample {
  id: string;
  tree: Tree;
  converted: DependencySentence;
  gold: DependencySentence;
  /** Words (from 1) attached wrongly. */
  wrong: Set<number>;
  errors: AttachmentError[];
  choices: WrongChoice[];
}

/** How many sentences with wrong heads to keep for the report, drawn with which seed. */
export interface Sampling {
  size: number;
  seed: number;
}

/**
 * Converts trees and scores them word by word against gold sentences in the
 * same order (the shared GUM pair is parallel), together with the oracle that
 * picks, in every phrase, the child holding the gold head. Trees and gold are
 * paired as pair-with-gold does; `tally` counts what was paired and what not.
 */
export async function scoreConversion(
  trees: AsyncIterable<Tree>,
  gold: AsyncIterable<DependencySentence>,
  settings: ConversionSettings,
  report: Report,
  withPunctuation = false,
  tally: PairingTally = emptyTally(),
  unscored?: (word: DependencyWord) => boolean,
  sampling: Sampling = { size: 0, seed: 1 },
): Promise<ConversionScore> {
  const scorer = new ConversionScorer(settings, withPunctuation, unscored, sampling);
  for await (const pair of pairWithGold(trees, gold, settings.traces, report, tally, unscored)) scorer.add(pair);
  return scorer.result();
}

/**
 * A conversion's scores over some pairs, as plain data: a worker thread
 * scores a batch of pairs and the main thread adds the parts up in input
 * order ({@link ConversionScorer.merge}), which gives what one scorer over all
 * the pairs gives.
 */
export interface ScorePart {
  scorer: ScorerCounts;
  oracle: ScorerCounts;
  errors: AttachmentError[];
  parents: ParentTally[];
  skipped: number;
}

type ScorerCounts = Parameters<AttachmentScorer['merge']>[0];

/** Sentence ids of the first errors kept per parent category. */
const PARENT_EXAMPLES = 3;

/** Scores pairs of a tree and its gold sentence one at a time (see {@link scoreConversion}). */
export class ConversionScorer {
  private readonly sample: EvenSample<HeadSample>;
  private readonly scorer: AttachmentScorer;
  private readonly oracle: AttachmentScorer;
  private readonly errors: AttachmentError[] = [];
  private readonly parents = new Map<string, ParentTally>();
  private skipped = 0;

  constructor(
    private readonly settings: ConversionSettings,
    private readonly withPunctuation = false,
    private readonly unscored?: (word: DependencyWord) => boolean,
    sampling: Sampling = { size: 0, seed: 1 },
  ) {
    this.sample = new EvenSample<HeadSample>(sampling.size, sampling.seed);
    this.scorer = new AttachmentScorer(withPunctuation, unscored);
    this.oracle = new AttachmentScorer(withPunctuation, unscored);
  }

  add({ tree, gold: goldSentence, id }: GoldPair): void {
    const { settings, withPunctuation, unscored, parents, errors } = this;
    const conversion = convertTree(tree, settings, id, id);
    const heads = headVector(goldSentence);
    if (!conversion || !heads) {
      this.skipped++;
      return;
    }
    this.scorer.add(conversion.sentence, goldSentence, true);
    const oracleConversion = convertTree(tree, { ...settings, oracle: heads }, id, id);
    if (oracleConversion) this.oracle.add(oracleConversion.sentence, goldSentence, true);
    const goldWords = goldSentence.lines.filter((l): l is DependencyWord => l.type === 'word');
    const parentOf = parentsByWord(conversion.root, conversion.words.length);
    const oracleWords = oracleConversion ? wordsOf(oracleConversion.sentence) : [];
    const sentenceErrors: AttachmentError[] = [];
    wordsOf(conversion.sentence).forEach((line, i) => {
      const goldWord = goldWords[i]!;
      if (!withPunctuation && isPunctuation(goldWord)) return;
      if (unscored?.(goldWord)) return;
      const word = conversion.words[i]!;
      const parent = parentOf[word.index];
      const category = parent?.category || 'ROOT';
      let tally = parents.get(category);
      if (!tally) parents.set(category, (tally = { category, words: 0, errors: 0, examples: [] }));
      tally.words++;
      if (line.head === goldWord.head) return;
      tally.errors++;
      if (tally.examples.length < PARENT_EXAMPLES && !tally.examples.includes(id)) tally.examples.push(id);
      const oracleRight = oracleWords[i]?.head === goldWord.head;
      const error: AttachmentError = {
        sentence: id,
        parent: category,
        goldRelation: universalPart(goldWord.deprel),
        stepLine: parent?.head?.line,
        step: parent?.head?.line === undefined ? undefined : parent.head.reason.replace(/ \[matched [^\]]*\]$/, ''),
        word: word.index,
        form: word.form,
        head: Number(line.head),
        goldHead: Number(goldWord.head),
        oracleRight,
      };
      errors.push(error);
      sentenceErrors.push(error);
    });
    if (sentenceErrors.length === 0) return;
    this.sample.offer(() => ({
      id,
      tree,
      converted: conversion.sentence,
      gold: goldSentence,
      wrong: new Set(sentenceErrors.map((error) => error.word)),
      errors: sentenceErrors,
      choices: oracleConversion ? wrongChoices(conversion.root, oracleConversion.root) : [],
    }));
  }

  /** The scores so far, as plain data (see ScorePart). */
  part(): ScorePart {
    const counts = (scorer: AttachmentScorer) => ({ score: scorer.score, confusions: scorer.confusions });
    return { scorer: counts(this.scorer), oracle: counts(this.oracle), errors: this.errors, parents: [...this.parents.values()], skipped: this.skipped };
  }

  /** Adds the scores of the pairs after those seen so far, as another scorer scored them. */
  merge(part: ScorePart): void {
    this.scorer.merge(part.scorer);
    this.oracle.merge(part.oracle);
    for (const error of part.errors) this.errors.push(error);
    for (const theirs of part.parents) {
      const ours = this.parents.get(theirs.category);
      if (!ours) {
        this.parents.set(theirs.category, { ...theirs, examples: [...theirs.examples] });
        continue;
      }
      ours.words += theirs.words;
      ours.errors += theirs.errors;
      for (const id of theirs.examples) if (ours.examples.length < PARENT_EXAMPLES && !ours.examples.includes(id)) ours.examples.push(id);
    }
    this.skipped += part.skipped;
  }

  result(): ConversionScore {
    const byParent = [...this.parents.values()].sort((a, b) => b.errors - a.errors || b.words - a.words);
    return { scorer: this.scorer, oracle: this.oracle, errors: this.errors, byParent, skipped: this.skipped, samples: this.sample.items() };
  }
}

/** The phrases whose head child differs between two conversions of one tree (the table's and the oracle's). */
function wrongChoices(root: ConversionNode, oracleRoot: ConversionNode): WrongChoice[] {
  const ours = [...phrasesTopDown(root)];
  const theirs = [...phrasesTopDown(oracleRoot)];
  const choices: WrongChoice[] = [];
  ours.forEach((phrase, k) => {
    const other = theirs[k];
    if (!other || !phrase.head || !other.head || phrase.head.child === other.head.child) return;
    const indices = wordIndicesUnder(phrase);
    const describe = (node: ConversionNode) => `${node.kind === 'phrase' ? node.label : node.pos} "${headWordOf(node).form}"`;
    choices.push({
      label: phrase.label,
      start: Math.min(...indices) - 1,
      end: Math.max(...indices),
      chosen: describe(phrase.children[phrase.head.child]!),
      better: describe(phrase.children[other.head.child]!),
      reason: phrase.head.reason,
    });
  });
  return choices;
}

import type { ConversionNode, PhraseNode } from '../convert/conversion-tree.js';
import { headWordOf, phrasesTopDown, wordIndicesUnder } from '../convert/conversion-tree.js';

/** For every word, the phrase in which it attaches: the lowest phrase of which it is not the head word. */
function parentsByWord(root: ConversionNode, count: number): Array<PhraseNode | undefined> {
  const parents: Array<PhraseNode | undefined> = new Array(count + 1);
  for (const node of phrasesTopDown(root)) {
    const own = headWordOf(node).index;
    for (const child of node.children) {
      const word = headWordOf(child).index;
      if (word !== own) parents[word] = node;
    }
  }
  return parents;
}
