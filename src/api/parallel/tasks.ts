/**
 * What passes between the main thread and the workers: tasks and their
 * results, plain data only (tables travel by name or path and are loaded once
 * in each worker).
 */
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import type { BracketedReadOptions } from '../../formats/bracketed/read-options.js';
import type { CutBatch } from '../../formats/bracketed/tree-batches.js';
import type { ConversionTally, NamingOptions } from '../convert.js';

/** Conversion options whose tables are named (shipped name or path), so that a worker can load them. */
export interface NamedConversionOptions {
  heads: string;
  labels?: string;
  posMap?: string;
  traces?: 'keep' | 'resolve';
  coordination?: 'first' | 'last' | 'conjunction' | 'table';
  punctuation?: 'phrase' | 'root';
}

/** Convert the trees of some cut batches of one file to CoNLL-U. */
export interface ConvertTask {
  kind: 'convert';
  read: BracketedReadOptions;
  conversion: NamedConversionOptions;
  naming: NamingOptions;
  batches: CutBatch[];
}

/** What became of one batch: the problems found building its trees, those found converting them, and the text. */
export interface ConvertedBatch {
  built: Diagnostic[];
  converted: Diagnostic[];
  text: string;
}

export interface ConvertResult {
  batches: ConvertedBatch[];
  tally: ConversionTally;
}

export type Task = ConvertTask;
