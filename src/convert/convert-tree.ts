import type { PosMap } from '../tables/load-pos-map.js';
import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import type { HeadTable, LabelTable } from '../tables/table-model.js';
import { assignLabels } from './assign-labels.js';
import { attachDependents, type PunctuationPolicy } from './attach-dependents.js';
import type { ConversionNode, WordNode } from './conversion-tree.js';
import { findHeads } from './find-heads.js';
import { oracleChooser } from './oracle-heads.js';
import { BRACKETS_KEY, encodeBrackets } from './encode-brackets.js';
import type { CoordinationStyle } from './handle-coordination.js';
import { prepareTree, type TraceMode } from './prepare-tree.js';
import { insertTraces } from '../reverse/insert-traces.js';

/** CoNLL-U text is in Unicode normalization form C (UD v2 format specification): corpora in other forms are normalised. */
function nfc(text: string): string {
  return text.normalize('NFC');
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
  /** Carry the bracketing in MISC and a comment, so that it comes back exactly (see encode-brackets). */
  lossless?: boolean;
}

/** A converted tree: the CoNLL-U sentence, and the prepared tree with its heads, for explanations. */
export interface Conversion {
  sentence: DependencySentence;
  root: ConversionNode;
  words: WordNode[];
}

/**
 * Converts a bracketed tree into a dependency sentence, pass by pass:
 * prepare-tree, find-heads (coordination included), attach-dependents
 * (subject raising included), assign-labels. `id` becomes `# sent_id`; `origin` names the source tree in
 * each word's MISC. Undefined for a tree without words.
 */
export function convertTree(tree: Tree, settings: ConversionSettings, id: string, origin: string): Conversion | undefined {
  const prepared = prepareTree(tree, settings.traces);
  if (!prepared) return undefined;
  const { root, words } = prepared;
  findHeads(root, settings.heads, settings.coordination, settings.oracle ? oracleChooser(settings.oracle) : undefined);
  const attachments = attachDependents(root, words, settings.heads, settings.coordination, settings.punctuation);
  const relations = assignLabels(attachments, settings.labels, settings.heads);
  const lines: DependencyWord[] = words.map((word, i) => ({
    type: 'word',
    id: String(word.index),
    form: nfc(word.form),
    lemma: word.lemma === undefined ? '_' : nfc(word.lemma),
    upos: settings.upos?.get(word.pos) ?? '_',
    xpos: nfc(word.pos),
    feats: '_',
    head: String(attachments[i]!.governor?.index ?? 0),
    deprel: relations[i]!,
    deps: '_',
    misc: `From=${origin}`,
  }));
  const sentence: DependencySentence = {
    type: 'dependency-sentence',
    comments: [
      { type: 'comment', text: ` sent_id = ${nfc(id)}` },
      { type: 'comment', text: ` text = ${lines.map((line) => line.form).join(' ')}` },
    ],
    lines,
    id,
  };
  if (settings.lossless) {
    // A discontinuous tree is carried as its bracketing with *ICH* traces.
    const encoded = encodeBrackets(tree.discontinuous ? insertTraces(tree).tree : tree, settings);
    if (encoded) {
      sentence.comments.push({ type: 'comment', text: ` brackets = ${encoded.sentence}` });
      lines.forEach((line, i) => {
        if (encoded.words[i]) line.misc += `|${BRACKETS_KEY}=${encoded.words[i]}`;
      });
    }
  }
  return { sentence, root, words };
}
