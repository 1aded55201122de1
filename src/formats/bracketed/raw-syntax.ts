/**
 * What the bracketed grammar returns for one top-level bracket: brackets,
 * their optional label token and their child brackets and tokens, with offsets
 * relative to the start of the parsed text. build-tree turns it into the model.
 */

/** A run of non-space, non-bracket characters: a label or a leaf. */
export interface RawToken {
  kind: 'token';
  /** The token as written, escapes included. */
  text: string;
  /** Offset of its first character in the parsed text. */
  start: number;
  /** Offset just past it. */
  end: number;
}

/** A bracket, from `(` to its matching `)`. */
export interface RawBracket {
  kind: 'bracket';
  /** The first token after `(`, if the bracket starts with one. */
  label: RawToken | null;
  /** Brackets and tokens inside, after the label. */
  children: Array<RawBracket | RawToken>;
  /** Offset of `(`. */
  start: number;
  /** Offset just past `)`. */
  end: number;
}
