import type { Command } from 'commander';
import type { Diagnostic } from '../../diagnostics/diagnostic.js';
import { formatDiagnostic } from '../../diagnostics/format-diagnostic.js';
import { BracketedValidator } from '../../validate/validate-bracketed.js';
import { addBracketedReadOptions, bracketedReadOptions } from '../bracketed-options.js';
import { openInputs, Output, type CliIO } from '../io.js';
import { readTreesOf } from '../read-trees.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';

export function registerValidate(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('validate')
    .description('check bracketed treebanks: one line per problem, then a summary')
    .argument('<files...>', 'input files, or - for standard input')
    .option('--json', 'print a JSON report instead of lines')
    .option('--source', 'show the source line with a caret, and notes, under each problem')
    .option('-o, --output <file>', 'write the report to a file (default: standard output)');
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>) => {
    done(await validate(files, options, io));
  });
}

async function validate(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const output = Output.to(options.output as string | undefined, io);
  const json = options.json === true;
  const problems: Diagnostic[] = [];
  // The reader reports a stretch of input before its trees are checked, so a
  // file's problems are held until the next file starts, then printed in file order.
  let current: Diagnostic[] = [];
  const finished: Diagnostic[][] = [];
  const validator = new BracketedValidator((diagnostic) => current.push(diagnostic));
  const flush = async () => {
    for (const batch of finished.splice(0)) {
      batch.sort((a, b) => a.offset - b.offset);
      if (json) problems.push(...batch);
      else if (batch.length > 0) {
        await output.write(batch.map((d) => formatDiagnostic(d, { source: options.source === true })).join('\n') + '\n');
      }
    }
  };
  const startInput = () => {
    finished.push(current);
    current = [];
    validator.startFile();
  };
  try {
    for await (const tree of readTreesOf(inputs, bracketedReadOptions(options), validator.report, io, startInput)) {
      if (finished.length > 0) await flush();
      validator.check(tree);
    }
    finished.push(current);
    await flush();
    const summary = { ...validator.summary, files: validator.summary.files + failures.length };
    if (json) {
      const report = {
        ...summary,
        problems: problems.map(({ file, line, column, severity, code, message }) => ({ file, line, col: column, severity, code, message })),
      };
      await output.write(JSON.stringify(report, null, 2) + '\n');
    } else {
      await output.write(summaryLine(summary) + '\n');
    }
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  if (failures.length > 0) return { code: ExitCode.UsageOrIO, messages: failures };
  return { code: validator.summary.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}

function summaryLine(s: { files: number; trees: number; words: number; errors: number; warnings: number }): string {
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  return `${plural(s.files, 'file')}, ${plural(s.trees, 'tree')}, ${plural(s.words, 'word')}: ${plural(s.errors, 'error')}, ${plural(s.warnings, 'warning')}`;
}
