/**
 * # The dependency sentence contract
 *
 * A dependency corpus is a sequence of {@link DependencySentence}s in the
 * CoNLL-U format of Universal Dependencies v2: comment lines, then one line per
 * word, multiword token or empty node, then a blank line. Columns are kept as
 * written (strings, `_` for unspecified) so that writing a sentence back gives
 * the same bytes; typed views (head as a number) are computed by the passes
 * that need them.
 */
import type { LineIndex } from './line-index.js';
import type { Position } from './position.js';

/** The ten CoNLL-U columns, as written. */
export interface ConlluColumns {
  /** ID: `1`, `1-2`, `3.1`. */
  id: string;
  /** FORM: the word form or punctuation symbol. */
  form: string;
  /** LEMMA. */
  lemma: string;
  /** UPOS: universal part-of-speech tag. */
  upos: string;
  /** XPOS: language-specific part-of-speech tag. */
  xpos: string;
  /** FEATS: morphological features, `Case=Nom|Number=Sing`. */
  feats: string;
  /** HEAD: ID of the head word or `0`. */
  head: string;
  /** DEPREL: relation to the head, `nsubj`, `obl:tmod`. */
  deprel: string;
  /** DEPS: enhanced dependency graph, `2:nsubj|4:nsubj`. */
  deps: string;
  /** MISC: anything else, `SpaceAfter=No`. */
  misc: string;
}

/** A syntactic word: ID is an integer 1, 2, … */
export interface DependencyWord extends ConlluColumns {
  type: 'word';
  /** Source span of the line; absent on generated words. */
  position?: Position;
}

/** A multiword token: a range `1-2` over the words it contracts, with HEAD and DEPREL `_`. */
export interface MultiwordToken extends ConlluColumns {
  type: 'multiword';
  /** Source span of the line; absent on generated tokens. */
  position?: Position;
}

/** An empty node of the enhanced graph: ID `i.k`, with HEAD and DEPREL `_`. */
export interface EmptyNode extends ConlluColumns {
  type: 'empty-node';
  /** Source span of the line; absent on generated nodes. */
  position?: Position;
}

/** A comment line, `# sent_id = x`, kept verbatim and in order. */
export interface Comment {
  type: 'comment';
  /** The line after `#`, as written (leading space included). */
  text: string;
  /** Source span of the line; absent on generated comments. */
  position?: Position;
}

/** One sentence of a CoNLL-U file. */
export interface DependencySentence {
  type: 'dependency-sentence';
  /** Comment lines before the word lines, in order. */
  comments: Comment[];
  /** Word, multiword-token and empty-node lines, in written order. */
  lines: Array<DependencyWord | MultiwordToken | EmptyNode>;
  /** The `sent_id` comment's value, when present. */
  id?: string;
  /** Source span from the first comment to the blank line. */
  position?: Position;
  /** The file the sentence was read from, as named by the caller. */
  file?: string;
  /** Lines and columns of the sentence's source text, for diagnostics; filled by the reader. */
  source?: LineIndex;
}
