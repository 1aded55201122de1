import { basename } from 'node:path';
import type { Command } from 'commander';
import { reportSecondaryEdges } from '../tree-output.js';
import { convertTree } from '../../convert/convert-tree.js';
import { carryComment } from '../../convert/carry-wordless-trees.js';
import type { Tree } from '../../model/constituency.js';
import type { DependencySentence } from '../../model/dependency.js';
import { reportWordlessTree } from '../../convert/report-wordless-tree.js';
import { unwritableSentenceReason, writeSentence } from '../../formats/conllu/write-conllu.js';
import { diagnoseItem, itemName } from '../../diagnostics/diagnostic.js';
import { addBracketedReadOptions, addTreeFormatOption, bracketedReadOptions } from '../bracketed-options.js';
import { addConversionOptions, conversionSettings } from '../conversion-options.js';
import { addListingOptions, closingLine, listingOf, ProblemPrinter } from '../print-problems.js';
import { ExitCode, type CommandResult } from '../exit-codes.js';
import { checkInputs, openInputs, Output, type CliIO } from '../io.js';
import type { InputFormat } from '../input-format.js';
import { readTreesOf } from '../read-trees.js';

export function registerToDeps(program: Command, io: CliIO, done: (result: CommandResult) => void): void {
  const command = program
    .command('to-deps')
    .description('convert constituency trees (bracketed, or XML graphs with discontinuous phrases) to dependency trees in CoNLL-U')
    .argument('<files...>', 'bracketed or XML graph files, or - for standard input')
    .option('-o, --output <file>', 'write the CoNLL-U to a file (default: standard output)');
  addConversionOptions(command);
  addTreeFormatOption(command);
  addListingOptions(command);
  addBracketedReadOptions(command).action(async (files: string[], options: Record<string, unknown>) => done(await toDeps(files, options, io)));
}

async function toDeps(files: string[], options: Record<string, unknown>, io: CliIO): Promise<CommandResult> {
  const settings = conversionSettings(options);
  if ('problems' in settings) return { code: ExitCode.UsageOrIO, messages: settings.problems };
  const { inputs, failures } = await openInputs(files, io);
  const wrong = checkInputs(inputs, failures, 'to-deps', ['bracketed', 'xml'], options.from as InputFormat | undefined, [options.output as string | undefined], io);
  if (wrong.length > 0) return { code: ExitCode.UsageOrIO, messages: wrong };
  const output = Output.to(options.output as string | undefined, io, (message) => io.stderr.write(`treebridge: ${message}\n`));
  const problems = new ProblemPrinter(io, listingOf(options));
  const report = problems.report;
  let read = 0;
  let converted = 0;
  let skipped = 0;
  let carried = 0;
  let treeInFile = 0;
  // Lossless mode holds back one sentence, so that trees without words at the very end can ride on it.
  let held: DependencySentence | undefined;
  let wordless: Tree[] = [];
  const skip = (tree: Tree) => {
    skipped++;
    reportWordlessTree(tree, report);
  };
  try {
    const trees = readTreesOf(inputs, bracketedReadOptions(options), report, io, () => (treeInFile = 0));
    for await (const tree of trees) {
      read++;
      treeInFile++;
      const file = tree.file ?? '-';
      const id = tree.id ?? `${basename(file)}-${treeInFile}`;
      if (tree.secondaryEdges && tree.secondaryEdges.length > 0) reportSecondaryEdges(tree, 'dependency tree', report);
      const conversion = convertTree(tree, settings, id, `${basename(file)}#${treeInFile}`);
      if (!conversion) {
        if (settings.lossless) wordless.push(tree);
        else skip(tree);
        continue;
      }
      const unwritable = unwritableSentenceReason(conversion.sentence);
      if (unwritable) {
        skipped++;
        report(diagnoseItem('unwritable-tree', `tree ${itemName(tree)} cannot be written as CoNLL-U: ${unwritable}`, tree));
        continue;
      }
      converted++;
      if (!settings.lossless) {
        await output.write(writeSentence(conversion.sentence));
        continue;
      }
      if (held) await output.write(writeSentence(held));
      held = conversion.sentence;
      held.comments.push(...wordless.map((t) => carryComment(t, 'before')));
      carried += wordless.length;
      wordless = [];
    }
    if (held) {
      held.comments.push(...wordless.map((t) => carryComment(t, 'after')));
      carried += wordless.length;
      await output.write(writeSentence(held));
    } else wordless.forEach(skip);
    await output.commit();
  } catch (error) {
    await output.abandon();
    throw error;
  }
  problems.printSummary();
  const outcomes: Array<[number, string]> = [[converted, 'converted']];
  if (carried > 0) outcomes.push([carried, 'without words carried in comments']);
  outcomes.push([skipped, 'skipped']);
  io.stderr.write(closingLine(read, 'tree', outcomes, [], problems));
  return { code: problems.errors > 0 ? ExitCode.Findings : ExitCode.Ok };
}
