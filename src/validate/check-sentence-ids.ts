import { ownCopy } from '../model/own-copy.js';
import { diagnosePlace, placeAt, type Diagnostic, type Place, type Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';

/**
 * What the identifier check needs of a tree, as plain data, so that a worker
 * thread can take it from the tree and the main thread check it in order. The
 * problem it may be is built only if it is one (most trees are not).
 */
export interface TreeIdAt {
  file: string;
  /** The tree's identifier; absent for a tree without one. */
  id?: string;
  /** Where the identifier stands (the whole tree, for a tree without one); absent for a tree without a place in a source. */
  place?: Place;
}

/** The identifier data of a tree (nothing to check for a tree without a place in a source). */
export function treeIdOf(tree: Tree): TreeIdAt {
  const file = tree.file ?? '-';
  if (!tree.source || !tree.position) return { file };
  if (tree.id === undefined) return { file, place: placeAt(tree.source, tree.position.start, tree.position.end) };
  const offset = tree.idPosition?.start ?? tree.position.start;
  const end = tree.idPosition?.end ?? tree.position.end;
  return { file, id: tree.id, place: placeAt(tree.source, offset, end) };
}

/**
 * Checks sentence identifiers across a whole run: an identifier seen twice
 * (in any of the files), and a tree without one in a file whose other trees
 * have one. Holds one entry per identifier, not the trees.
 */
export class SentenceIdCheck {
  /** Where each identifier was first used: its file, line and column (kept as numbers, not as a joined string, for each of tens of thousands of trees). */
  private readonly seen = new Map<string, { file: string; line: number; column: number }>();
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
    const place = at.place;
    if (!place) return;
    if (at.id === undefined) {
      if (!this.fileHasIds && this.waiting.length >= 1000) return;
      const problem = diagnosePlace('missing-id', 'tree has no identifier, unlike other trees of its file', at.file, place);
      if (this.fileHasIds) this.report(problem);
      else this.waiting.push(problem);
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
      this.seen.set(ownCopy(at.id), { file: at.file, line: place.line, column: place.column });
      return;
    }
    const firstAt = `${first.file}:${first.line}:${first.column}`;
    this.report(diagnosePlace('duplicate-id', `identifier "${at.id}" was already used`, at.file, place, [`first used at ${firstAt}`]));
  }

  private startFile(file: string): void {
    this.file = file;
    this.fileHasIds = false;
    this.waiting = [];
  }
}
