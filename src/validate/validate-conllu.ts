import { diagnose, type Diagnostic, type Report } from '../diagnostics/diagnostic.js';
import { fieldColumn } from '../formats/conllu/conllu-line.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { checkDependencyTree } from './check-dependency-tree.js';
import { checkWordColumns } from './check-word-columns.js';
import type { FeatureInventory } from '../tables/load-feature-inventory.js';
import { LineIndex } from '../model/line-index.js';
import { ownCopy } from '../model/own-copy.js';
import type { Point } from '../model/position.js';

/** The 37 universal relations of UD v2 (../shared/CHECK-VALUES.md §6). */
export const universalRelations: readonly string[] = [
  'nsubj', 'obj', 'iobj', 'csubj', 'ccomp', 'xcomp', 'obl', 'vocative', 'expl', 'dislocated', 'advcl', 'advmod',
  'discourse', 'aux', 'cop', 'mark', 'nmod', 'appos', 'nummod', 'acl', 'amod', 'det', 'clf', 'case', 'conj', 'cc',
  'fixed', 'flat', 'list', 'parataxis', 'compound', 'orphan', 'goeswith', 'reparandum', 'punct', 'root', 'dep',
];

/** Where a sentence's sent_id stands, in plain data (it may come from a worker thread): the point, and its line's text and start. */
export interface SentIdAt {
  id: string;
  file: string;
  start: Point;
  line: string;
  lineStart: Point;
}

/** Where a sentence's sent_id stands, when it has one (its comment, else the sentence's start). */
export function sentIdOf(sentence: DependencySentence): SentIdAt | undefined {
  if (sentence.id === undefined || !sentence.source) return undefined;
  const comment = sentence.comments.find((c) => /^\s*sent_id\s*=/.test(c.text));
  const offset = comment?.position?.start ?? sentence.position?.start ?? 0;
  const start = sentence.source.pointAt(offset);
  const line = sentence.source.lineAt(offset);
  return { id: sentence.id, file: sentence.file ?? '-', start, line: line.text, lineStart: { offset: offset - (start.column - 1), line: start.line, column: 1 } };
}

/** Totals of a CoNLL-U validation run. */
export interface ConlluSummary {
  files: number;
  /** Sentences read (every sentence with at least one word line). */
  sentences: number;
  /** Syntactic words (multiword-token lines and empty nodes left out). */
  words: number;
  errors: number;
  warnings: number;
}

/**
 * Runs the tree-level checks and the checks across sentences (unique
 * sent_id, known relations) over sentences as they are read. A declared
 * relation without a subtype admits all its subtypes (`obl` admits `obl:tmod`).
 */
export class ConlluValidator {
  readonly summary: ConlluSummary = { files: 0, sentences: 0, words: 0, errors: 0, warnings: 0 };
  readonly report: Report;
  private readonly relations: Set<string>;
  private readonly sentIds = new Map<string, string>();

  constructor(
    forward: Report,
    relations: readonly string[] = universalRelations,
    /** The features FEATS may use; undefined: no check. */
    private readonly features?: FeatureInventory,
  ) {
    this.relations = new Set(relations);
    this.report = (diagnostic: Diagnostic) => {
      if (diagnostic.severity === 'error') this.summary.errors++;
      else this.summary.warnings++;
      forward(diagnostic);
    };
  }

  startFile(): void {
    this.summary.files++;
  }

  check(sentence: DependencySentence): void {
    this.count(this.checkWithin(sentence));
    this.checkSentId(sentIdOf(sentence));
  }

  /**
   * The checks of one sentence on its own (tree, columns, relations), which
   * need nothing of the others, so that worker threads can run them; gives its
   * number of words. {@link count} and {@link checkSentId} do the rest in order.
   */
  checkWithin(sentence: DependencySentence): number {
    const words = sentence.lines.filter((line): line is DependencyWord => line.type === 'word');
    checkDependencyTree(sentence, this.report);
    checkWordColumns(sentence, this.report, this.features);
    for (const word of words) {
      // A relation of the wrong shape is an error of its own (relation-shape).
      if (!/^[a-z]+(:[a-z]+)?$/.test(word.deprel) || this.relations.has(word.deprel)) continue;
      const universal = word.deprel.split(':')[0]!;
      if (this.relations.has(universal)) continue;
      this.warnAt(sentence, word, 7, `relation "${word.deprel}" is not in the declared set`);
    }
    return words.length;
  }

  /** Counts a sentence of so many words. */
  count(words: number): void {
    this.summary.sentences++;
    this.summary.words += words;
  }

  /** Reports a sent_id used before (across sentences and files, in input order). */
  checkSentId(at: SentIdAt | undefined): void {
    if (!at) return;
    const first = this.sentIds.get(at.id);
    if (first === undefined) {
      // A copy of the id: the id read is a slice of a stretch of the input, which a kept slice would keep whole.
      this.sentIds.set(ownCopy(at.id), `${at.file}:${at.start.line}:${at.start.column}`);
      return;
    }
    const where = { file: at.file, offset: at.start.offset, lines: new LineIndex(at.line, at.lineStart) };
    this.report(diagnose('duplicate-sent-id', `sent_id "${at.id}" was already used`, where, [`first used at ${first}`]));
  }

  private warnAt(sentence: DependencySentence, word: DependencyWord, field: number, message: string): void {
    if (!sentence.source || !word.position) return;
    const fields = [word.id, word.form, word.lemma, word.upos, word.xpos, word.feats, word.head, word.deprel, word.deps, word.misc];
    const offset = word.position.start + fieldColumn(fields, field) - 1;
    const where = { file: sentence.file ?? '-', offset, end: offset + fields[field]!.length, lines: sentence.source };
    this.report(diagnose('unknown-relation', message, where));
  }
}

