import { diagnose, type Diagnostic } from '../../diagnostics/diagnostic.js';
import { MAX_TREE_DEPTH, MAX_TREE_LENGTH } from '../../model/limits.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import { LineIndex } from '../../model/line-index.js';
import type { Point } from '../../model/position.js';
import { CLOSE, OPEN, TokenTable } from './token-table.js';
import type { TreeTokens } from './tree-assembly.js';

/**
 * Where a new top-level tree may begin.
 * - `first-column`: an opening bracket in the first column of a line always
 *   starts a new tree, so a tree that is not closed is reported and reading
 *   resumes with the next one. Right for every layout where inner brackets are
 *   indented or share a line with their parent.
 * - `brackets`: only bracket balance counts (any layout at all); an unclosed
 *   tree then runs to the end of the file.
 */
export type TreeBreaks = 'first-column' | 'brackets';

export interface SplitOptions {
  /** Where trees may begin; default `first-column`. */
  treeBreaks?: TreeBreaks;
  /** Largest tree accepted, in characters; default 16 Mi. */
  maxTreeLength?: number;
  /** Deepest bracket nesting accepted; default 2000. */
  maxDepth?: number;
}

/** One top-level bracket cut from the input, with what is needed to locate its parts. */
export interface TreeChunk {
  /** The text from the opening bracket to its matching closing bracket. */
  text: string;
  /** File offset of the opening bracket. */
  offset: number;
  /** Lines and columns for the chunk (and the start of its first line). */
  lines: LineIndex;
  /** Index of the chunk's first token in its batch's token table. */
  firstToken: number;
  /** The tree's place among the top-level brackets of the input, from 1 (see Tree.number). */
  number: number;
}

/** The trees finished by one piece of input, and their tokens; valid until the next piece. */
export interface TreeBatch {
  trees: TreeChunk[];
  tokens: TreeTokens;
}

const BACKSLASH = 92;
const NEWLINE = 10;
/** U+FFFD, what the decoder puts where bytes are not valid UTF-8. */
const REPLACEMENT = 0xfffd;

function isSpace(code: number): boolean {
  return code === 32 || code === 9 || code === 10 || code === 13 || code === 12 || code === 11;
}

/** Space or tab, the padding of indented layouts; line feeds are counted, so they stop the run. */
function isBlank(code: number): boolean {
  return code === 32 || code === 9;
}

/** A character that can only continue a word: not space, bracket, backslash or U+FFFD. */
function isPlain(code: number): boolean {
  return code > 41 ? code !== BACKSLASH && code !== REPLACEMENT : code > 32 && code !== OPEN && code !== CLOSE;
}

/**
 * Cuts a stream of text into top-level trees, and each tree into tokens, in
 * one scan. Text arrives in pieces of any size (`push`); the trees a piece
 * finishes leave together through `onTrees` at the end of the piece, and what
 * cannot be a tree leaves through `onProblem`; nothing is thrown and nothing
 * is dropped without a diagnostic. Memory holds the trees of one piece and
 * one line at most.
 */
export class TreeSplitter {
  private buffer = '';
  /** File offset of buffer[0]. */
  private bufferOffset = 0;
  /** Next buffer index to scan. */
  private scan = 0;
  /** Column of buffer[0]. */
  private bufferStartColumn = 1;
  /** Line number of the character at `scan`, and the file offset where that line starts. */
  private line = 1;
  private lineStart = 0;
  private depth = 0;
  /** Buffer index, point and line-start offset of the current tree's opening bracket; -1 outside trees. */
  private treeStart = -1;
  private treeStartPoint: Point = { offset: 0, line: 1, column: 1 };
  private treeLineStart = 0;
  /** The kind of stray text being skipped between trees, so a run is reported once. */
  private stray: 'text' | 'close' | null = null;
  /** Set while skipping a tree already reported as too large. */
  private skipping = false;
  /** Where the word being scanned starts, relative to the tree; -1 between words. */
  private wordStart = -1;
  private readonly tokens = new TokenTable();
  /** Top-level brackets opened so far, broken trees included: the number of the current tree. */
  private begun = 0;
  /** Trees finished since the last batch left. */
  private finished: TreeChunk[] = [];
  private first = true;
  /**
   * Text received but not yet appended to the buffer. While a long tree is
   * open, pieces wait here until they are as long as the open tree: appending
   * a small piece to a long buffer copies the whole buffer (the engine flattens
   * it to scan it), so a tree of n characters would cost n² copying; waiting
   * for the text to double makes it linear.
   */
  private pending: string[] = [];
  private pendingLength = 0;
  private readonly treeBreaks: TreeBreaks;
  private readonly maxTreeLength: number;
  private readonly maxDepth: number;

  constructor(
    private readonly file: string,
    private readonly onTrees: (batch: TreeBatch) => void,
    private readonly onProblem: (diagnostic: Diagnostic) => void,
    options: SplitOptions = {},
  ) {
    this.treeBreaks = options.treeBreaks ?? 'first-column';
    this.maxTreeLength = options.maxTreeLength ?? MAX_TREE_LENGTH;
    this.maxDepth = options.maxDepth ?? MAX_TREE_DEPTH;
  }

  /** Characters held right now: one open tree and part of a line at most, whatever the input's size. */
  get buffered(): number {
    return this.buffer.length + this.pendingLength;
  }

  /** Feeds the next piece of decoded text. */
  push(piece: string): void {
    if (this.first) {
      this.first = false;
      if (piece.charCodeAt(0) === 0xfeff) piece = piece.slice(1);
    }
    this.pending.push(piece);
    this.pendingLength += piece.length;
    const open = this.treeStart === -1 ? this.buffer.length - this.scan : this.buffer.length - this.treeStart;
    if (this.pendingLength < open) return;
    this.takePending();
    this.run(false);
    this.handOver();
    this.compact();
  }

  /** Sends the finished trees on, as one batch. */
  private handOver(): void {
    if (this.finished.length === 0) return;
    const trees = this.finished;
    this.finished = [];
    this.onTrees({ trees, tokens: this.tokens.finished() });
    this.tokens.clearFinished();
  }

  private takePending(): void {
    if (this.pendingLength === 0) return;
    this.buffer += this.pending.length === 1 ? this.pending[0]! : this.pending.join('');
    this.pending = [];
    this.pendingLength = 0;
  }

  /** Ends the input: an open tree is reported as unclosed. */
  end(): void {
    this.takePending();
    this.run(true);
    this.handOver();
    if (this.treeStart !== -1 || this.skipping) {
      if (!this.skipping) this.reportUnclosed('at the end of the input');
      this.treeStart = -1;
      this.skipping = false;
    }
    this.buffer = '';
  }

  private run(final: boolean): void {
    const buffer = this.buffer;
    const tokens = this.tokens;
    let i = this.scan;
    for (; i < buffer.length; i++) {
      if (this.depth > 0 && !this.skipping) {
        i = this.scanTree(i);
        if (i >= buffer.length) break;
        if (this.depth === 0) {
          i--; // the tree closed: go on after it
          continue;
        }
      }
      const code = buffer.charCodeAt(i);
      if (code === NEWLINE) {
        if (this.wordStart !== -1) this.endWord(i);
        this.line++;
        this.lineStart = this.bufferOffset + i + 1;
        continue;
      }
      if (this.depth === 0) {
        if (code === OPEN) {
          this.stray = null;
          this.openTree(i);
        } else if (code === CLOSE) {
          this.scan = i;
          if (this.stray !== 'close') this.report('unmatched-close', i, 'closing bracket with no tree open');
          this.stray = 'close';
        } else if (!isSpace(code)) {
          if (this.stray !== 'text') {
            this.scan = i;
            this.report('text-outside-tree', i, `text outside any tree: "${this.wordAt(i)}"`);
          }
          this.stray = 'text';
        } else if (this.stray === 'close') {
          this.stray = null;
        }
        continue;
      }
      if (isSpace(code)) {
        if (this.wordStart !== -1) this.endWord(i);
        while (i + 1 < buffer.length && isBlank(buffer.charCodeAt(i + 1))) i++;
        continue;
      }
      if (code === OPEN) {
        if (this.wordStart !== -1) this.endWord(i);
        if (this.treeBreaks === 'first-column' && this.bufferOffset + i === this.lineStart) {
          this.scan = i;
          if (!this.skipping) this.reportUnclosed(`before the next tree at line ${this.line}`);
          this.skipping = false;
          this.openTree(i);
          continue;
        }
        this.depth++;
        if (!this.skipping) {
          tokens.open(i - this.treeStart);
          if (this.depth > this.maxDepth) {
            this.scan = i;
            this.report('tree-too-large', this.treeStart, `tree nested deeper than ${this.maxDepth} brackets; skipped`);
            this.skipping = true;
            tokens.dropTree();
          }
        }
        continue;
      }
      if (code === CLOSE) {
        if (this.wordStart !== -1) this.endWord(i);
        if (!this.skipping) tokens.close(i - this.treeStart, this.depth);
        this.depth--;
        if (this.depth === 0) this.closeTree(i);
        continue;
      }
      if (this.wordStart === -1) this.wordStart = i - this.treeStart;
      if (code !== BACKSLASH && code !== REPLACEMENT) {
        // The rest of a word, in a tight loop: most characters of a file are here.
        let next = i + 1;
        while (next < buffer.length && isPlain(buffer.charCodeAt(next))) next++;
        i = next - 1;
        continue;
      }
      if (code === BACKSLASH) {
        if (i + 1 >= buffer.length && !final) break; // the escaped character has not arrived yet
        const next = buffer.charCodeAt(i + 1);
        if (next === OPEN || next === CLOSE || next === BACKSLASH) i++;
      } else if (code === REPLACEMENT && !this.skipping) {
        tokens.noteReplacement(i - this.treeStart);
      }
    }
    this.scan = i;
    if (this.treeStart !== -1 && !this.skipping && i - this.treeStart > this.maxTreeLength) {
      this.report('tree-too-large', this.treeStart, `tree longer than ${this.maxTreeLength} characters; skipped`);
      this.skipping = true;
      tokens.dropTree();
    }
  }

  /**
   * The common case, inside a tree that is being kept, in a tight loop on
   * local variables. Returns where it stopped: at the end of the buffer, just
   * after the tree's closing bracket, or at a character it leaves to `run`
   * (a bracket in the first column, a bracket too deep, a backslash at the end of the buffer).
   */
  private scanTree(start: number): number {
    const buffer = this.buffer;
    const length = buffer.length;
    const tokens = this.tokens;
    const base = this.treeStart;
    const offset = this.bufferOffset;
    const columnBreaks = this.treeBreaks === 'first-column';
    const maxDepth = this.maxDepth;
    let depth = this.depth;
    let wordStart = this.wordStart;
    let line = this.line;
    let lineStart = this.lineStart;
    let i = start;
    for (; i < length; i++) {
      const code = buffer.charCodeAt(i);
      if (code <= CLOSE) {
        if (code === 32 || code === 9 || code === 13 || code === 12 || code === 11) {
          if (wordStart !== -1) {
            tokens.word(wordStart, i - base);
            wordStart = -1;
          }
          continue;
        }
        if (code === NEWLINE) {
          if (wordStart !== -1) {
            tokens.word(wordStart, i - base);
            wordStart = -1;
          }
          line++;
          lineStart = offset + i + 1;
          continue;
        }
        if (code === OPEN) {
          if (wordStart !== -1) {
            tokens.word(wordStart, i - base);
            wordStart = -1;
          }
          if ((columnBreaks && offset + i === lineStart) || depth >= maxDepth) break;
          depth++;
          tokens.open(i - base);
          continue;
        }
        if (code === CLOSE) {
          if (wordStart !== -1) {
            tokens.word(wordStart, i - base);
            wordStart = -1;
          }
          tokens.close(i - base, depth);
          depth--;
          if (depth === 0) {
            this.depth = 0;
            this.wordStart = -1;
            this.line = line;
            this.lineStart = lineStart;
            this.closeTree(i);
            return i + 1;
          }
          continue;
        }
        // Other characters up to ')' ('!' to apostrophe, control characters) are word characters.
      }
      if (wordStart === -1) wordStart = i - base;
      if (code === BACKSLASH) {
        if (i + 1 >= length) break;
        const next = buffer.charCodeAt(i + 1);
        if (next === OPEN || next === CLOSE || next === BACKSLASH) i++;
      } else if (code === REPLACEMENT) {
        tokens.noteReplacement(i - base);
      } else {
        while (i + 1 < length && isPlain(buffer.charCodeAt(i + 1))) i++;
      }
    }
    this.depth = depth;
    this.wordStart = wordStart;
    this.line = line;
    this.lineStart = lineStart;
    return i;
  }

  private endWord(index: number): void {
    if (!this.skipping) this.tokens.word(this.wordStart, index - this.treeStart);
    this.wordStart = -1;
  }

  private openTree(index: number): void {
    this.begun++;
    this.depth = 1;
    this.treeStart = index;
    const offset = this.bufferOffset + index;
    this.treeStartPoint = { offset, line: this.line, column: offset - this.lineStart + 1 };
    this.treeLineStart = this.lineStart;
    this.wordStart = -1;
    this.tokens.beginTree();
    this.tokens.open(0);
  }

  private closeTree(index: number): void {
    const tokens = this.tokens;
    if (this.skipping) {
      this.skipping = false;
    } else if (index + 1 - this.treeStart > this.maxTreeLength) {
      this.scan = index;
      this.report('tree-too-large', this.treeStart, `tree longer than ${this.maxTreeLength} characters; skipped`);
      tokens.dropTree();
    } else if (tokens.currentTreeReplacement !== -1) {
      this.scan = index;
      const at = this.treeStart + tokens.currentTreeReplacement;
      this.report('invalid-encoding', at, 'bytes that are not valid UTF-8 (shown as U+FFFD); the tree is skipped');
      tokens.dropTree();
    } else {
      const text = this.buffer.slice(this.treeStart, index + 1);
      // Start the line index at the line's beginning when it is still buffered, for whole-line excerpts.
      const lineFrom = Math.max(this.treeLineStart - this.bufferOffset, 0);
      const prefix = this.buffer.slice(lineFrom, this.treeStart);
      const start = this.treeStartPoint;
      const lines = new LineIndex(prefix + text, {
        offset: start.offset - prefix.length,
        line: start.line,
        column: start.column - prefix.length,
      });
      this.finished.push({ text, offset: start.offset, lines, firstToken: tokens.currentTreeStart, number: this.begun });
      tokens.commitTree();
    }
    this.treeStart = -1;
  }

  private reportUnclosed(where: string): void {
    const open = this.openBrackets();
    const innermost = open[open.length - 1] ?? this.treeStart;
    const first = this.treeStartPoint;
    this.report(
      'unclosed-bracket',
      innermost,
      `bracket never closed: ${open.length} bracket${open.length === 1 ? '' : 's'} still open ${where}`,
      [`the tree begins at ${first.line}:${first.column}; it is skipped`],
    );
  }

  /** Buffer indices of the brackets still open in the current tree, found again by scanning its text: only errors need them. */
  private openBrackets(): number[] {
    const open: number[] = [];
    const buffer = this.buffer;
    for (let k = this.treeStart; k < this.scan; k++) {
      const code = buffer.charCodeAt(k);
      if (code === BACKSLASH) {
        const next = buffer.charCodeAt(k + 1);
        if (next === OPEN || next === CLOSE || next === BACKSLASH) k++;
      } else if (code === OPEN) {
        open.push(k);
      } else if (code === CLOSE) {
        open.pop();
      }
    }
    return open;
  }

  private report(code: DiagnosticCode, index: number, message: string, notes?: string[]): void {
    const offset = this.bufferOffset + index;
    const newlineBefore = this.buffer.lastIndexOf('\n', index - 1);
    const from = newlineBefore + 1;
    let to = this.buffer.indexOf('\n', index);
    if (to === -1) to = this.buffer.length;
    // The scan position's line, less the line feeds between the problem and it.
    let line = this.line;
    for (let k = index; k < this.scan; k++) if (this.buffer.charCodeAt(k) === NEWLINE) line--;
    const column = newlineBefore === -1 ? this.bufferStartColumn : 1;
    const lines = new LineIndex(this.buffer.slice(from, to), { offset: this.bufferOffset + from, line, column });
    this.onProblem(diagnose(code, message, { file: this.file, offset, lines }, notes));
  }

  private wordAt(index: number): string {
    const match = /^[^\s()]{1,40}/.exec(this.buffer.slice(index, index + 40));
    return match ? match[0] : this.buffer.charAt(index);
  }

  /** Drops consumed text, keeping the open tree and the current line (when it is short). */
  private compact(): void {
    let keep = this.scan;
    if (this.treeStart !== -1 && !this.skipping) keep = Math.min(keep, this.treeStart);
    const lineIndex = this.lineStart - this.bufferOffset;
    if (lineIndex >= 0 && keep - lineIndex < 4096) keep = Math.min(keep, lineIndex);
    if (keep === 0) return;
    const lastNewline = this.buffer.lastIndexOf('\n', keep - 1);
    this.bufferStartColumn = lastNewline === -1 ? this.bufferStartColumn + keep : keep - lastNewline;
    this.buffer = this.buffer.slice(keep);
    this.bufferOffset += keep;
    this.scan -= keep;
    if (this.treeStart !== -1) this.treeStart = this.skipping ? -1 : this.treeStart - keep;
    if (this.skipping) this.treeStart = -1;
  }
}
