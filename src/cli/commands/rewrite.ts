import { Option, type Command } from 'commander';
import type { Layout } from '../../formats/bracketed/write-bracketed.js';
import { resolveTraces } from '../../traces/resolve-traces.js';
import { TreeSink, treeOutputFormat } from '../tree-output.js';
import { addBracketedReadOptions, addTreeFormatOption, bracketedReadOptions } from '../bracketed-options.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import type { InputFormat } from '../input-format.js';
import { readTreesOf } from '../read-trees.js';
import { addListingOptions, closingLine, listingOf, ProblemPrinter } from '../print-problems.js';

export function registerRewrite(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('rewrite')
    .description('read constituency trees (bracketed or XML graphs) and write them again, in a chosen layout or the other format; problems go to standard error')
    .argument('<files...>', 'input files, or - for standard input')
    .addOption(new Option('--layout <layout>', 'line: one tree per line; indented: one bracket per line where it does not fit').choices(['line', 'indented']).default('line'))
    .addOption(new Option('--to <format>', 'output format (default: by the output file\'s extension, .xml is the XML graph encoding; else bracketed)').choices(['bracketed', 'xml']))
    .addOption(new Option('--traces <mode>', 'keep: traces stay empty elements; resolve: antecedents of *T* *ICH* *EXP* *RNR* become discontinuous children where their traces stood').choices(['keep', 'resolve']).default('keep'))
    .option('-o, --output <file>', 'write the trees to a file (default: standard output)');
  addTreeFormatOption(command);
  addListingOptions(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>) => {
    done(await rewrite(files, options, io));
  });
}

async function rewrite(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'rewrite', ['bracketed', 'xml'], options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const layout = options.layout as Layout;
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  const sink = new TreeSink(output, treeOutputFormat(options.to, options.output), layout, report);
  let read = 0;
  let written = 0;
  let moved = 0;
  let leftover = 0;
  try {
    for await (const tree of readTreesOf(inputs, bracketedReadOptions(options), report, io)) {
      read++;
      let resolved = tree;
      if (options.traces === 'resolve') {
        const resolution = resolveTraces(tree);
        moved += resolution.moved;
        leftover += resolution.leftover;
        resolved = resolution.tree;
      }
      if (await sink.write(resolved)) written++;
    }
    await sink.finish();
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  const notes = [
    options.traces === 'resolve' ? `${moved} antecedent${moved === 1 ? '' : 's'} moved to their traces` : '',
    leftover > 0 ? `${leftover} further trace${leftover === 1 ? '' : 's'} of an antecedent that had moved already left as empty element${leftover === 1 ? '' : 's'}` : '',
    sink.tracesInserted > 0 ? `${sink.tracesInserted} *ICH* trace${sink.tracesInserted === 1 ? '' : 's'} put in for discontinuous phrases` : '',
  ].filter(Boolean);
  problems.printSummary();
  io.stderr.write(closingLine(read, 'tree', [[written, 'written'], [read - written, 'skipped']], notes, problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
