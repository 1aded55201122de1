import type { LabelContext } from '../tables/table-model.js';
import type { PosMap, WrittenClass } from '../tables/load-pos-map.js';
import type { WordNode } from './conversion-tree.js';

/** A word's UPOS and FEATS as CoNLL-U writes them. */
export type WordColumns = WrittenClass;

/**
 * The UPOS and features of every word, from the word table: its tag line and
 * feature lines, then the first rule that holds for the word where the
 * conversion put it (its relation, its phrase, the head it hangs from). Without
 * a table, `_` for both.
 */
export function classifyWords(words: WordNode[], relations: string[], contexts: Array<LabelContext | undefined>, map: PosMap | undefined): WordColumns[] {
  if (!map) return words.map(() => ({ upos: '_', feats: '_' }));
  return words.map((word, i) => {
    const context = contexts[i];
    return map.classifyWritten({
      pos: word.pos,
      form: word.form,
      lemma: word.lemma,
      relation: relations[i]!,
      dependent: context?.dependent,
      head: context?.head,
      parent: context?.parent,
    });
  });
}
