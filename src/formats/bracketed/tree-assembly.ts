/**
 * What passes between the bracketed grammar and the tree assembler: the
 * token table of one tree, and the assembler the grammar's actions call.
 */
import type { ConstituentNode, Tree } from '../../model/constituency.js';

/** The tokens of a run of trees: kinds as a string for the grammar, spans (relative to each token's own tree) for the text. */
export interface TreeTokens {
  /** One character per token: `(`, `o` (`(` with its label), `)`, `w` (a word) or `p` (a whole `(tag word)` bracket). */
  kinds: string;
  /** How many tokens there are; the arrays below may be longer. */
  count: number;
  /** Offset of each token's first character in the tree's text. */
  starts: Int32Array;
  /** Offset just past each token. */
  ends: Int32Array;
  /** For `o` and `p` tokens: where the label (tag) starts and ends; for `p`, where its word starts and ends. */
  tagStarts: Int32Array;
  tagEnds: Int32Array;
  wordStarts: Int32Array;
  wordEnds: Int32Array;
}

/** An `(ID ...)` node on its way to the tree that holds it; it is not a node of the sentence. */
export interface IdentifierNode {
  type: 'identifier';
  /** Where the identifier starts and ends in the tree's text. */
  start: number;
  end: number;
  /** Token index of the bracket. */
  open: number;
}

/** What a bracket assembles into: a node, an identifier, or nothing when it could not be read. */
export type Assembled = ConstituentNode | IdentifierNode | undefined;

/** Called by the grammar's actions, innermost bracket first; token indices throughout. */
export interface TreeAssembler {
  /** A `(tag word)` bracket inside the tree, given as its one token. */
  leaf(token: number): Assembled;
  /** A bracket inside the tree, from its opening token (which carries the label, if any) to its closing one. */
  bracket(open: number, children: Array<Assembled | number>, close: number): Assembled;
  /** The top-level bracket: a wrapper, or the sentence's own top node. */
  top(open: number, children: Array<Assembled | number>, close: number): Tree | undefined;
}
