import { ownCopy } from '../model/own-copy.js';
import { diagnose, type Diagnostic, type Report } from '../diagnostics/diagnostic.js';
import type { Tree } from '../model/constituency.js';

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
    const file = tree.file ?? '-';
    if (file !== this.file) this.startFile(file);
    if (!tree.source || !tree.position) return;
    if (tree.id === undefined) {
      const missing = diagnose('missing-id', 'tree has no identifier, unlike other trees of its file', {
        file,
        offset: tree.position.start,
        end: tree.position.end,
        lines: tree.source,
      });
      if (this.fileHasIds) this.report(missing);
      else if (this.waiting.length < 1000) this.waiting.push(missing);
      return;
    }
    if (!this.fileHasIds) {
      this.fileHasIds = true;
      for (const missing of this.waiting) this.report(missing);
      this.waiting = [];
    }
    const offset = tree.idPosition?.start ?? tree.position.start;
    const end = tree.idPosition?.end ?? tree.position.end;
    const here = tree.source.pointAt(offset);
    const first = this.seen.get(tree.id);
    if (first === undefined) {
      // A copy: the identifier read is a slice of the input, which a kept slice would keep whole.
      this.seen.set(ownCopy(tree.id), `${file}:${here.line}:${here.column}`);
      return;
    }
    this.report(
      diagnose('duplicate-id', `identifier "${tree.id}" was already used`, { file, offset, end, lines: tree.source }, [
        `first used at ${first}`,
      ]),
    );
  }

  private startFile(file: string): void {
    this.file = file;
    this.fileHasIds = false;
    this.waiting = [];
  }
}
