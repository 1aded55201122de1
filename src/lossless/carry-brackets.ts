import type { Tree } from '../model/constituency.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import type { Conversion, ConversionSettings } from '../convert/convert-tree.js';
import { insertTraces } from '../traces/insert-traces.js';
import { BRACKETS_KEY, encodeBrackets } from './encode-brackets.js';

/** MISC keys that keep a leaf's form and lemma as written, where the output changed them (escapes undone, join markers taken off). */
export const LEAF_KEY = 'Leaf';
export const LEAF_LEMMA_KEY = 'LeafLemma';

const escapeMisc = (text: string) => text.replace(/[%|= \t]/g, (c) => `%${c.charCodeAt(0).toString(16).padStart(2, '0')}`);

/**
 * Lossless mode: what a converted sentence must carry for its bracketing to
 * come back exactly (see encode-brackets and decode-brackets): the `# brackets`
 * comment, the phrases each word heads in MISC (`Brackets`), and the leaf as
 * written where FORM or LEMMA differ from it (`Leaf`, `LeafLemma`). A
 * discontinuous tree is carried as its bracketing with *ICH* traces. Changes
 * the conversion's sentence in place and returns it.
 */
export function carryBrackets(tree: Tree, conversion: Conversion, settings: ConversionSettings): DependencySentence {
  const sentence = conversion.sentence;
  const lines = sentence.lines.filter((line): line is DependencyWord => line.type === 'word');
  lines.forEach((line, i) => {
    const word = conversion.words[i]!;
    if (line.form !== word.form) line.misc += `|${LEAF_KEY}=${escapeMisc(word.form)}`;
    if (word.lemma !== undefined && line.lemma !== word.lemma) line.misc += `|${LEAF_LEMMA_KEY}=${escapeMisc(word.lemma)}`;
  });
  const encoded = encodeBrackets(tree.discontinuous ? insertTraces(tree).tree : tree, settings);
  if (encoded) {
    sentence.comments.push({ type: 'comment', text: ` brackets = ${encoded.sentence}` });
    lines.forEach((line, i) => {
      if (encoded.words[i]) line.misc += `|${BRACKETS_KEY}=${encoded.words[i]}`;
    });
  }
  return sentence;
}
