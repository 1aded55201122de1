import { Option, type Command } from 'commander';
import { emptyBracketTally, resolveBracketOptions, toBrackets as toBracketsOf, type BracketOptions, type BracketTally } from '../../api/brackets.js';
import { addJobsOption, jobsOf } from '../jobs-option.js';
import { sentenceEvents } from '../sentence-events.js';
import { OptionsError } from '../../api/options.js';
import { itemName } from '../../diagnostics/diagnostic.js';
import type { Layout } from '../../formats/bracketed/write-bracketed.js';
import { TableError } from '../../tables/load-table.js';
import { shippedTables } from '../../tables/table-source.js';
import { TreeSink, treeOutputFormat } from '../tree-output.js';
import { addListingOptions, closingLine, listingOf, plural, ProblemPrinter, tableErrorLines } from '../print-problems.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import type { InputFormat } from '../input-format.js';
import { readSentencesOf } from '../read-trees.js';

export function registerToBrackets(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('to-brackets')
    .description('rebuild constituency trees from dependency trees in CoNLL-U: as bracketings, where arcs that cannot be projective are lifted and marked with *ICH* traces, or as XML graphs, where non-projective subtrees become discontinuous phrases')
    .argument('<files...>', 'CoNLL-U files, or - for standard input')
    .addOption(new Option('--from <format>', 'input format: CoNLL-U, the only one this command reads (for files with other names)').choices(['conllu']))
    .option('--categories <table>', `category table: a shipped one (${shippedTables('categories').join(', ')}) or a path`, 'ud')
    .addOption(new Option('--shape <shape>', 'flat: one phrase per head; layered: one phrase level per dependent, nearest first').choices(['flat', 'layered']).default('flat'))
    .addOption(new Option('--pos <column>', 'the column that gives the part-of-speech brackets').choices(['upos', 'xpos']).default('upos'))
    .addOption(new Option('--layout <layout>', 'line: one tree per line; indented').choices(['line', 'indented']).default('line'))
    .addOption(new Option('--to <format>', 'bracketed, or xml: the XML graph encoding, nothing lifted (default: by the output file\'s extension, .xml; else bracketed)').choices(['bracketed', 'xml']))
    .option('--lifts', 'report each sentence with lifted arcs on standard error')
    .option('--lossless', 'rebuild the bracketing carried by to-deps --lossless exactly, where a sentence carries one')
    .option('-o, --output <file>', 'write the bracketed trees to a file (default: standard output)');
  addListingOptions(command);
  addJobsOption(command);
  command.action(async (files: string[], options: Record<string, unknown>) => done(await toBrackets(files, options, io)));
}

async function toBrackets(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const bracketOptions: BracketOptions = {
    categories: options.categories as string,
    shape: options.shape as 'flat' | 'layered',
    pos: options.pos as 'upos' | 'xpos',
    discontinuous: treeOutputFormat(options.to, options.output) === 'xml',
    lossless: options.lossless === true,
  };
  let settings;
  try {
    settings = resolveBracketOptions(bracketOptions);
  } catch (error) {
    if (error instanceof OptionsError) return { code: ExitCode.UsageOrIO, messages: error.problems };
    if (!(error instanceof TableError)) throw error;
    return { code: ExitCode.UsageOrIO, messages: tableErrorLines(error) };
  }
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'to-brackets', ['conllu'], options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  const sink = new TreeSink(output, treeOutputFormat(options.to, options.output), options.layout as Layout, report);
  const tally = emptyBracketTally();
  let written = 0;
  try {
    if (!bracketOptions.discontinuous) {
      // Bracketings: sentences rebuilt and written on worker threads, in input order.
      const work = { kind: 'brackets' as const, categories: options.categories as string, shape: bracketOptions.shape!, pos: bracketOptions.pos!, lossless: bracketOptions.lossless!, layout: options.layout as Layout };
      for await (const event of sentenceEvents(inputs, work, jobsOf(options), io)) {
        if (event.kind === 'problem') {
          report(event.diagnostic);
          continue;
        }
        const result = event.result;
        const at = result.liftsAt ?? result.problems.length;
        for (const diagnostic of result.problems.slice(0, at)) report(diagnostic);
        if (result.lifts && options.lifts === true) io.stderr.write(`${result.name}: lifted ${result.lifts}\n`);
        for (const diagnostic of result.problems.slice(at)) report(diagnostic);
        if (result.text) await sink.writeText(result.text);
        written += result.written ?? 0;
        for (const key of Object.keys(tally) as Array<keyof BracketTally>) tally[key] += result.tally?.[key] ?? 0;
      }
    }
    // XML graphs number their sentences as they are written: on one thread.
    if (bracketOptions.discontinuous) for await (const rebuilt of toBracketsOf(readSentencesOf(inputs, report, io), { ...bracketOptions, categories: settings.categories }, report, tally)) {
      if (rebuilt.sentence && rebuilt.lifts.length > 0 && options.lifts === true) {
        const arcs = rebuilt.lifts.map((l) => `${l.dependent}: ${l.from}→${l.to}`).join(', ');
        io.stderr.write(`${itemName(rebuilt.sentence, tally.read)}: lifted ${arcs}\n`);
      }
      if ((await sink.write(rebuilt.tree)) && rebuilt.sentence) written++;
    }
    await sink.finish();
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  const shape = bracketOptions.discontinuous ? plural(tally.discontinuousPhrases, 'discontinuous phrase') : `${plural(tally.lifted, 'arc')} lifted in ${plural(tally.liftedSentences, 'sentence')}`;
  problems.printSummary();
  const notes = [shape, tally.restored > 0 ? `${plural(tally.restored, 'tree')} without words restored from comments` : ''];
  io.stderr.write(closingLine(tally.read, 'sentence', [[written, 'written'], [tally.read - written, 'skipped']], notes, problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
