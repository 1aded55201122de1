/**
 * Bracketed reading in two halves that can run on different threads: cutting
 * the input into trees and tokens (one scan, in input order) and building the
 * trees of each batch (any batch, anywhere). A cut batch is plain data, so it
 * can be sent to a worker; building it there gives the trees, and the
 * diagnostics, that reading the whole input in one place gives.
 */
import type { Report } from '../../diagnostics/diagnostic.js';
import { LineIndex } from '../../model/line-index.js';
import type { Point } from '../../model/position.js';
import type { Tree } from '../../model/constituency.js';
import { buildBatch } from './read-bracketed.js';
import { BuildContext } from './build-tree.js';
import { resolveReadOptions, type BracketedReadOptions } from './read-options.js';
import { TreeSplitter, type TreeBatch } from './split-trees.js';
import type { TreeTokens } from './tree-assembly.js';

/** One tree of a cut batch: its text, where it stands, and the text of its first line before it (for excerpts). */
export interface CutTree {
  text: string;
  offset: number;
  /** The stretch of text the tree's line index covers: its first line's beginning, then the tree. */
  linesText: string;
  linesStart: Point;
  firstToken: number;
  number: number;
}

/** The trees one stretch of input finished, with their tokens, as plain data. */
export interface CutBatch {
  file: string;
  trees: CutTree[];
  tokens: TreeTokens;
}

/** Copies a batch out of the splitter's reused arrays, into data that can travel. */
export function cutBatchOf(batch: TreeBatch, file: string): CutBatch {
  const { tokens } = batch;
  const count = tokens.count;
  return {
    file,
    trees: batch.trees.map((tree) => ({ text: tree.text, offset: tree.offset, linesText: tree.lines.text, linesStart: tree.lines.start, firstToken: tree.firstToken, number: tree.number })),
    tokens: {
      kinds: tokens.kinds,
      count,
      starts: tokens.starts.slice(0, count),
      ends: tokens.ends.slice(0, count),
      tagStarts: tokens.tagStarts.slice(0, count),
      tagEnds: tokens.tagEnds.slice(0, count),
      wordStarts: tokens.wordStarts.slice(0, count),
      wordEnds: tokens.wordEnds.slice(0, count),
    },
  };
}

/**
 * Cuts bracketed text arriving in pieces into batches of trees, as the
 * reader does: problems of the cutting (stray text, unclosed brackets, trees
 * too large) go to `report` at the moment the reader would report them, each
 * finished batch to `onBatch`.
 */
export class TreeCutter {
  private readonly splitter: TreeSplitter;

  constructor(options: BracketedReadOptions, report: Report, onBatch: (batch: CutBatch) => void) {
    const resolved = resolveReadOptions(options);
    const split = { treeBreaks: resolved.treeBreaks, maxTreeLength: resolved.maxTreeLength, maxDepth: resolved.maxDepth };
    this.splitter = new TreeSplitter(resolved.file, (batch) => onBatch(cutBatchOf(batch, resolved.file)), report, split);
  }

  push(piece: string): void {
    this.splitter.push(piece);
  }

  end(): void {
    this.splitter.end();
  }
}

/**
 * Builds the trees of a cut batch. A problem that the whole reading reports
 * once per file (a word without a lemma part) is reported at its first
 * occurrence in the batch; the caller keeps the first of each file.
 */
export function buildCutBatch(batch: CutBatch, options: BracketedReadOptions, report: Report): Tree[] {
  const resolved = resolveReadOptions({ ...options, file: batch.file });
  const trees = batch.trees.map((tree) => ({
    text: tree.text,
    offset: tree.offset,
    lines: new LineIndex(tree.linesText, tree.linesStart),
    firstToken: tree.firstToken,
    number: tree.number,
  }));
  return buildBatch({ trees, tokens: batch.tokens }, new BuildContext(resolved, report), report);
}
