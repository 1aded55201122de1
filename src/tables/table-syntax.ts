/** What the table grammar (grammars/tables.peggy) returns. */

/** A word of a statement, where it stands. */
export interface WordSyntax {
  text: string;
  /** 1-based line and column in the table file. */
  line: number;
  column: number;
}

/** One statement: its keyword and the words after it. */
export interface StatementSyntax {
  keyword: string;
  words: WordSyntax[];
  line: number;
  column: number;
}

/** A test on the head word of a child: its pos, form or lemma in a set. */
export interface HeadWordTestSyntax {
  key: string;
  values: string[];
  /** `[form!=…]`: the test holds for words with none of the values. */
  negated?: boolean;
}

/** A label pattern, `VB*[lemma=be,have]`. */
export interface PatternSyntax {
  label: string;
  test: HeadWordTestSyntax | null;
}

/** A condition of a label rule, `dependent=NP,*-SBJ`. */
export interface ConditionSyntax {
  key: string;
  values: string[];
}
