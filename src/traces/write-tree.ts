import type { Tree } from '../model/constituency.js';
import { writeBracketing, type WriteOptions } from '../formats/bracketed/write-bracketed.js';
import { insertTraces } from './insert-traces.js';

/**
 * Writes any tree as a bracketing: a discontinuous one (from the XML graph
 * encoding, or with its traces resolved) is first made continuous with
 * coindexed `*ICH*` traces (insert-traces), as a bracketing holds only
 * continuous phrases. See writeBracketing for the layouts and what throws.
 */
export function writeTree(tree: Tree, options: WriteOptions = {}): string {
  return writeBracketing(tree.discontinuous ? insertTraces(tree).tree : tree, options);
}
