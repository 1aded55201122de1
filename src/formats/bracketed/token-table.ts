import type { TreeTokens } from './tree-assembly.js';

export const OPEN = 40; // (
export const CLOSE = 41; // )
const WORD = 119; // 'w'
const LEAF = 112; // 'p': a whole `(tag word)` bracket
export const LABELLED = 111; // 'o': an opening bracket with its label

/**
 * The tokens of the trees being read (see grammars/bracketed.peggy), filled by
 * the splitter as it scans: one scan of the text finds both where trees end
 * and what they hold. Finished trees gather until the reader takes them, all
 * at once, so the grammar runs once per stretch of input rather than per tree. An opening bracket and the word right after it, its
 * label, become one token; a bracket of exactly two words below the top,
 * `(tag word)`, the commonest bracket of all, becomes one leaf token. The
 * grammar then takes each in one step. For both, `tagStarts`/`tagEnds` hold
 * the label. Arrays are reused from tree to tree.
 */
export class TokenTable {
  private kinds: Buffer = Buffer.alloc(4096);
  private starts = new Int32Array(4096);
  private ends = new Int32Array(4096);
  private tagStarts = new Int32Array(4096);
  private tagEnds = new Int32Array(4096);
  private wordStarts = new Int32Array(4096);
  private wordEnds = new Int32Array(4096);
  private count = 0;
  /** Index of the first token of the tree being scanned: the tokens before it belong to finished trees. */
  private treeFirst = 0;
  private replacement = -1;

  /** Index of the first token of the tree being scanned. */
  get currentTreeStart(): number {
    return this.treeFirst;
  }

  /** Offset of the first U+FFFD in the tree being scanned, or -1. */
  get currentTreeReplacement(): number {
    return this.replacement;
  }

  /** Starts a new tree after the finished ones, dropping the tokens of a tree left unfinished. */
  beginTree(): void {
    this.count = this.treeFirst;
    this.replacement = -1;
  }

  /** Drops the tokens of the tree being scanned. */
  dropTree(): void {
    this.count = this.treeFirst;
  }

  /** Keeps the tokens of the tree just closed with the finished ones. */
  commitTree(): void {
    this.treeFirst = this.count;
  }

  /**
   * Forgets the finished trees, keeping the tokens of the tree being scanned
   * (moved to the front: their offsets are relative to their own tree).
   */
  clearFinished(): void {
    const first = this.treeFirst;
    if (first === 0) return;
    const arrays = [this.kinds, this.starts, this.ends, this.tagStarts, this.tagEnds, this.wordStarts, this.wordEnds];
    for (const array of arrays) array.copyWithin(0, first, this.count);
    this.count -= first;
    this.treeFirst = 0;
  }

  open(start: number): void {
    this.push(OPEN, start, start + 1);
  }

  word(start: number, end: number): void {
    const last = this.count - 1;
    if (last >= 0 && this.kinds[last] === OPEN) {
      this.kinds[last] = LABELLED;
      this.tagStarts[last] = start;
      this.tagEnds[last] = end;
      return;
    }
    this.push(WORD, start, end);
  }

  /** A closing bracket at `start`, closing a bracket at nesting `depth` (1 for the top). */
  close(start: number, depth: number): void {
    const count = this.count;
    const kinds = this.kinds;
    if (depth > 1 && count >= 2 && kinds[count - 1] === WORD && kinds[count - 2] === LABELLED) {
      const leaf = count - 2;
      kinds[leaf] = LEAF;
      this.wordStarts[leaf] = this.starts[leaf + 1]!;
      this.wordEnds[leaf] = this.ends[leaf + 1]!;
      this.ends[leaf] = start + 1;
      this.count = leaf + 1;
      return;
    }
    this.push(CLOSE, start, start + 1);
  }

  /** Remembers the first U+FFFD of the tree being scanned: bytes that were not valid UTF-8. */
  noteReplacement(at: number): void {
    if (this.replacement === -1) this.replacement = at;
  }

  /** The tokens of the finished trees; the arrays are this table's own, valid until {@link clearFinished}. */
  finished(): TreeTokens {
    return {
      kinds: this.kindString(this.treeFirst),
      count: this.treeFirst,
      starts: this.starts,
      ends: this.ends,
      tagStarts: this.tagStarts,
      tagEnds: this.tagEnds,
      wordStarts: this.wordStarts,
      wordEnds: this.wordEnds,
    };
  }

  private push(kind: number, start: number, end: number): void {
    if (this.count === this.kinds.length) this.grow();
    this.kinds[this.count] = kind;
    this.starts[this.count] = start;
    this.ends[this.count] = end;
    this.count++;
  }

  private grow(): void {
    const size = this.kinds.length * 2;
    const widen = <T extends Uint8Array | Int32Array>(from: T, to: T): T => {
      to.set(from);
      return to;
    };
    this.kinds = widen(this.kinds, Buffer.alloc(size));
    this.starts = widen(this.starts, new Int32Array(size));
    this.ends = widen(this.ends, new Int32Array(size));
    this.tagStarts = widen(this.tagStarts, new Int32Array(size));
    this.tagEnds = widen(this.tagEnds, new Int32Array(size));
    this.wordStarts = widen(this.wordStarts, new Int32Array(size));
    this.wordEnds = widen(this.wordEnds, new Int32Array(size));
  }

  /** The first `count` kinds as a string: each kind is one Latin-1 character. */
  private kindString(count: number): string {
    return this.kinds.toString('latin1', 0, count);
  }
}
