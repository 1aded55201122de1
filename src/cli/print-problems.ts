import type { TableError } from '../tables/table-source.js';
import type { Diagnostic, Report } from '../diagnostics/diagnostic.js';
import { formatDiagnostic } from '../diagnostics/format-diagnostic.js';
import type { CliIO } from './io.js';
import { statusLine } from './progress.js';

/** Where commands that write data send the problems they meet: one line each on standard error, errors counted. */
export class ProblemPrinter {
  errors = 0;
  readonly report: Report;

  constructor(io: CliIO) {
    this.report = (diagnostic: Diagnostic) => {
      if (diagnostic.severity === 'error') this.errors++;
      statusLine(io).write(formatDiagnostic(diagnostic) + '\n');
    };
  }
}

/** The lines a table that could not be loaded is reported with: each problem at its file:line:col, or one message. */
export function tableErrorLines(error: TableError): string[] {
  if (error.plain !== undefined) return [error.plain];
  return error.diagnostics.map((d) => formatDiagnostic(d, { source: true }));
}
