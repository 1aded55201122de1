/**
 * What passes between the main thread and the workers: tasks and their
 * results, plain data only (tables travel by name or path and are loaded once
 * in each worker).
 */
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import type { BracketedReadOptions } from '../../formats/bracketed/read-options.js';
import type { CutBatch } from '../../formats/bracketed/tree-batches.js';
import type { NamingOptions } from '../convert.js';
import type { TreeIdAt } from '../../validate/check-sentence-ids.js';
import type { TripPart } from '../../evaluate/roundtrip.js';
import type { DependencySentence } from '../../model/dependency.js';

/** Conversion options whose tables are named (shipped name or path), so that a worker can load them. */
export interface NamedConversionOptions {
  heads: string;
  labels?: string;
  posMap?: string;
  traces?: 'keep' | 'resolve';
  coordination?: 'first' | 'last' | 'conjunction' | 'table';
  punctuation?: 'phrase' | 'root';
}

/** Round trips of trees: the conversion there, the bracketing back, and what the report keeps. */
export interface TripWork {
  kind: 'roundtrip';
  conversion: NamedConversionOptions;
  lossless: boolean;
  categories: string;
  shape: 'flat' | 'layered';
  pos: 'upos' | 'xpos';
  examples: number;
  countPunctuation: boolean;
}

/** What to do with each tree: convert it to CoNLL-U, write it again as a bracketing, check it, take it there and back. */
export type Work =
  | { kind: 'convert'; conversion: NamedConversionOptions; naming: NamingOptions }
  | { kind: 'rewrite'; traces: 'keep' | 'resolve'; layout: 'line' | 'indented' }
  | { kind: 'validate' }
  | TripWork;

/** Do the work on the trees of some cut batches of one file. */
export interface Task {
  work: Work;
  read: BracketedReadOptions;
  batches: CutBatch[];
}

/** One tree checked on its own: where it starts, its words, its problems, and what the checks across trees need. */
export interface CheckedTree {
  start: number;
  words: number;
  problems: Diagnostic[];
  id: TreeIdAt;
}

/**
 * What became of one batch: the problems found building its trees, those
 * found doing the work, and the text written; validation gives its trees one
 * by one, a round trip its share of the report.
 */
export interface DoneBatch {
  built: Diagnostic[];
  done: Diagnostic[];
  text: string;
  checked?: CheckedTree[];
  trip?: TripPart;
  /** Round trips: the trees left out (without words), by name. */
  leftOut?: string[];
}

/** The batches of a task, and the counts of what became of their trees (summed over tasks in input order). */
export interface TaskResult {
  batches: DoneBatch[];
  tally: Record<string, number>;
}

/** How pairs of a tree and its gold sentence are scored, with tables named so that a worker can load them. */
export interface PairWork {
  conversion: NamedConversionOptions;
  countPunctuation: boolean;
  /** Gold words not to score, by a MISC key and its values. */
  unscored?: { key: string; values: string[] };
  /** How the trees were read, to read them again from their text. */
  read: BracketedReadOptions;
}

/**
 * A pair as it travels to a worker: the tree as its bracketed text (read
 * again there, which costs far less than copying the built tree), the gold
 * sentence without positions and line index.
 */
export interface TravellingPair {
  id: string;
  tree: string;
  gold: DependencySentence;
}

/** Score some pairs, in order. */
export interface PairTask {
  kind: 'pairs';
  work: PairWork;
  pairs: TravellingPair[];
}
