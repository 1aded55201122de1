import { Option, type Command } from 'commander';
import { emptyConversionTally } from '../../api/convert.js';
import { convertedText } from '../converted-text.js';
import { addBracketedReadOptions, addTreeFormatOption } from '../bracketed-options.js';
import { addConversionOptions, resolveConversion } from '../conversion-options.js';
import { addListingOptions, closingLine, listingOf, ProblemPrinter } from '../print-problems.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import type { InputFormat } from '../input-format.js';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { wholeNumber } from '../whole-number.js';

export function registerToDeps(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('to-deps')
    .description('convert constituency trees (bracketed, or XML graphs with discontinuous phrases) to dependency trees in CoNLL-U')
    .argument('<files...>', 'bracketed or XML graph files, or - for standard input')
    .option('-o, --output <file>', 'write the CoNLL-U to a file (default: standard output)')
    .option('--id-prefix <prefix>', 'sent_id of a tree without identifier: this prefix and its number (default: the file name and "-")')
    .addOption(new Option('--first-number <n>', 'the number of the first tree of each input, for pieces of a split corpus').default(1).argParser(wholeNumber(0)));
  addConversionOptions(command);
  addJobsOption(command);
  addTreeFormatOption(command);
  addListingOptions(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>) => done(await toDeps(files, options, io)));
}

/** Reads the inputs, converts them with the library's convertTrees, writes CoNLL-U, and closes with the counts. */
async function toDeps(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const resolved = resolveConversion(options);
  if ('problems' in resolved) return { code: ExitCode.UsageOrIO, messages: resolved.problems };
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'to-deps', ['bracketed', 'xml'], options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const problems = new ProblemPrinter(io, listingOf(options));
  const tally = emptyConversionTally();
  try {
    const naming = { idPrefix: options.idPrefix as string | undefined, firstNumber: options.firstNumber as number };
    for await (const text of convertedText(inputs, options, resolved, naming, jobsOf(options), problems.report, tally, io)) await output.write(text);
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  problems.printSummary();
  const outcomes: Array<[number, string]> = [[tally.converted, 'converted']];
  if (tally.carried > 0) outcomes.push([tally.carried, 'without words carried in comments']);
  outcomes.push([tally.skipped, 'skipped']);
  io.stderr.write(closingLine(tally.read, 'tree', outcomes, [], problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
