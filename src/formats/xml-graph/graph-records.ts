import type { LineIndex } from '../../model/line-index.js';

/**
 * What the XML graph scanner hands to the assembler: the elements of one
 * sentence as read, before any check of the graph they describe. Attributes
 * are Maps, so that no name in a file (`__proto__`, `constructor`) ever
 * becomes an object key.
 */

/** An `edge` or `secedge` element. */
export interface EdgeRecord {
  /** The `label` attribute; absent when not given. */
  label: string | undefined;
  /** The `idref` attribute; absent when not given. */
  idref: string | undefined;
  /** File offset of the element's `<`. */
  start: number;
}

/** A `t` (terminal) or `nt` (nonterminal) element. */
export interface NodeRecord {
  element: 't' | 'nt';
  /** Every attribute, `id` included, by name in written order. */
  attributes: Map<string, string>;
  /** File offsets of the element's `<` and just past its end. */
  start: number;
  end: number;
  /** Its `edge` children (nonterminals only), in written order. */
  edges: EdgeRecord[];
  /** Its `secedge` children. */
  secondaryEdges: EdgeRecord[];
}

/** An `s` element: one sentence. */
export interface SentenceRecord {
  /** Attributes of the `s` element. */
  attributes: Map<string, string>;
  /** The `root` attribute of its `graph`; absent when there is none. */
  root: string | undefined;
  /** The other attributes of its `graph` element (`discontinuous` …). */
  graphAttributes: Map<string, string>;
  /** File offset of the `graph` element (or of the `s` when it has none). */
  graphStart: number;
  /** Terminals in written order, which is sentence order. */
  terminals: NodeRecord[];
  /** Nonterminals in written order. */
  nonterminals: NodeRecord[];
  /** File offsets of the `s` element's `<` and just past its `</s>`. */
  start: number;
  end: number;
  /** Lines and columns of the sentence's text, for diagnostics. */
  lines: LineIndex | undefined;
}
