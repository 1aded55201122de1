/**
 * What the bracketed grammar returns for one top-level bracket. Words are
 * token indices; brackets record the indices of their opening and closing
 * tokens. The token table ({@link TreeTokens}) turns indices into text and
 * offsets; build-tree turns the whole into the model.
 */

/** A bracket, from `(` to its matching `)`. */
export interface RawBracket {
  /** Token index of the label, when the bracket starts with a word. */
  label: number | null;
  /** Child brackets, and words as token indices, after the label. */
  children: Array<RawBracket | number>;
  /** Token index of `(`. */
  open: number;
  /** Token index of `)`. */
  close: number;
}

/** The tokens of one tree: kinds as a string for the grammar, spans for the text. */
export interface TreeTokens {
  /** One character per token: `(`, `)` or `w` (a word). */
  kinds: string;
  /** Offset of each token's first character in the tree's text. */
  starts: Int32Array;
  /** Offset just past each token. */
  ends: Int32Array;
  /** Offset of the first U+FFFD in a word (bytes that were not valid UTF-8), or -1. */
  replacement: number;
}
