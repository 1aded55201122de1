/**
 * # The constituency tree contract
 *
 * A bracketed corpus is a sequence of {@link Tree}s. A tree holds the nodes of
 * one sentence under an optional wrapper (the empty outer bracket of
 * `( (S ...) )`, or a `(ROOT ...)` / `(TOP ...)` bracket) that may also hold the
 * sentence identifier, `(ID some.text,.12)`.
 *
 * Nodes form a tree of four kinds, told apart by `type`:
 * - a {@link Phrase} has a label and one or more child nodes;
 * - a {@link Preterminal} has a part-of-speech tag and exactly one {@link Word};
 * - an {@link EmptyElement} stands for something unpronounced: a trace
 *   `(-NONE- *T*-1)`, or the unwrapped kind `(NP-SBJ *pro*)` and `(C 0)`;
 * - a {@link MetaNode} (`CODE`, `META`) is annotation about the text, not part
 *   of the sentence: it holds no words of the sentence.
 *
 * Every node read from a file carries a `position`. A node without one is
 * *generated*: a conversion pass built it. The reader fills every field below;
 * later passes never change a tree in place, they build new nodes.
 *
 * ## Discontinuous trees
 *
 * In a bracketed file the leaves stand in sentence order, so every phrase
 * covers an unbroken stretch of words. A tree read from the XML graph
 * encoding, or one whose traces were resolved (resolve-traces), may hold
 * *discontinuous* phrases: phrases whose words have gaps. Such a tree has
 * `discontinuous: true`, and every terminal (word, empty element, note) carries
 * `order`, its place in the sentence counting from 1; the children of a phrase
 * stand in the order of their first terminal. In a tree without the flag the
 * leaves, read left to right, are the sentence, and `order` is absent.
 * Discontinuous trees are written as bracketings only after insert-traces has
 * made every phrase continuous again with coindexed `*ICH*` traces.
 *
 * Glossary terms (head, projective, gap …) are defined in DEVELOPERS.md.
 */
import type { Label } from './label.js';
import type { LineIndex } from './line-index.js';
import type { Position } from './position.js';

/** A node inside a tree. */
export type ConstituentNode = Phrase | Preterminal | EmptyElement | MetaNode;

/** A labelled bracket over other nodes: `(NP-SBJ (D the) (N keeper))`. */
export interface Phrase {
  type: 'phrase';
  /** Category, function tags, coindex and gapping index. */
  label: Label;
  /** The nodes inside, in written order; never empty. */
  children: ConstituentNode[];
  /** Source span from the opening to the closing bracket; absent on generated nodes. */
  position?: Position;
  /** The element id in the XML graph encoding, when the phrase was read from one. */
  xmlId?: string;
  /** Further attributes of the XML graph element, by name in written order; never read into object keys. */
  attributes?: ReadonlyMap<string, string>;
}

/** A part-of-speech bracket over one word: `(N-N keeper-keeper)`. */
export interface Preterminal {
  type: 'preterminal';
  /** The tag exactly as written (`NNS`, `N-N`, `-LRB-`): tags are not split into function tags. */
  pos: string;
  /** The word. */
  word: Word;
  /** Function labels of the edge above the word (XML graph encoding); bracketings carry none. */
  functions?: readonly string[];
  /** Source span of the bracket; absent on generated nodes. */
  position?: Position;
  /** The terminal's id in the XML graph encoding, when read from one. */
  xmlId?: string;
  /** Further attributes of the terminal (`morph` …), by name in written order. */
  attributes?: ReadonlyMap<string, string>;
}

/** A word of the sentence. */
export interface Word {
  type: 'word';
  /** The word form, with bracket escapes (`\(`) undone. */
  form: string;
  /** The lemma, when the reader split `form-lemma` leaves; otherwise absent. */
  lemma?: string;
  /** Place in the sentence among all terminals, from 1; only in discontinuous trees. */
  order?: number;
  /** Source span of the leaf; absent on generated nodes. */
  position?: Position;
}

/** An unpronounced element: a trace, an empty subject, an empty complementiser. */
export interface EmptyElement {
  type: 'empty';
  /**
   * The label of the bracket that holds the element: `-NONE-` for the wrapped
   * kind `(-NONE- *T*-1)`, the phrase label for the unwrapped kind `(NP-SBJ *pro*)`.
   */
  label: Label;
  /** The leaf as written: `*T*-1`, `*pro*`, `0`. */
  text: string;
  /** The element's kind without its index: `*T*`, `*ICH*`, `*pro*`, `*`, `0`. */
  kind: string;
  /** The `n` of a trailing `-n`: the coindex of the antecedent this element points to. */
  refIndex?: number;
  /** Place in the sentence among all terminals, from 1; only in discontinuous trees. */
  order?: number;
  /** Source span of the bracket; absent on generated nodes. */
  position?: Position;
  /** The terminal's id in the XML graph encoding, when read from one. */
  xmlId?: string;
}

/** A `CODE` or `META` bracket: notes, headings and markup kept beside the sentence. */
export interface MetaNode {
  type: 'meta';
  /** The label as written (`CODE`, `META`). */
  label: string;
  /** The single leaf of the bracket, when it has one: `{COM:unsure}`, `<heading>`. */
  text?: string;
  /** The nodes inside, when the bracket holds brackets; their words are not words of the sentence. */
  children: ConstituentNode[];
  /** Place in the sentence among all terminals, from 1; only in discontinuous trees, on notes without children. */
  order?: number;
  /** Source span of the bracket; absent on generated nodes. */
  position?: Position;
  /** The terminal's id in the XML graph encoding, when read from one. */
  xmlId?: string;
}

/** One sentence of a bracketed corpus. */
export interface Tree {
  type: 'tree';
  /** The outer bracket, when the tree has one; its label is `''` for `( ... )`. */
  wrapper?: { label: string };
  /** The nodes under the wrapper (or the single top bracket), the identifier node excluded. Usually one. */
  children: ConstituentNode[];
  /** The sentence identifier from an `(ID ...)` node beside the tree, when the corpus gives one. */
  id?: string;
  /** Source span of the identifier leaf. */
  idPosition?: Position;
  /** Where the whole tree stood, from its first to its last bracket. */
  position?: Position;
  /** The file the tree was read from, as named by the caller. */
  file?: string;
  /**
   * The tree's place among the trees of its input, from 1, counting those that
   * could not be read: the fifth top-level bracket of a file is tree 5 even when
   * the third is broken. Filled by the readers; names trees without identifier.
   */
  number?: number;
  /** Lines and columns of the tree's source text, for diagnostics; filled by the reader. */
  source?: LineIndex;
  /** Terminals carry `order` and phrases may have gaps (see "Discontinuous trees" above). */
  discontinuous?: boolean;
  /** Further attributes of the sentence element of the XML graph encoding, by name in written order. */
  attributes?: ReadonlyMap<string, string>;
  /** Attributes of the graph element besides its root (`discontinuous` …), in written order. */
  graphAttributes?: ReadonlyMap<string, string>;
  /** Secondary edges of the XML graph encoding: extra labelled links the tree itself cannot hold. */
  secondaryEdges?: SecondaryEdge[];
}

/** A labelled link between two nodes beside the tree's own edges (XML graph encoding `secedge`). */
export interface SecondaryEdge {
  /** The node the edge leaves. */
  from: ConstituentNode;
  /** The node it points to. */
  to: ConstituentNode;
  /** The edge label as written. */
  label: string;
  /** Where the edge element stood. */
  position?: Position;
}
