import type { TableError } from '../tables/table-source.js';
import type { Diagnostic, Report } from '../diagnostics/diagnostic.js';
import { diagnosticCodes, type DiagnosticCode } from '../diagnostics/codes.js';
import { formatDiagnostic } from '../diagnostics/format-diagnostic.js';
import type { CliIO } from './io.js';
import { statusLine } from './progress.js';

/**
 * How many problems a command prints one by one:
 * - `some`: the first {@link SHOWN_PER_CODE} of each code, the rest counted in
 *   a summary at the end (the default of commands that write data);
 * - `all`: every one (`--verbose`; validate's default, whose output they are);
 * - `none`: none, only the summary (`--quiet`).
 */
export type ProblemListing = 'some' | 'all' | 'none';

/** Problems of one code printed one by one before the rest are only counted. */
export const SHOWN_PER_CODE = 5;

/** The listing chosen by `--quiet` and `--verbose`, else the command's default. */
export function listingOf(options: Record<string, unknown>, fallback: ProblemListing = 'some'): ProblemListing {
  if (options.quiet === true) return 'none';
  if (options.verbose === true) return 'all';
  return fallback;
}

/**
 * Where commands send the problems they meet: one line each on standard
 * error (above a progress bar, never onto it), as many as the listing allows,
 * every one counted by code for the summary.
 */
export class ProblemPrinter {
  errors = 0;
  warnings = 0;
  readonly report: Report;
  private readonly byCode = new Map<DiagnosticCode, { count: number; shown: number }>();

  constructor(
    private readonly io: CliIO,
    private readonly listing: ProblemListing = 'some',
  ) {
    this.report = (diagnostic: Diagnostic) => {
      if (diagnostic.severity === 'error') this.errors++;
      else this.warnings++;
      let tally = this.byCode.get(diagnostic.code);
      if (!tally) this.byCode.set(diagnostic.code, (tally = { count: 0, shown: 0 }));
      tally.count++;
      if (this.listing === 'none' || (this.listing === 'some' && tally.shown >= SHOWN_PER_CODE)) return;
      tally.shown++;
      statusLine(io).write(formatDiagnostic(diagnostic) + '\n');
    };
  }

  /**
   * Lines counting the problems of each code that were not all printed, most
   * frequent first: `391 × nothing-to-convert (warning, 5 shown above)`.
   */
  summaryLines(): string[] {
    const hidden = [...this.byCode].filter(([, tally]) => tally.shown < tally.count).sort((a, b) => b[1].count - a[1].count);
    return hidden.map(([code, tally]) => {
      const shown = tally.shown > 0 ? `, ${tally.shown} shown above` : '';
      return `${tally.count.toLocaleString('en-US')} × ${code} (${diagnosticCodes[code].severity}${shown}): ${diagnosticCodes[code].meaning}`;
    });
  }

  /** Prints the summary lines, with a hint on how to see them all, before the command's closing line. */
  printSummary(): void {
    const lines = this.summaryLines();
    if (lines.length === 0) return;
    const hint = this.listing === 'none' ? '' : ' (--verbose lists every one)';
    this.io.stderr.write(`treebridge: problems by kind${hint}:\n${lines.map((line) => `  ${line}`).join('\n')}\n`);
  }
}

/** The lines a table that could not be loaded is reported with: each problem at its file:line:col, or one message. */
export function tableErrorLines(error: TableError): string[] {
  if (error.plain !== undefined) return [error.plain];
  return error.diagnostics.map((d) => formatDiagnostic(d, { source: true }));
}

/** `n word` or `n words`, numbers written as everywhere in treebridge (thousands separated). */
export function plural(n: number, word: string, words = `${word}s`): string {
  return `${n.toLocaleString('en-US')} ${n === 1 ? word : words}`;
}

/**
 * The last line of every command that reads a corpus, on standard error, in
 * one shape: what was read, what became of it (the parts add up to what was
 * read), notes, and the problems met. `treebridge: 25 trees read: 24
 * converted, 1 skipped; 12 antecedents moved; 0 errors, 1 warning`.
 */
export function closingLine(read: number, unit: string, outcomes: Array<[number, string]>, notes: string[], problems: ProblemPrinter): string {
  const parts = [`${plural(read, unit)} read: ${outcomes.map(([n, what]) => `${n.toLocaleString('en-US')} ${what}`).join(', ')}`, ...notes.filter(Boolean)];
  if (problems.errors + problems.warnings > 0) parts.push(`${plural(problems.errors, 'error')}, ${plural(problems.warnings, 'warning')}`);
  return `treebridge: ${parts.join('; ')}\n`;
}

/** Adds `--quiet` and `--verbose`, which choose how many problems are printed one by one. */
export function addListingOptions<T extends { option(flags: string, description: string): T }>(command: T): T {
  return command
    .option('--quiet', 'print no problem one by one: only the count of each kind and the closing line')
    .option('--verbose', `print every problem; by default the first ${SHOWN_PER_CODE} of each kind are printed and the rest counted`);
}
