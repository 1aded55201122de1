import { createReadStream } from 'node:fs';
import type { Report } from '../../diagnostics/diagnostic.js';
import type { Tree } from '../../model/constituency.js';
import { decodeStream, PIECE_SIZE } from '../bracketed/read-bracketed.js';
import { assembleGraph } from './assemble-graph.js';
import { defaultXmlLimits, XmlGraphScanner, type XmlLimits } from './scan-xml-graph.js';

/** How the XML graph reader reads a file. */
export interface XmlReadOptions {
  /** The file name put in diagnostics and on trees; default `-`. */
  file?: string;
  /** Limits against hostile input; see {@link XmlLimits}. */
  limits?: Partial<XmlLimits>;
}

/** Characters handed to the parser at a time, so that finished sentences leave memory early. */
const SLICE = 16 * 1024;

/**
 * Reads the sentences of the XML graph encoding from text that arrives in
 * pieces, one sentence at a time, as discontinuous trees (see the tree
 * contract). Sentences whose graph is broken are reported and skipped; after a
 * problem that breaks the XML itself the file is not read further, and the
 * report says so.
 */
export async function* readXmlGraphs(pieces: AsyncIterable<string> | Iterable<string>, options: XmlReadOptions, report: Report): AsyncGenerator<Tree> {
  const file = options.file ?? '-';
  const scanner = new XmlGraphScanner(file, report, { ...defaultXmlLimits, ...options.limits });
  const assemble = function* () {
    for (const record of scanner.take()) {
      const tree = assembleGraph(record, file, record.lines!, report);
      if (tree) yield tree;
    }
  };
  for await (const piece of pieces) {
    for (let at = 0; at < piece.length; at += SLICE) {
      const going = scanner.push(piece.length <= SLICE ? piece : piece.slice(at, at + SLICE));
      yield* assemble();
      if (!going) return;
    }
  }
  scanner.end();
  yield* assemble();
}

/** Reads every sentence of a string at once, for tests and small inputs. */
export function readXmlGraphText(text: string, options: XmlReadOptions, report: Report): Tree[] {
  const file = options.file ?? '-';
  const scanner = new XmlGraphScanner(file, report, { ...defaultXmlLimits, ...options.limits });
  const trees: Tree[] = [];
  const take = () => {
    for (const record of scanner.take()) {
      const tree = assembleGraph(record, file, record.lines!, report);
      if (tree) trees.push(tree);
    }
  };
  if (scanner.push(text)) scanner.end();
  take();
  return trees;
}

/** Reads a file of the XML graph encoding as a stream of trees. */
export function readXmlGraphFile(path: string, options: XmlReadOptions, report: Report): AsyncGenerator<Tree> {
  return readXmlGraphs(decodeStream(createReadStream(path, { highWaterMark: PIECE_SIZE })), { ...options, file: options.file ?? path }, report);
}
