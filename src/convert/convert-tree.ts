import type { PosMap } from '../tables/load-pos-map.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import type { HeadTable, LabelContext, LabelTable } from '../tables/table-model.js';
import { assignLabels, labelContexts } from './assign-labels.js';
import { classifyWords } from './classify-words.js';
import { joinWrittenWords } from './join-written-words.js';
import { attachDependents, type PunctuationPolicy } from './attach-dependents.js';
import type { ConversionNode, WordNode } from './conversion-tree.js';
import { findHeads } from './find-heads.js';
import { joinFixedExpressions } from './join-fixed-expressions.js';
import { oracleChooser } from './oracle-heads.js';
import type { CoordinationStyle } from './handle-coordination.js';
import { prepareTree, type TraceMode } from './prepare-tree.js';

/**
 * Characters below U+0300 (Latin letters with their precomposed accents among
 * them) never change under normalization form C (Unicode's quick check says
 * yes for every one): most words need no normalizing.
 */
const BEFORE_COMBINING = /^[\u0000-\u02ff]*$/;

/** CoNLL-U text is in Unicode normalization form C (UD v2 format specification): corpora in other forms are normalised. */
function nfc(text: string): string {
  return BEFORE_COMBINING.test(text) ? text : text.normalize('NFC');
}

/** Everything a conversion needs besides the tree. */
export interface ConversionSettings {
  heads: HeadTable;
  labels?: LabelTable;
  traces: TraceMode;
  coordination: CoordinationStyle;
  punctuation: PunctuationPolicy;
  /** Universal POS by tag, when a POS map is given. */
  upos?: PosMap;
  /** Gold heads of the words, to convert as the head-percolation oracle does (see oracle-heads). */
  oracle?: readonly number[];
}

/** A converted tree: the CoNLL-U sentence, and the prepared tree with its heads, for explanations and lossless mode. */
export interface Conversion {
  sentence: DependencySentence;
  root: ConversionNode;
  words: WordNode[];
  /** What label rules saw of each word's attachment (undefined for the root), for learning label tables. */
  contexts: Array<LabelContext | undefined>;
}

/**
 * Converts a bracketed tree into a dependency sentence, pass by pass:
 * prepare-tree, find-heads (coordination included), attach-dependents
 * (subject raising included), join-fixed-expressions, assign-labels, classify-words (UPOS and
 * features), join-written-words (forms, and the written words that pieces
 * make). `id` becomes `# sent_id`; `origin` names the source tree in each
 * word's MISC. Undefined for a tree without words.
 */
export function convertTree(tree: Tree, settings: ConversionSettings, id: string, origin: string): Conversion | undefined {
  const prepared = prepareTree(tree, settings.traces);
  if (!prepared) return undefined;
  const { root, words } = prepared;
  findHeads(root, settings.heads, settings.coordination, settings.oracle ? oracleChooser(settings.oracle) : undefined);
  const attachments = attachDependents(root, words, settings.heads, settings.coordination, settings.punctuation);
  joinFixedExpressions(root, attachments, settings.heads);
  // What label rules see of each attachment, worked out once for the relations and the word classes.
  const contexts = labelContexts(attachments, settings.heads);
  const relations = assignLabels(attachments, settings.labels, settings.heads, contexts);
  const classes = classifyWords(words, relations, contexts, settings.upos);
  const surface = joinWrittenWords(
    words.map((word) => word.form),
    words.map((word) => word.lemma),
    settings.upos,
  );
  const wordLines: DependencyWord[] = words.map((word, i) => {
    const form = nfc(surface.forms[i]!);
    const lemma = surface.lemmas[i];
    return {
      type: 'word',
      id: String(word.index),
      form,
      lemma: lemma === undefined ? '_' : nfc(lemma),
      upos: classes[i]!.upos,
      xpos: nfc(word.pos),
      feats: classes[i]!.feats,
      head: String(attachments[i]!.governor?.index ?? 0),
      deprel: relations[i]!,
      deps: '_',
      misc: `From=${origin}`,
    };
  });
  // A written word of several pieces stands above them as a multiword token.
  const lines: DependencySentence['lines'] = [];
  const tokens: string[] = [];
  let w = 0;
  for (const group of surface.written) {
    while (w < group.first - 1) tokens.push(wordLines[w]!.form), lines.push(wordLines[w++]!);
    const form = nfc(group.form);
    lines.push({ type: 'multiword', id: `${group.first}-${group.last}`, form, lemma: '_', upos: '_', xpos: '_', feats: '_', head: '_', deprel: '_', deps: '_', misc: '_' });
    tokens.push(form);
    while (w < group.last) lines.push(wordLines[w++]!);
  }
  while (w < wordLines.length) tokens.push(wordLines[w]!.form), lines.push(wordLines[w++]!);
  const sentence: DependencySentence = {
    type: 'dependency-sentence',
    comments: [
      { type: 'comment', text: ` sent_id = ${nfc(id)}` },
      { type: 'comment', text: ` text = ${tokens.join(' ')}` },
    ],
    lines,
    id,
  };
  return { sentence, root, words, contexts };
}
