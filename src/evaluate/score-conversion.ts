import type { Report } from '../diagnostics/diagnostic.js';
import { convertTree, type ConversionSettings } from '../convert/convert-tree.js';
import { headVector, wordsOf } from '../analysis/heads.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { AttachmentScorer, isPunctuation, universalPart } from './score-attachments.js';
import { emptyTally, pairWithGold, type PairingTally } from './pair-with-gold.js';

/** One word the conversion attached wrongly, for the error tables. */
export interface AttachmentError {
  sentence: string;
  /** Category of the phrase where the word was attached (`ROOT` for the root). */
  parent: string;
  /** The gold relation's universal part. */
  goldRelation: string;
  /** The table line of the step that chose the wrong head, when a step did. */
  stepLine: number | undefined;
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
): Promise<ConversionScore> {
  const scorer = new AttachmentScorer(withPunctuation, unscored);
  const oracle = new AttachmentScorer(withPunctuation, unscored);
  const errors: AttachmentError[] = [];
  const parents = new Map<string, ParentTally>();
  let skipped = 0;
  for await (const { tree, gold: goldSentence, id } of pairWithGold(trees, gold, settings.traces, report, tally, unscored)) {
    const conversion = convertTree(tree, settings, id, id);
    const heads = headVector(goldSentence);
    if (!conversion || !heads) {
      skipped++;
      continue;
    }
    scorer.add(conversion.sentence, goldSentence, true);
    const oracleConversion = convertTree(tree, { ...settings, oracle: heads }, id, id);
    if (oracleConversion) oracle.add(oracleConversion.sentence, goldSentence, true);
    const goldWords = goldSentence.lines.filter((l): l is DependencyWord => l.type === 'word');
    const parentOf = parentsByWord(conversion.root, conversion.words.length);
    const oracleWords = oracleConversion ? wordsOf(oracleConversion.sentence) : [];
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
      if (tally.examples.length < 3 && !tally.examples.includes(id)) tally.examples.push(id);
      const oracleRight = oracleWords[i]?.head === goldWord.head;
      errors.push({
        sentence: id,
        parent: category,
        goldRelation: universalPart(goldWord.deprel),
        stepLine: parent?.head?.line,
        word: word.index,
        form: word.form,
        head: Number(line.head),
        goldHead: Number(goldWord.head),
        oracleRight,
      });
    });
  }
  const byParent = [...parents.values()].sort((a, b) => b.errors - a.errors || b.words - a.words);
  return { scorer, oracle, errors, byParent, skipped };
}

import type { ConversionNode, PhraseNode } from '../convert/conversion-tree.js';
import { headWordOf, phrasesTopDown } from '../convert/conversion-tree.js';

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
