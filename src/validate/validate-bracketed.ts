import type { Diagnostic, Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';
import { checkCoindexing } from './check-coindexing.js';
import { SentenceIdCheck, type TreeIdAt } from './check-sentence-ids.js';
import { checkTreeShape } from './check-tree-shape.js';

/** Totals of a validation run. */
export interface ValidationSummary {
  /** Input files read (or attempted). */
  files: number;
  /** Trees read without error. */
  trees: number;
  /** Words of those trees (empty elements and words inside CODE/META excluded). */
  words: number;
  /** Problems of severity error. */
  errors: number;
  /** Problems of severity warning. */
  warnings: number;
}

/**
 * Runs every annotation check over trees as they are read, counting trees,
 * words and problems. One instance spans all the files of a run, so duplicate
 * identifiers are found across files.
 */
export class BracketedValidator {
  readonly summary: ValidationSummary = { files: 0, trees: 0, words: 0, errors: 0, warnings: 0 };
  private readonly ids: SentenceIdCheck;
  /** Counts every problem, from the reader or the checks, then passes it on. */
  readonly report: Report;

  constructor(forward: Report) {
    this.report = (diagnostic: Diagnostic) => {
      if (diagnostic.severity === 'error') this.summary.errors++;
      else this.summary.warnings++;
      forward(diagnostic);
    };
    this.ids = new SentenceIdCheck(this.report);
  }

  /** Call once per input, before its trees. */
  startFile(): void {
    this.summary.files++;
  }

  check(tree: Tree): void {
    this.count(this.checkWithin(tree));
    this.ids.check(tree);
  }

  /**
   * The checks of one tree on its own (shape, coindexing), which need nothing
   * of the others, so that worker threads can run them; gives its number of
   * words. {@link count} and {@link checkId} do the rest, in input order.
   */
  checkWithin(tree: Tree): number {
    const words = checkTreeShape(tree, this.report);
    checkCoindexing(tree, this.report);
    return words;
  }

  /** Counts a checked tree and its words. */
  count(words: number): void {
    this.summary.trees++;
    this.summary.words += words;
  }

  /** The identifier checks across trees, from a tree's identifier data (see treeIdOf). */
  checkId(at: TreeIdAt): void {
    this.ids.checkAt(at);
  }
}
