import type { Matcher } from './label-pattern.js';

/** One step of a head block: from which end to look, how, and for what. */
export interface HeadStep {
  end: 'left' | 'right';
  /**
   * `each`: the patterns one at a time, each time over the children from that end;
   * `any`: the first child from that end matching any pattern;
   * `only`: the child at that end, if it matches any pattern;
   * `first`: the first child from that end that is not punctuation.
   */
  mode: 'each' | 'any' | 'only' | 'first';
  patterns: Matcher[];
  /** The step applies only when some child matches one of these (`if` patterns); empty: always. */
  guards: Matcher[];
  /** The step does not apply when some child matches one of these (`unless` patterns). */
  vetoes: Matcher[];
  /**
   * The step applies only to phrases whose own label matches one of these
   * (`for` patterns, labels only: `IP-SUB`, `*-SPE`); empty: to every phrase of the block.
   */
  phrases: Matcher[];
  /** The patterns as written, for explanations. */
  written: string[];
  /** Where the step stands: file and 1-based line. */
  file: string;
  line: number;
}

/** The steps for some parent categories. */
export interface HeadBlock {
  categories: string[];
  steps: HeadStep[];
}

/** A compiled head table. */
export interface HeadTable {
  kind: 'heads';
  name: string;
  /** Blocks by parent category. */
  blocks: Map<string, HeadBlock>;
  /** The default block, for categories without one. */
  fallback: HeadBlock;
  /** Punctuation labels. */
  punctuation: Matcher;
  /** Coordinating conjunctions and their phrases. */
  coordinators: Matcher;
  /** `collins`: a head just after a coordinator that is not the first child gives way to the child before it. */
  coordinationRule: 'collins' | undefined;
  /**
   * Subject raising: in a clause matching `clause` under a phrase matching
   * `under`, with a child matching `subject` and none matching `without` (no
   * finite verb), the subject attaches to the head of the phrase above (role
   * `raised`), as Universal Dependencies draws `make it difficult`.
   */
  raising: { clause: Matcher; under: Matcher; subject: Matcher; without: Matcher } | undefined;
  /**
   * Multiword function words (`fixed because of`): where their words stand
   * side by side in one phrase, the first heads and the others hang from it
   * as `fixed` (the restructuring step join-fixed-expressions).
   */
  fixed: FixedExpressions;
  /**
   * Late conjuncts (`late-conjuncts S VP`): in a phrase of these categories
   * that holds no coordination of its own children, a coordinator after the
   * head child, followed by a child of the phrase's own category, makes that
   * child a conjunct of the head (`[It rained], but [we went out]`), the
   * restructuring step attach-late-conjuncts. Undefined: off.
   */
  lateConjuncts: { phrases: Matcher; file: string; line: number } | undefined;
}

/** The multiword function words of a head table, ready for lookup while converting. */
export interface FixedExpressions {
  /** Lower-cased forms joined by spaces, each with the table line that names it. */
  byText: Map<string, { file: string; line: number }>;
  /** The lower-cased first words, so that most words are passed over with one lookup. */
  firstWords: Set<string>;
  /** The most words an expression has. */
  longest: number;
}

/** A condition of a label rule, compiled. */
export interface LabelCondition {
  key: 'dependent' | 'head' | 'parent' | 'child' | 'previous' | 'next' | 'pos' | 'form' | 'lemma' | 'side' | 'role';
  test: (context: LabelContext) => boolean;
  /** For a `dependent=` condition: whether it could hold for a dependent of a category (whatever else the dependent is). */
  dependentCategory?: (category: string) => boolean;
}

/** What a label rule looks at: an attachment of a dependent to its head. */
export interface LabelContext {
  /** The dependent's maximal projection (a phrase or a preterminal), as a label candidate. */
  dependent: import('./label-pattern.js').Candidate;
  /** The head child of the phrase the dependent attaches in. */
  head: import('./label-pattern.js').Candidate;
  /** That phrase. */
  parent: import('./label-pattern.js').Candidate;
  /** The children of the dependent's phrase (none for a word). */
  children: import('./label-pattern.js').Candidate[];
  /** The siblings just before and after the dependent's phrase in its parent, when it has them. */
  previous?: import('./label-pattern.js').Candidate;
  next?: import('./label-pattern.js').Candidate;
  /** The dependent's head word. */
  word: { pos: string; form: string; lemma: string | undefined };
  /** Where the dependent stands from its head. */
  side: 'left' | 'right';
  /** Its part: a further conjunct or a coordinator in a coordination, punctuation (by the head table), or other. */
  role: 'conjunct' | 'coordinator' | 'punctuation' | 'raised' | 'fixed' | 'other';
}

export interface LabelRule {
  relation: string;
  conditions: LabelCondition[];
  file: string;
  line: number;
}

/** A compiled label table: rules tried in order, the first that matches gives the relation. */
export interface LabelTable {
  kind: 'labels';
  name: string;
  rules: LabelRule[];
  otherwise: string;
}
