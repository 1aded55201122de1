/**
 * What passes between the main thread and the workers: tasks and their
 * results, plain data only (tables travel by name or path and are loaded once
 * in each worker).
 */
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import type { BracketedReadOptions } from '../../formats/bracketed/read-options.js';
import type { CutBatch } from '../../formats/bracketed/tree-batches.js';
import type { NamingOptions } from '../convert.js';

/** Conversion options whose tables are named (shipped name or path), so that a worker can load them. */
export interface NamedConversionOptions {
  heads: string;
  labels?: string;
  posMap?: string;
  traces?: 'keep' | 'resolve';
  coordination?: 'first' | 'last' | 'conjunction' | 'table';
  punctuation?: 'phrase' | 'root';
}

/** What to do with each tree: convert it to CoNLL-U, or write it again as a bracketing. */
export type Work =
  | { kind: 'convert'; conversion: NamedConversionOptions; naming: NamingOptions }
  | { kind: 'rewrite'; traces: 'keep' | 'resolve'; layout: 'line' | 'indented' };

/** Do the work on the trees of some cut batches of one file. */
export interface Task {
  work: Work;
  read: BracketedReadOptions;
  batches: CutBatch[];
}

/** What became of one batch: the problems found building its trees, those found doing the work, and the text written. */
export interface DoneBatch {
  built: Diagnostic[];
  done: Diagnostic[];
  text: string;
}

/** The batches of a task, and the counts of what became of their trees (summed over tasks in input order). */
export interface TaskResult {
  batches: DoneBatch[];
  tally: Record<string, number>;
}
