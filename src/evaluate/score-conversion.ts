import type { Report } from '../diagnostics/diagnostic.js';
import { convertTree, type ConversionSettings } from '../convert/convert-tree.js';
import { headVector } from '../analysis/heads.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { AttachmentScorer, isPunctuation, universalPart } from './score-attachments.js';

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

/** Scores of a conversion against gold dependencies, with the oracle's beside them. */
export interface ConversionScore {
  scorer: AttachmentScorer;
  oracle: AttachmentScorer;
  errors: AttachmentError[];
  /** Trees that did not convert, and pairs whose words did not line up. */
  skipped: number;
}

/**
 * Converts trees and scores them word by word against gold sentences in the
 * same order (the shared GUM pair is parallel), together with the oracle that
 * picks, in every phrase, the child holding the gold head.
 */
export async function scoreConversion(
  trees: AsyncIterable<Tree>,
  gold: AsyncIterable<DependencySentence>,
  settings: ConversionSettings,
  report: Report,
): Promise<ConversionScore> {
  const scorer = new AttachmentScorer();
  const oracle = new AttachmentScorer();
  const errors: AttachmentError[] = [];
  let skipped = 0;
  const goldIterator = gold[Symbol.asyncIterator]();
  for await (const tree of trees) {
    const next = await goldIterator.next();
    if (next.done) break;
    const goldSentence = next.value;
    const id = tree.id ?? goldSentence.id ?? String(scorer.score.sentences + 1);
    const conversion = convertTree(tree, settings, id, id);
    const heads = headVector(goldSentence);
    if (!conversion || !heads) {
      skipped++;
      continue;
    }
    if (!scorer.add(conversion.sentence, goldSentence)) {
      skipped++;
      report({ code: 'misaligned', severity: 'warning', message: `sentence ${id} does not line up with gold sentence ${goldSentence.id ?? '?'}`, file: tree.file ?? '-', offset: tree.position?.start ?? 0, line: tree.source?.pointAt(tree.position?.start ?? 0).line ?? 1, column: 1 });
      continue;
    }
    const oracleConversion = convertTree(tree, { ...settings, oracle: heads }, id, id);
    if (oracleConversion) oracle.add(oracleConversion.sentence, goldSentence);
    const goldWords = goldSentence.lines.filter((l): l is DependencyWord => l.type === 'word');
    conversion.sentence.lines.forEach((line, i) => {
      const goldWord = goldWords[i]!;
      if (isPunctuation(goldWord) || line.head === goldWord.head) return;
      const oracleRight = oracleConversion?.sentence.lines[i]?.head === goldWord.head;
      const word = conversion.words[i]!;
      const parent = findParent(conversion.root, word.index);
      errors.push({
        sentence: id,
        parent: parent?.category ?? 'ROOT',
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
  return { scorer, oracle, errors, skipped };
}

import type { ConversionNode, PhraseNode } from '../convert/conversion-tree.js';
import { headWordOf } from '../convert/conversion-tree.js';

/** The phrase in which a word attaches: the lowest phrase of which it is not the head word. */
function findParent(root: ConversionNode, index: number): PhraseNode | undefined {
  let found: PhraseNode | undefined;
  const visit = (node: ConversionNode) => {
    if (node.kind !== 'phrase') return;
    for (const child of node.children) {
      if (headWordOf(child).index === index && headWordOf(node).index !== index) found = node;
      visit(child);
    }
  };
  visit(root);
  return found;
}
