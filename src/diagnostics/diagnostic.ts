import type { DiagnosticCode } from './codes.js';
import { diagnosticCodes } from './codes.js';
import type { LineIndex } from '../model/line-index.js';

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
  /** Offset of the problem in the file (see Position). */
  offset: number;
  /** 1-based line. */
  line: number;
  /** 1-based column. */
  column: number;
  /** The source line holding the problem, for the caret excerpt; absent when unknown. */
  excerpt?: { text: string; column: number };
  /** Further lines of explanation: where a related node stands, what to do. */
  notes?: string[];
}

/** Where passes send what they find. */
export type Report = (diagnostic: Diagnostic) => void;

/** Builds a diagnostic at a file offset, taking line, column and excerpt from the index that covers it. */
export function diagnose(
  code: DiagnosticCode,
  message: string,
  where: { file: string; offset: number; lines: LineIndex },
  notes?: string[],
): Diagnostic {
  const point = where.lines.pointAt(where.offset);
  const diagnostic: Diagnostic = {
    code,
    severity: diagnosticCodes[code].severity,
    message,
    file: where.file,
    offset: where.offset,
    line: point.line,
    column: point.column,
    excerpt: where.lines.lineAt(where.offset),
  };
  if (notes && notes.length > 0) diagnostic.notes = notes;
  return diagnostic;
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
  if (item.source && item.position) return diagnose(code, message, { file: item.file ?? '-', offset: item.position.start, lines: item.source }, notes);
  const diagnostic: Diagnostic = { code, severity: diagnosticCodes[code].severity, message, file: item.file ?? '-', offset: 0, line: 1, column: 1 };
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
