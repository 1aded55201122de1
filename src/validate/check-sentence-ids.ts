import { ownCopy } from '../model/own-copy.js';
import { diagnose, type Diagnostic, type Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';

/**
 * What the identifier check needs of a tree, as plain data, so that a worker
 * thread can take it from the tree and the main thread check it in order.
 */
export interface TreeIdAt {
  file: string;
  /** The tree's identifier; absent for a tree without one. */
  id?: string;
  /** Where the identifier stands, as a later duplicate's note names it (`file:line:column`). */
  place?: string;
  /** The problem this tree would be: a duplicate of an earlier id (its note is added then), or a missing id. */
  problem?: Diagnostic;
}

/** The identifier data of a tree (nothing to check for a tree without a place in a source). */
export function treeIdOf(tree: Tree): TreeIdAt {
  const file = tree.file ?? '-';
  if (!tree.source || !tree.position) return { file };
  if (tree.id === undefined) {
    const problem = diagnose('missing-id', 'tree has no identifier, unlike other trees of its file', { file, offset: tree.position.start, end: tree.position.end, lines: tree.source });
    return { file, problem };
  }
  const offset = tree.idPosition?.start ?? tree.position.start;
  const end = tree.idPosition?.end ?? tree.position.end;
  const here = tree.source.pointAt(offset);
  const problem = diagnose('duplicate-id', `identifier "${tree.id}" was already used`, { file, offset, end, lines: tree.source });
  return { file, id: tree.id, place: `${file}:${here.line}:${here.column}`, problem };
}

/**
 * Checks sentence identifiers across a whole run: an identifier seen twice
 * (in any of the files), and a tree without one in a file whose other trees
 * have one. Holds one entry per identifier, not the trees.
 */
export class SentenceIdCheck {
  private readonly seen = new Map<string, string>();
  private file: string | undefined;
  private fileHasIds = false;
  /** Trees without an identifier met before the first identifier of their file. */
  private waiting: Diagnostic[] = [];

  constructor(private readonly report: Report) {}

  check(tree: Tree): void {
    this.checkAt(treeIdOf(tree));
  }

  /** The check of one tree, from its identifier data, in input order. */
  checkAt(at: TreeIdAt): void {
    if (at.file !== this.file) this.startFile(at.file);
    if (!at.problem) return;
    if (at.id === undefined) {
      if (this.fileHasIds) this.report(at.problem);
      else if (this.waiting.length < 1000) this.waiting.push(at.problem);
      return;
    }
    if (!this.fileHasIds) {
      this.fileHasIds = true;
      for (const missing of this.waiting) this.report(missing);
      this.waiting = [];
    }
    const first = this.seen.get(at.id);
    if (first === undefined) {
      // A copy: the identifier read is a slice of the input, which a kept slice would keep whole.
      this.seen.set(ownCopy(at.id), at.place!);
      return;
    }
    this.report({ ...at.problem, notes: [`first used at ${first}`] });
  }

  private startFile(file: string): void {
    this.file = file;
    this.fileHasIds = false;
    this.waiting = [];
  }
}
