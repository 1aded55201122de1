import type { Diagnostic, Report } from '../diagnostics/diagnostic.js';
import { formatDiagnostic } from '../diagnostics/format-diagnostic.js';
import type { CliIO } from './io.js';

/** Where commands that write data send the problems they meet: one line each on standard error, errors counted. */
export class ProblemPrinter {
  errors = 0;
  readonly report: Report;

  constructor(io: CliIO) {
    this.report = (diagnostic: Diagnostic) => {
      if (diagnostic.severity === 'error') this.errors++;
      io.stderr.write(formatDiagnostic(diagnostic) + '\n');
    };
  }
}
