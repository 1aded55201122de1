import type { DiagnosticCode } from './codes.js';
import { diagnosticCodes } from './codes.js';
import type { LineIndex } from '../model/line-index.js';
import type { Point } from '../model/position.js';

/** How bad a problem is: an error stops a tree from being read; a warning does not. */
export type Severity = 'error' | 'warning';

/**
 * A problem found in an input, as data. Passes collect diagnostics through a
 * {@link Report} callback instead of throwing, so one run reports them all.
 */
export interface Diagnostic {
  /** Stable code, see {@link diagnosticCodes}. */
  code: DiagnosticCode;
  /** From the code's entry in {@link diagnosticCodes}. */
  severity: Severity;
  /** One line for people, naming the offending text. */
  message: string;
  /** The file as the user named it (`-` for standard input). */
  file: string;
  /** Offset where the problem starts in the file (see Position). */
  offset: number;
  /** 1-based line where the problem starts. */
  line: number;
  /** 1-based column where the problem starts. */
  column: number;
  /**
   * Just past the problem: the end of the node, field or token it is about.
   * Equal to the start when the problem is a place rather than a stretch
   * (a missing bracket at the end of a file).
   */
  end: Point;
  /** The source line holding the problem, for the caret excerpt; absent when unknown. */
  excerpt?: { text: string; column: number };
  /** Further lines of explanation: where a related node stands, what to do. */
  notes?: string[];
}

/** Where passes send what they find. */
export type Report = (diagnostic: Diagnostic) => void;

/** Where a problem stands in its file, without what the problem is: a diagnostic is built from it only when needed. */
export type Place = Pick<Diagnostic, 'offset' | 'line' | 'column' | 'end' | 'excerpt'>;

/**
 * The place of a stretch of a file, line, column and excerpt taken from the
 * index that covers it. Without `end` the stretch is the token that starts
 * there: up to the next white space, at least one character, within its line.
 */
export function placeAt(lines: LineIndex, offset: number, end?: number): Place {
  const point = lines.pointAt(offset);
  const to = end ?? tokenEnd(lines, offset);
  return { offset, line: point.line, column: point.column, end: to <= offset ? point : lines.pointAt(to), excerpt: lines.lineAt(offset) };
}

/** Builds a diagnostic at a place found before (see placeAt). */
export function diagnosePlace(code: DiagnosticCode, message: string, file: string, place: Place, notes?: string[]): Diagnostic {
  const diagnostic: Diagnostic = { code, severity: diagnosticCodes[code].severity, message, file, ...place };
  if (notes && notes.length > 0) diagnostic.notes = notes;
  return diagnostic;
}

/**
 * Builds a diagnostic at a file offset, taking line, column and excerpt from
 * the index that covers it. Without `end` the problem covers the token that
 * starts there: up to the next white space, at least one character, within
 * its line.
 */
export function diagnose(
  code: DiagnosticCode,
  message: string,
  where: { file: string; offset: number; end?: number; lines: LineIndex },
  notes?: string[],
): Diagnostic {
  return diagnosePlace(code, message, where.file, placeAt(where.lines, where.offset, where.end), notes);
}

/**
 * Offset just past the token at `offset`: a bracket alone, else the run of
 * characters up to white space, a bracket or the end of the line.
 */
function tokenEnd(lines: LineIndex, offset: number): number {
  const text = lines.text;
  const from = offset - lines.start.offset;
  if (from < 0 || from >= text.length || text[from] === '\n' || text[from] === '\r') return offset;
  let to = from + 1;
  if (text[from] !== '(' && text[from] !== ')') while (to < text.length && !/[\s()]/.test(text[to]!)) to++;
  return lines.start.offset + to;
}

/** Where each line of a text starts, for diagnostics about small texts held whole (tables). */
export function lineOffsets(lines: readonly string[]): number[] {
  const offsets: number[] = [];
  let offset = 0;
  for (const line of lines) {
    offsets.push(offset);
    offset += line.length + 1;
  }
  return offsets;
}

/**
 * A diagnostic about one line of a small text held whole (a table): the line's
 * text, number and offset, and the column where the problem starts. Without
 * `length` the problem covers the token there (at least one character).
 */
export function diagnoseLine(
  code: DiagnosticCode,
  message: string,
  where: { file: string; text: string; line: number; lineOffset: number; column: number; length?: number },
): Diagnostic {
  const text = where.text.replace(/\r$/, '');
  const length = where.length ?? Math.max(1, /^\S*/.exec(text.slice(where.column - 1))![0].length);
  const offset = where.lineOffset + where.column - 1;
  return {
    code,
    severity: diagnosticCodes[code].severity,
    message,
    file: where.file,
    offset,
    line: where.line,
    column: where.column,
    end: { offset: offset + length, line: where.line, column: where.column + length },
    excerpt: { text, column: 1 },
  };
}

/** Something read from a file that a diagnostic can point at as a whole: a tree, a sentence. */
export interface Located {
  file?: string;
  position?: { start: number; end: number };
  source?: LineIndex;
}

/**
 * A diagnostic about a whole tree or sentence, at its start. An item that no
 * file held (built by a pass) is named as line 1, column 1 of its file, so that
 * it is still reported rather than lost.
 */
export function diagnoseItem(code: DiagnosticCode, message: string, item: Located, notes?: string[]): Diagnostic {
  if (item.source && item.position) return diagnose(code, message, { file: item.file ?? '-', offset: item.position.start, end: item.position.end, lines: item.source }, notes);
  const diagnostic: Diagnostic = { code, severity: diagnosticCodes[code].severity, message, file: item.file ?? '-', offset: 0, line: 1, column: 1, end: { offset: 0, line: 1, column: 1 } };
  if (notes && notes.length > 0) diagnostic.notes = notes;
  return diagnostic;
}

/**
 * How a tree or sentence is named wherever treebridge prints one: its
 * identifier when it has one, else the file and line where it begins
 * (`harbour.psd:12`), else its file and number among the items read.
 */
export function itemName(item: Located & { id?: string }, number?: number): string {
  if (item.id !== undefined && item.id !== '') return item.id;
  const file = item.file ?? '-';
  if (item.source && item.position) return `${file}:${item.source.pointAt(item.position.start).line}`;
  return number === undefined ? `${file} (no id)` : `${file}#${number}`;
}
