import { MAX_TREE_LENGTH } from '../../model/limits.js';

/** Where a stretch of CoNLL-U text starts in its file: the reader's state there. */
export interface ConlluStart {
  /** Offset (in characters, a byte-order mark left out) and line of the stretch's first character. */
  offset: number;
  line: number;
  /** The stretch starts the file (a byte-order mark may open it). */
  first: boolean;
}

/** Characters of CoNLL-U per stretch, about: enough that handing a stretch to a thread costs little beside reading it. */
export const STRETCH_SIZE = 16 * 1024;

/** A stretch of CoNLL-U text, where it starts, and whether it starts at a sentence boundary. */
export interface Stretch {
  text: string;
  start: ConlluStart;
  /**
   * False when the stretch before it had to end inside a sentence (no blank
   * line for longer than any sentence may be): it can only be read by the
   * reader that read that one.
   */
  clean: boolean;
  /** False when it ends inside a sentence. A stretch that is clean and ends at a boundary can be read on its own. */
  endsClean: boolean;
}

/**
 * Cuts CoNLL-U text arriving in pieces into stretches that end just after a
 * blank line: the first blank line that ends at or past {@link STRETCH_SIZE}
 * characters into the stretch, so where the text is cut depends on the text
 * alone, never on how it arrived. Each stretch knows the offset and line it
 * starts at. Only when no blank line comes for longer than a sentence may be
 * is a stretch cut at a line end (or anywhere), and the next marked unclean.
 */
export class SentenceCutter {
  /** The text not yet cut, in the pieces it came in (joined only to cut: no piece is copied once per push). */
  private parts: string[] = [];
  private length = 0;
  /** The end of `parts` not yet searched for a blank line, and where it starts in the stretch. */
  private tail = '';
  private tailStart = 0;
  private start: ConlluStart = { offset: 0, line: 1, first: true };
  private clean = true;

  push(piece: string): Stretch[] {
    if (piece === '') return [];
    this.parts.push(piece);
    this.length += piece.length;
    this.tail += piece;
    const out: Stretch[] = [];
    for (;;) {
      const cut = this.findCut();
      if (!cut) break;
      out.push(this.take(cut.at, cut.clean));
    }
    return out;
  }

  /** The rest of the text (possibly empty): the last stretch of the file. */
  end(): Stretch {
    return this.take(this.length, true);
  }

  /**
   * The end of the next stretch and whether it ends after a blank line;
   * undefined when more text is needed.
   */
  private findCut(): { at: number; clean: boolean } | undefined {
    if (this.length < STRETCH_SIZE) return undefined;
    const tail = this.tail;
    let from = Math.max(0, STRETCH_SIZE - 1 - this.tailStart);
    let keep = tail.length;
    for (;;) {
      const newline = tail.indexOf('\n', from);
      if (newline === -1) break;
      // A blank line after this line end: `\n` or `\r\n` (the reader takes a lone CR as blank).
      const next = tail.charCodeAt(newline + 1);
      if (next === 10) return { at: this.tailStart + newline + 2, clean: true };
      // Not known yet: search from here again when more text has come.
      if (newline + 1 >= tail.length || (next === 13 && newline + 2 >= tail.length)) {
        keep = newline;
        break;
      }
      if (next === 13 && tail.charCodeAt(newline + 2) === 10) return { at: this.tailStart + newline + 3, clean: true };
      from = newline + 1;
    }
    // What was searched is not searched again.
    keep = Math.max(keep, Math.min(tail.length, STRETCH_SIZE - 1 - this.tailStart));
    this.tail = tail.slice(keep);
    this.tailStart += keep;
    const limit = MAX_TREE_LENGTH + STRETCH_SIZE;
    if (this.length <= limit) return undefined;
    // No blank line for longer than a sentence may be: cut at the last line end before the limit.
    const text = this.joined();
    const end = text.lastIndexOf('\n', limit - 1);
    return { at: end === -1 ? limit : end + 1, clean: false };
  }

  private joined(): string {
    if (this.parts.length > 1) this.parts = [this.parts.join('')];
    return this.parts[0] ?? '';
  }

  private take(cut: number, clean: boolean): Stretch {
    const all = this.joined();
    const text = all.slice(0, cut);
    const rest = all.slice(cut);
    this.parts = rest === '' ? [] : [rest];
    this.length = rest.length;
    this.tail = rest;
    this.tailStart = 0;
    const stretch: Stretch = { text, start: this.start, clean: this.clean, endsClean: clean };
    let lines = 0;
    for (let at = text.indexOf('\n'); at !== -1; at = text.indexOf('\n', at + 1)) lines++;
    const bom = this.start.first && text.charCodeAt(0) === 0xfeff ? 1 : 0;
    this.start = { offset: this.start.offset + text.length - bom, line: this.start.line + lines, first: false };
    // The stretch after a cut inside a sentence cannot be read on its own, nor any after it in the file.
    this.clean &&= clean;
    return stretch;
  }
}
