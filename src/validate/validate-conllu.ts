import { diagnose, type Diagnostic, type Report } from '../diagnostics/diagnostic.js';
import { fieldColumn } from '../formats/conllu/conllu-line.js';
import type { DependencySentence, DependencyWord } from '../model/dependency.js';
import { checkDependencyTree } from './check-dependency-tree.js';
import { checkWordColumns } from './check-word-columns.js';
import type { FeatureInventory } from '../tables/load-feature-inventory.js';

/** The 37 universal relations of UD v2 (../shared/CHECK-VALUES.md §6). */
export const universalRelations: readonly string[] = [
  'nsubj', 'obj', 'iobj', 'csubj', 'ccomp', 'xcomp', 'obl', 'vocative', 'expl', 'dislocated', 'advcl', 'advmod',
  'discourse', 'aux', 'cop', 'mark', 'nmod', 'appos', 'nummod', 'acl', 'amod', 'det', 'clf', 'case', 'conj', 'cc',
  'fixed', 'flat', 'list', 'parataxis', 'compound', 'orphan', 'goeswith', 'reparandum', 'punct', 'root', 'dep',
];

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
    this.summary.sentences++;
    const words = sentence.lines.filter((line): line is DependencyWord => line.type === 'word');
    this.summary.words += words.length;
    checkDependencyTree(sentence, this.report);
    checkWordColumns(sentence, this.report, this.features);
    for (const word of words) {
      // A relation of the wrong shape is an error of its own (relation-shape).
      if (!/^[a-z]+(:[a-z]+)?$/.test(word.deprel) || this.relations.has(word.deprel)) continue;
      const universal = word.deprel.split(':')[0]!;
      if (this.relations.has(universal)) continue;
      this.warnAt(sentence, word, 7, `relation "${word.deprel}" is not in the declared set`);
    }
    this.checkSentId(sentence);
  }

  private checkSentId(sentence: DependencySentence): void {
    if (sentence.id === undefined || !sentence.source) return;
    const comment = sentence.comments.find((c) => /^\s*sent_id\s*=/.test(c.text));
    const offset = comment?.position?.start ?? sentence.position?.start ?? 0;
    const here = sentence.source.pointAt(offset);
    const first = this.sentIds.get(sentence.id);
    if (first === undefined) {
      this.sentIds.set(sentence.id, `${sentence.file ?? '-'}:${here.line}:${here.column}`);
      return;
    }
    const where = { file: sentence.file ?? '-', offset, lines: sentence.source };
    this.report(diagnose('duplicate-sent-id', `sent_id "${sentence.id}" was already used`, where, [`first used at ${first}`]));
  }

  private warnAt(sentence: DependencySentence, word: DependencyWord, field: number, message: string): void {
    if (!sentence.source || !word.position) return;
    const fields = [word.id, word.form, word.lemma, word.upos, word.xpos, word.feats, word.head, word.deprel, word.deps, word.misc];
    const offset = word.position.start + fieldColumn(fields, field) - 1;
    const where = { file: sentence.file ?? '-', offset, end: offset + fields[field]!.length, lines: sentence.source };
    this.report(diagnose('unknown-relation', message, where));
  }
}
