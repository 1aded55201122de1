import { Option, type Command } from 'commander';
import { formatDiagnostic } from '../../diagnostics/format-diagnostic.js';
import { writeTree, type Layout } from '../../formats/bracketed/write-bracketed.js';
import { addBracketedReadOptions, bracketedReadOptions } from '../bracketed-options.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { openInputs, Output, type CliIO } from '../io.js';
import { readTreesOf } from '../read-trees.js';

export function registerRewrite(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('rewrite')
    .description('read bracketed trees and write them again in a chosen layout; problems go to standard error')
    .argument('<files...>', 'input files, or - for standard input')
    .addOption(new Option('--layout <layout>', 'line: one tree per line; indented: one bracket per line where it does not fit').choices(['line', 'indented']).default('line'))
    .option('-o, --output <file>', 'write the trees to a file (default: standard output)');
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>) => {
    done(await rewrite(files, options, io));
  });
}

async function rewrite(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const output = Output.to(options.output as string | undefined, io);
  const layout = options.layout as Layout;
  let errors = 0;
  const report = (diagnostic: Parameters<typeof formatDiagnostic>[0]) => {
    if (diagnostic.severity === 'error') errors++;
    io.stderr.write(formatDiagnostic(diagnostic) + '\n');
  };
  try {
    for await (const tree of readTreesOf(inputs, bracketedReadOptions(options), report, io)) {
      await output.write(writeTree(tree, { layout }));
    }
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  if (failures.length > 0) return { code: ExitCode.UsageOrIO, messages: failures };
  return { code: errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
