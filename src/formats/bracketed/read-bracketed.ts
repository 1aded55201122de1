import { createReadStream, type ReadStream } from 'node:fs';
import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import { parse, SyntaxError as GrammarError } from '../../generated/bracketed-parser.js';
import type { Tree } from '../../model/constituency.js';
import { BuildContext, TreeBuilder } from './build-tree.js';
import { resolveReadOptions, type BracketedReadOptions, type ResolvedReadOptions } from './read-options.js';
import { TreeSplitter, type TreeBatch } from './split-trees.js';

/** Bytes read from a file at a time: large reads spare round trips to the file system. */
export const PIECE_SIZE = 64 * 1024;

/**
 * Characters handed to the splitter at a time, the trees they complete being
 * handed on before the next slice. Small slices keep few finished trees alive
 * at once, so the collector finds them dead; whole 1 MiB pieces read IcePaHC at
 * half the speed (npm run bench).
 */
const SLICE = 4 * 1024;

/**
 * Reads bracketed trees from text that arrives in pieces, one tree at a time:
 * memory holds the tree being read, never the whole input. Trees that cannot be
 * read are reported through `report` and skipped; reading goes on with the next.
 */
export async function* readBracketed(
  pieces: AsyncIterable<string> | Iterable<string>,
  options: BracketedReadOptions,
  report: Report,
): AsyncGenerator<Tree> {
  for await (const batch of readBracketedBatches(pieces, options, report)) yield* batch;
}

/**
 * As {@link readBracketed}, but hands out the trees of each piece together, in
 * order: a consumer that loops over a batch without awaiting each tree reads faster.
 */
export async function* readBracketedBatches(
  pieces: AsyncIterable<string> | Iterable<string>,
  options: BracketedReadOptions,
  report: Report,
): AsyncGenerator<Tree[]> {
  const reader = new PieceReader(resolveReadOptions(options), report);
  for await (const piece of pieces) {
    for (let at = 0; at < piece.length; at += SLICE) {
      reader.push(piece.length <= SLICE ? piece : piece.slice(at, at + SLICE));
      const trees = reader.take();
      if (trees.length > 0) yield trees;
    }
  }
  reader.end();
  const trees = reader.take();
  if (trees.length > 0) yield trees;
}

/** Reads every tree of a string at once, for tests and small inputs. */
export function readBracketedText(text: string, options: BracketedReadOptions, report: Report): Tree[] {
  const reader = new PieceReader(resolveReadOptions(options), report);
  reader.push(text);
  reader.end();
  return reader.take();
}

/** Reads a file as a stream of trees; `onBytes` hears how many bytes have been read so far. */
export function readBracketedFile(
  path: string,
  options: BracketedReadOptions,
  report: Report,
  onBytes?: (bytes: number) => void,
): AsyncGenerator<Tree> {
  return readBracketed(decodeStream(createReadStream(path, { highWaterMark: PIECE_SIZE }), onBytes), { ...options, file: options.file ?? path }, report);
}

/** Reads a file as a stream of batches of trees (see {@link readBracketedBatches}). */
export function readBracketedFileBatches(
  path: string,
  options: BracketedReadOptions,
  report: Report,
  onBytes?: (bytes: number) => void,
): AsyncGenerator<Tree[]> {
  const pieces = decodeStream(createReadStream(path, { highWaterMark: PIECE_SIZE }), onBytes);
  return readBracketedBatches(pieces, { ...options, file: options.file ?? path }, report);
}

/**
 * Reads several files in turn as batches of trees, each batch with its file.
 * The next file is opened and its first piece read while the current one is
 * being parsed, so the reader never waits for the disk between files.
 */
export async function* readBracketedFilesBatches(
  paths: string[],
  options: BracketedReadOptions,
  report: Report,
): AsyncGenerator<{ file: string; trees: Tree[] }> {
  let next = paths.length > 0 ? openAhead(paths[0]!) : undefined;
  for (let k = 0; k < paths.length; k++) {
    const current = next!;
    next = k + 1 < paths.length ? openAhead(paths[k + 1]!) : undefined;
    const file = paths[k]!;
    for await (const trees of readBracketedBatches(decodeStream(current), { ...options, file }, report)) yield { file, trees };
  }
}

/** Opens a file and starts reading its first piece at once. */
export function openAhead(path: string): ReadStream {
  const stream = createReadStream(path, { highWaterMark: PIECE_SIZE });
  stream.read(0);
  return stream;
}

/** Decodes a byte stream as UTF-8, piece by piece (characters split between pieces are joined). */
export async function* decodeStream(
  bytes: AsyncIterable<Buffer | string>,
  onBytes?: (bytes: number) => void,
): AsyncGenerator<string> {
  const decoder = new TextDecoder('utf-8', { ignoreBOM: true });
  let total = 0;
  for await (const piece of bytes) {
    if (typeof piece === 'string') {
      yield piece;
      continue;
    }
    total += piece.length;
    onBytes?.(total);
    yield decoder.decode(piece, { stream: true });
  }
  const rest = decoder.decode();
  if (rest) yield rest;
}

class PieceReader {
  private readonly splitter: TreeSplitter;
  private ready: Tree[] = [];
  private readonly context: BuildContext;

  constructor(
    options: ResolvedReadOptions,
    private readonly report: Report,
  ) {
    this.context = new BuildContext(options, report);
    const splitOptions = { treeBreaks: options.treeBreaks, maxTreeLength: options.maxTreeLength, maxDepth: options.maxDepth };
    this.splitter = new TreeSplitter(options.file, (batch) => this.read(batch), report, splitOptions);
  }

  push(piece: string): void {
    this.splitter.push(piece);
  }

  end(): void {
    this.splitter.end();
  }

  take(): Tree[] {
    const trees = this.ready;
    this.ready = [];
    return trees;
  }

  private read(batch: TreeBatch): void {
    for (const tree of buildBatch(batch, this.context, this.report)) this.ready.push(tree);
  }
}

/** Builds the trees of one batch cut by the splitter; a tree that cannot be built is reported and left out. */
export function buildBatch(batch: TreeBatch, context: BuildContext, report: Report): Tree[] {
  const file = context.options.file;
  const assembler = new TreeBuilder(batch, file, context);
  let trees;
  try {
    trees = parse(batch.tokens.kinds, { assembler });
  } catch (error) {
    // The splitter hands out balanced brackets only, so the grammar accepts every batch; this guards against a change there.
    if (!(error instanceof GrammarError)) throw error;
    for (const chunk of batch.trees) {
      const where = { file, offset: chunk.offset, lines: chunk.lines };
      report(diagnose('bad-bracketing', 'brackets do not form a tree; the tree is skipped', where));
    }
    return [];
  }
  return trees.filter((tree): tree is Tree => tree !== undefined);
}
