import { createReadStream } from 'node:fs';
import { diagnose, type Report } from '../../diagnostics/diagnostic.js';
import type { DiagnosticCode } from '../../diagnostics/codes.js';
import type { DependencySentence } from '../../model/dependency.js';
import { LineIndex } from '../../model/line-index.js';
import { decodeStream, PIECE_SIZE } from '../bracketed/read-bracketed.js';
import type { SourceLine } from './conllu-line.js';
import { buildSentence } from './build-sentence.js';
import { MAX_TREE_LENGTH } from '../../model/limits.js';
import { SentenceCutter, type ConlluStart } from './sentence-cutter.js';

export type { ConlluStart } from './sentence-cutter.js';

/** How the CoNLL-U reader reports and names things. */
export interface ConlluReadOptions {
  /** The file name put in diagnostics and on sentences; default `-`. */
  file?: string;
}

/**
 * Reads CoNLL-U sentence by sentence from text that arrives in pieces: memory
 * holds one sentence and one line, never the file. Comments, columns and
 * line order are kept as written. Problems of the format are reported through
 * `report`; every sentence with at least one word line is handed on, so the
 * sentences after a broken one are still read.
 */
export async function* readConllu(
  pieces: AsyncIterable<string> | Iterable<string>,
  options: ConlluReadOptions,
  report: Report,
): AsyncGenerator<DependencySentence> {
  const reader = new LineReader(options.file ?? '-', report);
  // The text is read in stretches that end at sentence boundaries (SentenceCutter), whatever
  // pieces it arrives in: problems and sentences come in the same order when the stretches are
  // read on several threads.
  const cutter = new SentenceCutter();
  for await (const piece of pieces) {
    for (const chunk of cutter.push(piece)) {
      reader.push(chunk.text);
      yield* reader.take();
    }
  }
  const last = cutter.end();
  if (last.text !== '') reader.push(last.text);
  reader.end();
  yield* reader.take();
}

/** A reader of stretches of one file from a point on, for text that cannot be cut at sentence boundaries. */
export interface ConlluReader {
  /** The sentences a stretch completes (problems reported before them). */
  push(text: string): DependencySentence[];
  /** The sentences the file's end completes. */
  end(): DependencySentence[];
}

/** Opens a reader at a point of a file (a sentence boundary). */
export function openConlluReader(file: string, report: Report, start: ConlluStart): ConlluReader {
  const reader = new LineReader(file, report, start);
  return {
    push(text) {
      if (text !== '') reader.push(text);
      return reader.take();
    },
    end() {
      reader.end();
      return reader.take();
    },
  };
}

/**
 * Reads one stretch of a CoNLL-U file that starts at a sentence boundary
 * (after a blank line, or the file's start), as the reader of the whole file
 * reads it there: the same sentences, positions and problems, in the same
 * order. `last`: the stretch ends the file. `each` hears the sentences the
 * stretch's text completes, then those its end completes, each after the
 * problems reported before it.
 */
export function readConlluStretch(text: string, start: ConlluStart, last: boolean, file: string, report: Report, each: (sentence: DependencySentence) => void): void {
  const reader = openConlluReader(file, report, start);
  for (const sentence of reader.push(text)) each(sentence);
  if (last) for (const sentence of reader.end()) each(sentence);
}

/** Reads a CoNLL-U file as a stream of sentences. */
export function readConlluFile(path: string, options: ConlluReadOptions, report: Report): AsyncGenerator<DependencySentence> {
  const pieces = decodeStream(createReadStream(path, { highWaterMark: PIECE_SIZE }));
  return readConllu(pieces, { ...options, file: options.file ?? path }, report);
}

/** Reads every sentence of a string at once, for tests and small inputs. */
export function readConlluText(text: string, options: ConlluReadOptions, report: Report): DependencySentence[] {
  const reader = new LineReader(options.file ?? '-', report);
  reader.push(text);
  reader.end();
  return reader.take();
}

class LineReader {
  /** The start of a line whose end has not arrived, in pieces (joined once the line ends, so a long line costs no more than its length). */
  private rest: string[] = [];
  private restLength = 0;
  /** The line being read is past the limit: it is reported once and its text dropped until its end. */
  private overlong = false;
  /** The sentence being read holds bytes that were not UTF-8: it is reported and not handed on. */
  private broken = false;
  private offset = 0;
  private line = 1;
  private first = true;
  private lines: SourceLine[] = [];
  /** A blank line was just read: a second one is one too many. */
  private afterBlank = false;
  private ready: DependencySentence[] = [];

  constructor(
    private readonly file: string,
    private readonly report: Report,
    start?: ConlluStart,
  ) {
    if (start && !start.first) {
      this.first = false;
      this.offset = start.offset;
      this.line = start.line;
      // A stretch after the first starts after a blank line.
      this.afterBlank = true;
    }
  }

  push(piece: string): void {
    if (this.first) {
      this.first = false;
      if (piece.charCodeAt(0) === 0xfeff) {
        piece = piece.slice(1);
        this.offset = 0;
      }
    }
    let from = 0;
    for (let end = piece.indexOf('\n'); end !== -1; end = piece.indexOf('\n', from)) {
      const head = piece.slice(from, end);
      if (this.overlong) {
        this.skipOverlong(head.length);
      } else if (this.restLength === 0) {
        this.take1(head);
      } else {
        this.rest.push(head);
        const line = this.rest.join('');
        this.rest = [];
        this.restLength = 0;
        this.take1(line);
      }
      from = end + 1;
    }
    if (from < piece.length) {
      const tail = from === 0 ? piece : piece.slice(from);
      if (this.overlong) {
        this.offset += tail.length;
      } else {
        this.rest.push(tail);
        this.restLength += tail.length;
        if (this.restLength > MAX_TREE_LENGTH) this.startOverlong();
      }
    }
  }

  /** A line longer than any sentence may be: reported at its start, and dropped with its sentence. */
  private startOverlong(): void {
    const start: SourceLine = { text: this.rest[0]!.slice(0, 200), offset: this.offset, line: this.line };
    this.problem('tree-too-large', start, 1, `line longer than ${MAX_TREE_LENGTH} characters; its sentence is skipped`);
    this.offset += this.restLength;
    this.rest = [];
    this.restLength = 0;
    this.overlong = true;
    this.broken = true;
  }

  private skipOverlong(length: number): void {
    this.offset += length + 1;
    this.line++;
    this.overlong = false;
  }

  end(): void {
    if (this.overlong) {
      this.overlong = false;
    } else if (this.restLength > 0) {
      const last = this.rest.join('');
      this.rest = [];
      this.restLength = 0;
      this.problem('no-final-newline', { text: last, offset: this.offset, line: this.line }, last.length + 1, 'the file does not end with a line feed');
      this.take1(last);
    }
    if (this.lines.length > 0) {
      const lastLine = this.lines[this.lines.length - 1]!;
      this.problem('missing-blank-line', lastLine, lastLine.text.length + 1, 'the last sentence is not followed by a blank line');
      this.finish();
    }
  }

  take(): DependencySentence[] {
    const ready = this.ready;
    this.ready = [];
    return ready;
  }

  private take1(text: string): void {
    const line: SourceLine = { text, offset: this.offset, line: this.line };
    this.offset += text.length + 1;
    this.line++;
    if (text.endsWith('\r')) this.problem('carriage-return', line, text.length, 'line ends in CR LF; CoNLL-U lines end in LF');
    const replaced = text.indexOf('\uFFFD');
    if (replaced !== -1 && !this.broken) {
      this.problem('invalid-encoding', line, replaced + 1, 'bytes that are not valid UTF-8 (shown as U+FFFD); the sentence is skipped');
      this.broken = true;
    }
    if (text === '' || text === '\r') {
      if (this.lines.length === 0 && this.broken) {
        // The sentence was all one overlong line, reported already: it ends here.
        this.broken = false;
      } else if (this.lines.length === 0) {
        if (this.afterBlank || line.line === 1) this.problem('extra-blank-line', line, 1, 'a blank line where a sentence should begin');
      } else {
        this.finish();
      }
      this.afterBlank = true;
      return;
    }
    this.afterBlank = false;
    this.lines.push(line);
  }

  private finish(): void {
    const lines = this.lines;
    this.lines = [];
    if (this.broken) {
      this.broken = false;
      return;
    }
    const sentence = buildSentence(lines, this.file, this.report);
    if (sentence) this.ready.push(sentence);
  }

  private problem(code: DiagnosticCode, line: SourceLine, column: number, message: string): void {
    const lines = new LineIndex(line.text, { offset: line.offset, line: line.line, column: 1 });
    this.report(diagnose(code, message, { file: this.file, offset: line.offset + column - 1, lines }));
  }
}
