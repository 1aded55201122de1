import type { Point } from './position.js';

/**
 * Turns offsets into lines and columns for one stretch of a file.
 *
 * The streaming reader keeps one index per tree (not per file), so memory stays
 * bounded by the largest tree rather than growing with the file.
 */
export class LineIndex {
  /** Offsets (file-absolute) of each line feed inside the stretch; found on first use, as most trees never need them. */
  private found: number[] | undefined;

  /**
   * @param text the stretch of text
   * @param start where `text` begins: file offset, line and column of its first character
   */
  constructor(
    readonly text: string,
    readonly start: Point,
  ) {}

  private get newlines(): number[] {
    if (this.found === undefined) {
      this.found = [];
      const text = this.text;
      for (let i = text.indexOf('\n'); i !== -1; i = text.indexOf('\n', i + 1)) this.found.push(this.start.offset + i);
    }
    return this.found;
  }

  /** The line and column of a file offset inside (or just past) this stretch. */
  pointAt(offset: number): Point {
    const newlines = this.newlines;
    let low = 0;
    let high = newlines.length;
    while (low < high) {
      const middle = (low + high) >> 1;
      if (newlines[middle]! < offset) low = middle + 1;
      else high = middle;
    }
    if (low === 0) return { offset, line: this.start.line, column: this.start.column + (offset - this.start.offset) };
    return { offset, line: this.start.line + low, column: offset - newlines[low - 1]! };
  }

  /** The text of the line holding `offset`, as far as this stretch holds it, and where that text starts. */
  lineAt(offset: number): { text: string; column: number } {
    const relative = Math.max(0, Math.min(offset - this.start.offset, this.text.length));
    const from = this.text.lastIndexOf('\n', relative - 1) + 1;
    let to = this.text.indexOf('\n', relative);
    if (to === -1) to = this.text.length;
    const text = this.text.slice(from, to).replace(/\r$/, '');
    return { text, column: this.pointAt(this.start.offset + from).column };
  }
}
