import { shippedTables } from '../../tables/table-source.js';
import { Option, type Command } from 'commander';
import { diagnoseItem, itemName } from '../../diagnostics/diagnostic.js';
import { treeHeads } from '../../analysis/heads.js';
import type { Layout } from '../../formats/bracketed/write-bracketed.js';
import { countDiscontinuousPhrases } from '../../model/terminal-order.js';
import { TreeSink, treeOutputFormat } from '../tree-output.js';
import { buildBrackets, type BracketSettings } from '../../reverse/build-brackets.js';
import { decodeBrackets, decodeCarriedTrees, isBrokenCarry } from '../../lossless/decode-brackets.js';
import { loadCategoryTable } from '../../tables/load-category-table.js';
import { TableError } from '../../tables/load-table.js';
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
  command.action(async (files: string[], options: Record<string, unknown>) => done(await toBrackets(files, options, io)));
}

async function toBrackets(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  let settings: BracketSettings;
  try {
    settings = {
      categories: loadCategoryTable(options.categories as string),
      shape: options.shape as BracketSettings['shape'],
      pos: options.pos as BracketSettings['pos'],
      discontinuous: treeOutputFormat(options.to, options.output) === 'xml',
    };
  } catch (error) {
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
  let read = 0;
  let discontinuous = 0;
  let written = 0;
  let lifted = 0;
  let liftedSentences = 0;
  let restored = 0;
  try {
    for await (const sentence of readSentencesOf(inputs, report, io)) {
      read++;
      const decoded = options.lossless === true ? decodeBrackets(sentence) : undefined;
      if (isBrokenCarry(decoded)) {
        report(diagnoseItem('carried-brackets-broken', `sentence ${itemName(sentence, read)}: ${decoded.problem}; skipped`, sentence));
        continue;
      }
      const carried = decoded;
      const result = carried ? { tree: carried, lifts: [] } : buildBrackets(sentence, settings);
      if (!result) {
        const checked = treeHeads(sentence);
        const why = 'problem' in checked ? checked.problem : 'the heads do not form a tree';
        report(diagnoseItem('not-a-tree', `sentence ${itemName(sentence, read)}: ${why}; skipped`, sentence));
        continue;
      }
      if (settings.discontinuous) discontinuous += countDiscontinuousPhrases(result.tree);
      if (result.lifts.length > 0) {
        lifted += result.lifts.length;
        liftedSentences++;
        if (options.lifts === true) {
          const arcs = result.lifts.map((l) => `${l.dependent}: ${l.from}→${l.to}`).join(', ');
          io.stderr.write(`${itemName(sentence, read)}: lifted ${arcs}\n`);
        }
      }
      const before = carried ? decodeCarriedTrees(sentence, 'before') : [];
      const after = carried ? decodeCarriedTrees(sentence, 'after') : [];
      restored += before.length + after.length;
      for (const tree of before) await sink.write(tree);
      if (await sink.write(result.tree)) written++;
      for (const tree of after) await sink.write(tree);
    }
    await sink.finish();
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  const shape = settings.discontinuous ? plural(discontinuous, 'discontinuous phrase') : `${plural(lifted, 'arc')} lifted in ${plural(liftedSentences, 'sentence')}`;
  problems.printSummary();
  const notes = [shape, restored > 0 ? `${plural(restored, 'tree')} without words restored from comments` : ''];
  io.stderr.write(closingLine(read, 'sentence', [[written, 'written'], [read - written, 'skipped']], notes, problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
