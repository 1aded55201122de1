import type { Diagnostic } from './diagnostic.js';

/** How much of each diagnostic to print. */
export interface FormatOptions {
  /** Add the source line with a caret under the column, and the notes. */
  source?: boolean;
}

/** `file:line:col: severity: message [code]`, optionally followed by a caret excerpt and notes. */
export function formatDiagnostic(diagnostic: Diagnostic, options: FormatOptions = {}): string {
  const { file, line, column, severity, message, code } = diagnostic;
  let text = `${file}:${line}:${column}: ${severity}: ${message} [${code}]`;
  if (!options.source) return text;
  const excerpt = diagnostic.excerpt;
  if (excerpt && excerpt.text.length > 0) {
    const gutter = String(line).length;
    const shown = excerpt.text.replace(/\t/g, ' ');
    const caretAt = Math.max(0, column - excerpt.column);
    text += `\n ${String(line)} | ${shown}\n ${' '.repeat(gutter)} | ${' '.repeat(caretAt)}^`;
  }
  for (const note of diagnostic.notes ?? []) text += `\n  note: ${note}`;
  return text;
}
